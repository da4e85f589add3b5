/**
 * van der Pauw's sheet resistance against the published forms: L. J. van der Pauw, Philips Res.
 * Rep. 13, 1 (1958) (docs/references.md).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { VDP_RATIO_WARNING, vanDerPauwSheetResistance } from '../../../src/physics/hall/van-der-pauw-1958.js';

describe('van der Pauw 1958', () => {
  it('R1 = R2 = R gives the closed form Rs = π·R/ln 2 (van der Pauw 1958, eq. for a symmetric sample); to 1e-12, the solver’s tolerance', () => {
    for (const r of [0.012, 1, 12.4, 3.3e4]) {
      const v = vanDerPauwSheetResistance(r, r);
      expect(v.ok && v.value.sheetResistanceOhmPerSq).toBeWithinRelative((Math.PI * r) / Math.LN2, 1e-12);
      expect(v.ok && v.value.correctionFactor).toBeWithinRelative(1, 1e-12);
    }
  });

  it('f(R1/R2) satisfies van der Pauw’s own relation cosh(((r−1)/(r+1))·ln2/f) = ½·exp(ln2/f) — an independent form of the same equation; to 1e-9', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1.0001, max: 1000, noNaN: true }), (r2, ratio) => {
        const v = vanDerPauwSheetResistance(r2 * ratio, r2);
        expect(v.ok).toBe(true);
        if (!v.ok) return;
        const f = v.value.correctionFactor;
        const lhs = Math.cosh(((ratio - 1) / (ratio + 1)) * (Math.LN2 / f));
        const rhs = 0.5 * Math.exp(Math.LN2 / f);
        expect(Math.abs(lhs - rhs) / rhs).toBeLessThan(1e-9);
        expect(f).toBeLessThanOrEqual(1 + 1e-12);
      }),
      { numRuns: 200 },
    );
  });

  it('f(10) ≈ 0.70 as read from van der Pauw’s published curve of f against R1/R2 (from memory; 1 %, the reading accuracy of a printed curve)', () => {
    const v = vanDerPauwSheetResistance(10, 1);
    expect(v.ok && v.value.correctionFactor).toBeWithinRelative(0.70, 0.01);
  });

  it('the order of R1 and R2 does not matter; a large ratio is warned about; zero, negative or non-finite inputs are refused', () => {
    const a = vanDerPauwSheetResistance(10, 1);
    const b = vanDerPauwSheetResistance(1, 10);
    expect(a.ok && b.ok && a.value.sheetResistanceOhmPerSq).toBe(b.ok ? b.value.sheetResistanceOhmPerSq : NaN);
    expect(a.ok && a.value.problems.map((p) => p.code)).toEqual(['contact_asymmetry']);
    const mild = vanDerPauwSheetResistance(VDP_RATIO_WARNING * 0.99, 1);
    expect(mild.ok && mild.value.problems).toEqual([]);
    for (const [r1, r2] of [[0, 1], [-2, 1], [1, Number.NaN], [Number.POSITIVE_INFINITY, 1]]) expect(vanDerPauwSheetResistance(r1!, r2!).ok).toBe(false);
  });
});
