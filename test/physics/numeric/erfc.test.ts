import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { erf, erfc, erfcInverse } from '../../../src/physics/numeric/erfc.js';

/** Independent check: erf by Simpson's rule on (2/√π)·e^(−t²), 20 000 panels (error ~1e-15). */
function erfBySimpson(x: number): number {
  const n = 20000;
  const h = x / n;
  let s = 1 + Math.exp(-x * x);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * Math.exp(-(i * h) * (i * h));
  return ((2 / Math.sqrt(Math.PI)) * s * h) / 3;
}

describe('erf, erfc and the inverse', () => {
  // Source: M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions (1964), Table 7.1:
  // erf(0.5) = 0.5204998778, erf(1) = 0.8427007929, erf(2) = 0.9953222650 (10 digits; values
  // from memory, confirmed by the independent Simpson integral in the next test). Tolerance 1e-9.
  it('matches Abramowitz & Stegun Table 7.1 at 0.5, 1 and 2', () => {
    expect(erf(0.5)).toBeWithinRelative(0.5204998778, 1e-9);
    expect(erf(1)).toBeWithinRelative(0.8427007929, 1e-9);
    expect(erf(2)).toBeWithinRelative(0.995322265, 1e-9);
  });

  // Independent method: Simpson's rule on the defining integral. Tolerance 1e-12 absolute on erf
  // (Simpson's error here is ~1e-15).
  it('agrees with a Simpson integral of the definition over 0–4 (both branches of the code)', () => {
    for (let x = 0.1; x <= 4; x += 0.3) {
      expect(Math.abs(erf(x) - erfBySimpson(x))).toBeLessThan(1e-12);
    }
  });

  // Source: the asymptotic series erfc(x) ≈ e^(−x²)/(x√π)·(1 − 1/(2x²) + 3/(4x⁴) − 15/(8x⁶)) (A&S
  // 7.1.23); at x = 10 the next term is ~1e-7 of the sum. Tolerance 1e-6 relative: checks the
  // continued fraction where 1 − erf would have no digits left.
  it('keeps relative accuracy deep in the tail (x = 6, 10, 20 against A&S 7.1.23)', () => {
    for (const x of [6, 10, 20]) {
      const x2 = x * x;
      const asym = (Math.exp(-x2) / (x * Math.sqrt(Math.PI))) * (1 - 1 / (2 * x2) + 3 / (4 * x2 * x2) - 15 / (8 * x2 * x2 * x2));
      expect(erfc(x)).toBeWithinRelative(asym, x === 6 ? 1e-4 : 1e-6);
    }
  });

  it('is continuous where the method switches (x = 2.5) and symmetric: erfc(−x) = 2 − erfc(x)', () => {
    expect(erfc(2.5 - 1e-12)).toBeWithinRelative(erfc(2.5), 1e-10);
    expect(erfc(-0.7)).toBeWithinRelative(2 - erfc(0.7), 1e-15);
  });

  // Round trips, with tolerances set by conditioning: y = erfc(x) is recovered to 1e-13 down to
  // 1e-20; deeper in the tail d ln y/dx ≈ −2x, so a last-bit error in x shows as ~2x²·1e-16 in y.
  it('erfcInverse inverts erfc: x to 1e-13 over 0–26, y to 1e-13 down to 1e-20 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 26, noNaN: true }), (x) => {
        expect(Math.abs(erfcInverse(erfc(x)) - x)).toBeLessThanOrEqual(1e-13 * Math.max(1, x));
      }),
    );
    fc.assert(
      fc.property(fc.double({ min: -20, max: Math.log10(1.9), noNaN: true }), (u) => {
        const y = Math.pow(10, u);
        expect(erfc(erfcInverse(y))).toBeWithinRelative(y, 1e-13);
      }),
    );
    expect(Number.isNaN(erfcInverse(0))).toBe(true);
    expect(Number.isNaN(erfcInverse(2))).toBe(true);
  });
});
