/**
 * Spread across sites and wafers. The definitions are the spec file's (range over mean, range
 * over minimum); the checks here are arithmetic identities and properties (fast-check).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { latestPerPlace, spreadOf, waferSummaries, waferToWaferSpread } from '../../src/lots/spread.js';

const values = fc.array(fc.double({ min: 1e-3, max: 1e5, noNaN: true }), { minLength: 2, maxLength: 60 });

describe('spread', () => {
  it('range over mean and over minimum, worked by hand: 9.0, 9.3, 9.9 Ω·cm', () => {
    const s = spreadOf([9.0, 9.3, 9.9], 'range-over-mean')!;
    expect(s.spreadPercent).toBeWithinRelative((0.9 / 9.4) * 100, 1e-12);
    expect(spreadOf([9.0, 9.3, 9.9], 'range-over-min')!.spreadPercent).toBeWithinRelative(10, 1e-12);
    expect(spreadOf([9.0], 'range-over-mean')).toBeUndefined();
  });

  it('is never negative, is zero for equal values, and does not depend on the unit (scale)', () => {
    fc.assert(
      fc.property(values, fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (vs, k) => {
        const s = spreadOf(vs, 'range-over-mean')!;
        expect(s.spreadPercent).toBeGreaterThanOrEqual(0);
        const scaled = spreadOf(vs.map((v) => v * k), 'range-over-mean')!;
        expect(Math.abs(scaled.spreadPercent - s.spreadPercent)).toBeLessThanOrEqual(1e-9 * Math.max(1, s.spreadPercent));
        // The minimum is at most the mean, so range/min is at least range/mean.
        expect(spreadOf(vs, 'range-over-min')!.spreadPercent).toBeGreaterThanOrEqual(s.spreadPercent * (1 - 1e-12));
      }),
    );
    expect(spreadOf([7, 7, 7], 'range-over-mean')!.spreadPercent).toBe(0);
  });

  it('the latest reading at a place replaces the earlier one; wafer means feed wafer-to-wafer spread', () => {
    const points = [
      { wafer: 1, site: 1, resistivityOhmCm: 9.0, readingId: 1 },
      { wafer: 1, site: 1, resistivityOhmCm: 9.4, readingId: 5 },
      { wafer: 1, site: 2, resistivityOhmCm: 9.6, readingId: 2 },
      { wafer: 2, resistivityOhmCm: 11.0, readingId: 3 },
    ];
    expect(latestPerPlace(points).map((p) => p.readingId)).toEqual([5, 2, 3]);
    const wafers = waferSummaries(points, 'range-over-mean');
    expect(wafers.map((w) => w.meanOhmCm)).toEqual([9.5, 11.0]);
    expect(wafers[0]?.siteSpread?.spreadPercent).toBeWithinRelative((0.2 / 9.5) * 100, 1e-12);
    expect(wafers[1]?.siteSpread).toBeUndefined();
    expect(waferToWaferSpread(wafers, 'range-over-mean')?.spreadPercent).toBeWithinRelative((1.5 / 10.25) * 100, 1e-12);
  });
});
