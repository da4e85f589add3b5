import { describe, expect, it } from 'vitest';
import { integrateAdaptive } from '../../../src/physics/numeric/gauss-kronrod.js';

describe('adaptive Gauss–Kronrod G7–K15', () => {
  // Source: Kronrod (1965); Piessens et al., QUADPACK (1983): the 15-point Kronrod rule is exact
  // for polynomials up to degree 3·7 + 1 = 22, the embedded 7-point Gauss rule up to degree 13.
  // One interval, no subdivision: value exact to 1e-13 through degree 22; the |K15 − G7| error
  // estimate is ~0 through degree 13 and not beyond (which checks the Gauss weights too).
  it('integrates x^d on [0, 1] exactly to degree 22; the Gauss part is exact to degree 13', () => {
    for (let d = 0; d <= 22; d++) {
      const r = integrateAdaptive((x) => Math.pow(x, d), 0, 1, { maxIntervals: 1, relTolerance: 0 });
      expect(Math.abs(r.value * (d + 1) - 1)).toBeLessThan(1e-13);
      if (d <= 13) expect(r.errorEstimate).toBeLessThan(1e-14);
      if (d >= 14) expect(r.errorEstimate).toBeGreaterThan(1e-14);
    }
  });

  it('reaches a requested relative accuracy on smooth and peaked integrands (closed forms)', () => {
    const a = integrateAdaptive((x) => Math.exp(-x), 0, 30, { relTolerance: 1e-10 });
    expect(a.converged).toBe(true);
    expect(a.value).toBeWithinRelative(1 - Math.exp(-30), 1e-10);
    // ∫₀¹ dx/(1e-4 + x²) = 100·atan(100): sharply peaked at 0.
    const b = integrateAdaptive((x) => 1 / (1e-4 + x * x), 0, 1, { relTolerance: 1e-9 });
    expect(b.converged).toBe(true);
    expect(b.value).toBeWithinRelative(100 * Math.atan(100), 1e-9);
  });

  it('reports failure instead of a silent NaN', () => {
    const r = integrateAdaptive(() => Number.NaN, 0, 1);
    expect(r.converged).toBe(false);
    const s = integrateAdaptive((x) => 1 / Math.sqrt(x + 1e-300), 0, 1, { relTolerance: 1e-15, maxIntervals: 5 });
    expect(s.converged).toBe(false);
    expect(Number.isFinite(s.value)).toBe(true);
  });
});
