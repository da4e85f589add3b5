import { describe, expect, it } from 'vitest';
import { sproulGreenDensityPerCm3 } from '../../../src/physics/intrinsic/sproul-green-1991.js';

describe('Sproul–Green 1991 n_i(T) for silicon', () => {
  // Source: A. B. Sproul, M. A. Green, J. Appl. Phys. 70, 846 (1991): n_i(300 K) = 1.00e10 cm⁻³
  // (value from memory). Tolerance 2 %: the widely quoted fit rounds its two constants.
  it('gives about 1.00e10 cm⁻³ at 300 K (Sproul & Green 1991, value from memory)', () => {
    expect(sproulGreenDensityPerCm3(300)).toBeWithinRelative(1.0e10, 0.02);
  });
  // Cross-check against an independent measurement over the overlap 275–340 K: Misiakos &
  // Tsamakis 1993 (fit 5.29e19·(T/300)^2.54·exp(−6726/T)). Tolerance 6 %: the two papers
  // differ by about 4 % at 300 K (1.00e10 vs 9.7e9) from their band-gap-narrowing assumptions.
  it('agrees with Misiakos–Tsamakis 1993 within 6 % over 275–340 K', () => {
    for (let t = 275; t <= 340; t += 5) {
      const mt = 5.29e19 * Math.pow(t / 300, 2.54) * Math.exp(-6726 / t);
      expect(sproulGreenDensityPerCm3(t)).toBeWithinRelative(mt, 0.06);
    }
  });
});
