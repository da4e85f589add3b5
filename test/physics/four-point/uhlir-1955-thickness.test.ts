import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  thicknessCorrectionFactor,
  thicknessCorrectionFactorClosedForm,
  thicknessFactorBesselSeries,
  thicknessFactorImageSeries,
} from '../../../src/physics/four-point/uhlir-1955-thickness.js';

describe('thickness correction F(t/s), insulating bottom (Uhlir 1955 images)', () => {
  // Limits (Uhlir 1955; Valdes, Proc. IRE 42, 420 (1954)): F → 1 for a thin sheet, and
  // F·(t/s) → 2·ln2 for a thick slab, i.e. ρ → 2πs·V/I. Tight tolerances: limits of the formula.
  it('tends to 1 as t/s → 0 (thin sheet)', () => {
    expect(thicknessCorrectionFactor(0)).toBe(1);
    expect(thicknessCorrectionFactor(1e-6)).toBeWithinRelative(1, 1e-12);
    expect(thicknessCorrectionFactor(0.1)).toBeWithinRelative(1, 1e-9);
  });
  it('F·(t/s) tends to 2·ln2 as t/s → ∞, so ρ → 2πs·V/I (Valdes 1954)', () => {
    expect(thicknessCorrectionFactor(1000) * 1000).toBeWithinRelative(2 * Math.LN2, 1e-5);
    expect(thicknessCorrectionFactor(1e8) * 1e8).toBeWithinRelative(2 * Math.LN2, 1e-9);
  });
  // Source: F. M. Smits, Bell Syst. Tech. J. 37, 711 (1958), table of the thickness factor for a
  // non-conducting bottom (values from memory, four decimals). Tolerance 2e-4 absolute
  // (≈ 3e-4 relative): the table's last digit, which may be truncated rather than rounded.
  it('reproduces the tabulated factor for a non-conducting bottom (Smits 1958, values from memory)', () => {
    const table: Array<[number, number]> = [
      [0.4, 0.9995],
      [0.5, 0.9974],
      [0.5555, 0.9948],
      [0.625, 0.9898],
      [0.7143, 0.9798],
      [0.8333, 0.96],
      [1.0, 0.9214],
      [1.111, 0.8907],
      [1.25, 0.849],
      [1.4286, 0.7938],
      [1.6666, 0.7225],
      [2.0, 0.6336],
    ];
    for (const [ts, f] of table) expect(Math.abs(thicknessCorrectionFactor(ts) - f)).toBeLessThan(2e-4);
  });
  // Identity: the Bessel (K0) series and the image series are the same potential summed two
  // ways (Poisson summation). Agreement to 1e-6 checks both evaluations (A&S 9.8.6 is good to
  // 1.9e-7 relative in K0).
  it('Bessel-series and image-series evaluations agree where both apply, 0.3 ≤ t/s ≤ 1.5', () => {
    for (let ts = 0.3; ts <= 1.5; ts += 0.05) {
      expect(thicknessFactorBesselSeries(ts)).toBeWithinRelative(thicknessFactorImageSeries(ts, 20000), 1e-6);
    }
  });
  // Finding: the closed form ln2/ln(sinh(t/s)/sinh(t/2s)) quoted in docs/references.md has the right
  // limits but not the image solution in between (0.852 vs 0.921 at t/s = 1).
  it('closed form ln2/ln(sinh(t/s)/sinh(t/2s)) shares the limits but departs in between', () => {
    expect(thicknessCorrectionFactorClosedForm(1e-4)).toBeWithinRelative(1, 1e-4);
    expect(thicknessCorrectionFactorClosedForm(1e4) * 1e4).toBeWithinRelative(2 * Math.LN2, 1e-3);
    expect(thicknessCorrectionFactorClosedForm(1)).toBeWithinRelative(Math.LN2 / Math.log(Math.sinh(1) / Math.sinh(0.5)), 1e-12);
    expect(thicknessCorrectionFactor(1) - thicknessCorrectionFactorClosedForm(1)).toBeGreaterThan(0.05);
  });
  it('is finite, in (0, 1], and decreasing in t/s (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -6, max: 6, noNaN: true }), fc.double({ min: 1e-3, max: 1, noNaN: true }), (u, du) => {
        const a = thicknessCorrectionFactor(Math.pow(10, u));
        const b = thicknessCorrectionFactor(Math.pow(10, u + du));
        return Number.isFinite(a) && a > 0 && a <= 1 && b <= a;
      }),
    );
  });
  it('returns NaN for a negative or NaN ratio (kernel; the public API refuses first)', () => {
    expect(Number.isNaN(thicknessCorrectionFactor(-1))).toBe(true);
    expect(Number.isNaN(thicknessCorrectionFactor(Number.NaN))).toBe(true);
  });
});
