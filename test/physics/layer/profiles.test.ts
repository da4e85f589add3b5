import { describe, expect, it } from 'vitest';
import { ERFC_PROFILE, GAUSSIAN_PROFILE } from '../../../src/physics/layer/profiles.js';

/** Independent erfc: 1 − Simpson integral of (2/√π)·e^(−t²) (20 000 panels), for x ≤ 5. */
function erfcSimpson(x: number): number {
  const n = 20000;
  const h = x / n;
  let s = 1 + Math.exp(-x * x);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * Math.exp(-(i * h) * (i * h));
  return 1 - ((2 / Math.sqrt(Math.PI)) * s * h) / 3;
}

describe('diffusion profiles fixed by Cs, N_B and xj', () => {
  // Definition of the metallurgical junction: N(xj) = N_B. erfc checked with an independent erfc;
  // tolerance 1e-8 relative (Simpson's error ~1e-15 absolute against N_B/Cs ≥ 1e-6).
  it('puts the junction where N(xj) = N_B (erfc, Gaussian)', () => {
    for (const [cs, nb] of [
      [1e20, 1e15],
      [1e18, 1e16],
      [3e16, 1e16],
    ] as const) {
      const xj = 0.8e-4;
      const le = ERFC_PROFILE.lengthCm(cs, nb, xj);
      expect(cs * erfcSimpson(xj / le)).toBeWithinRelative(nb, 1e-8);
      expect(ERFC_PROFILE.densityPerCm3(cs, le, xj)).toBeWithinRelative(nb, 1e-12);
      const lg = GAUSSIAN_PROFILE.lengthCm(cs, nb, xj);
      expect(GAUSSIAN_PROFILE.densityPerCm3(cs, lg, xj)).toBeWithinRelative(nb, 1e-12);
      expect(GAUSSIAN_PROFILE.densityPerCm3(cs, lg, 0)).toBe(cs);
    }
  });

  it('has no junction (NaN length) when Cs ≤ N_B', () => {
    expect(Number.isNaN(ERFC_PROFILE.lengthCm(1e15, 1e15, 1e-4))).toBe(true);
    expect(Number.isNaN(GAUSSIAN_PROFILE.lengthCm(1e14, 1e15, 1e-4))).toBe(true);
  });
});
