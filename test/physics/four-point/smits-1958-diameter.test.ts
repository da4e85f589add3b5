import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diameterCorrectionFactor } from '../../../src/physics/four-point/smits-1958-diameter.js';

describe('diameter correction C(d/s), centred probe on a thin disc (Smits 1958)', () => {
  // Limit: an infinite thin sheet has C = π/ln2 = 4.5324 (Smits 1958). Tight.
  it('tends to π/ln2 ≈ 4.5324 as d/s → ∞', () => {
    expect(diameterCorrectionFactor(Number.POSITIVE_INFINITY)).toBe(Math.PI / Math.LN2);
    expect(diameterCorrectionFactor(1e6)).toBeWithinRelative(Math.PI / Math.LN2, 1e-11);
    expect(Math.PI / Math.LN2).toBeWithinRelative(4.5324, 1e-5);
  });
  // Published formula identity: at d/s = 3, ((d/s)²+3)/((d/s)²−3) = 2, so C = π/(2·ln2). Tight.
  it('at d/s = 3 equals π/(2 ln2) (identity of the Smits formula)', () => {
    expect(diameterCorrectionFactor(3)).toBeWithinRelative(Math.PI / (2 * Math.LN2), 1e-14);
  });
  // Source: NBS Technical Note 199 (Swartzendruber 1964) / Smits 1958 table for circular slices
  // (values from memory, four decimals; docs/references.md says the formula reproduces two values
  // quoted from TN 199, not which). Tolerance 2e-4 relative: a recalled fourth decimal.
  it('matches the tabulated circular-slice factors (NBS TN 199 / Smits 1958, values from memory)', () => {
    const table: Array<[number, number]> = [
      [3, 2.2662],
      [4, 2.9289],
      [5, 3.3625],
      [7.5, 3.9273],
      [10, 4.1716],
      [15, 4.3646],
      [20, 4.4364],
      [40, 4.5076],
    ];
    for (const [ds, c] of table) expect(diameterCorrectionFactor(ds)).toBeWithinRelative(c, 2e-4);
  });
  it('is undefined (NaN) for d/s ≤ √3 and finite, increasing above it (property)', () => {
    expect(Number.isNaN(diameterCorrectionFactor(Math.sqrt(3)))).toBe(true);
    expect(Number.isNaN(diameterCorrectionFactor(1))).toBe(true);
    fc.assert(
      fc.property(fc.double({ min: 1.7321, max: 1e9, noNaN: true }), fc.double({ min: 1.001, max: 2, noNaN: true }), (r, k) => {
        const a = diameterCorrectionFactor(r);
        const b = diameterCorrectionFactor(r * k);
        return Number.isFinite(a) && a > 0 && b >= a && a <= Math.PI / Math.LN2;
      }),
    );
  });
});
