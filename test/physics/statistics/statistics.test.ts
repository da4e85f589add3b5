/**
 * Wafer-map and trend statistics against values computed outside the project.
 *
 * - NIST Statistical Reference Datasets (StRD), univariate summary statistics, NumAcc1–NumAcc4
 *   (certified mean and standard deviation). The data are defined by a pattern (from memory,
 *   and the certified values follow from it by arithmetic): NumAcc1 = 10000001, 10000003,
 *   10000002 (mean 10000002, s = 1); NumAcc2–4 = x0, then 500 pairs (x0 − 0.1, x0 + 0.1) with
 *   x0 = 1.2, 1000000.2, 10000000.2 (mean x0, s = 0.1). They test the loss of precision of a
 *   one-pass variance; tolerance 1e-9 relative on the mean and 1e-6 relative on s for NumAcc4
 *   (NIST asks for the certified digits; 0.1 at 1e7 holds ~9 digits in doubles).
 * - Hyndman & Fan (1996) definition 7: quantile(1..10, 0.25) = 3.25 and 0.75 → 7.75 (follows from
 *   the definition; also R's and NumPy's default, from memory).
 * - Tukey (1977) fences, Montgomery (2009) individuals chart and the Western Electric rules on
 *   sequences whose answers follow from the definitions by hand arithmetic (stated beside each).
 */
import { describe, expect, it } from 'vitest';
import { quantileSorted } from '../../../src/physics/statistics/quantiles-hyndman-fan-1996.js';
import { individualsLimits } from '../../../src/physics/statistics/shewhart-individuals.js';
import { tukeyFences } from '../../../src/physics/statistics/tukey-fences-1977.js';
import { uniformityStatistics } from '../../../src/physics/statistics/uniformity.js';
import { westernElectricBreaks } from '../../../src/physics/statistics/western-electric-1956.js';

function numAcc(x0: number): Float64Array {
  const out = [x0];
  for (let i = 0; i < 500; i++) out.push(x0 - 0.1, x0 + 0.1);
  return Float64Array.from(out);
}

describe('uniformity statistics (NIST StRD NumAcc)', () => {
  it('NumAcc1: mean 10000002, s = 1', () => {
    const s = uniformityStatistics(Float64Array.from([10000001, 10000003, 10000002]));
    expect(s.mean).toBe(10000002);
    expect(s.standardDeviation).toBeCloseTo(1, 12);
    expect(s.count).toBe(3);
    expect(s.minimum).toBe(10000001);
    expect(s.maximum).toBe(10000003);
  });
  for (const x0 of [1.2, 1000000.2, 10000000.2]) {
    it(`NumAcc x0 = ${x0}: mean x0, s = 0.1 (1001 values)`, () => {
      const s = uniformityStatistics(numAcc(x0));
      expect(s.count).toBe(1001);
      expect(Math.abs(s.mean / x0 - 1)).toBeLessThan(1e-9);
      expect(Math.abs(s.standardDeviation / 0.1 - 1)).toBeLessThan(1e-6);
    });
  }
  it('non-uniformity: 1σ/mean and (max − min)/(2·mean), by hand for 9, 10, 11', () => {
    // mean 10, s = 1 → 10 %; (11 − 9)/(2·10) → 10 %
    const s = uniformityStatistics(Float64Array.from([9, 10, 11]));
    expect(s.nonUniformityPercent).toBeCloseTo(10, 12);
    expect(s.rangeNonUniformityPercent).toBeCloseTo(10, 12);
  });
  it('skips excluded and NaN sites', () => {
    const s = uniformityStatistics(Float64Array.from([9, 1000, 10, Number.NaN, 11]), Uint8Array.from([1, 0, 1, 1, 1]));
    expect(s.count).toBe(3);
    expect(s.mean).toBe(10);
  });
  it('one site: no standard deviation, and says so with NaN rather than 0', () => {
    expect(uniformityStatistics(Float64Array.from([5])).standardDeviation).toBeNaN();
  });
});

describe('quantiles (Hyndman & Fan 1996, definition 7)', () => {
  const oneToTen = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  it('1..10: Q(0.25) = 3.25, Q(0.5) = 5.5, Q(0.75) = 7.75', () => {
    expect(quantileSorted(oneToTen, 0.25)).toBeCloseTo(3.25, 12);
    expect(quantileSorted(oneToTen, 0.5)).toBeCloseTo(5.5, 12);
    expect(quantileSorted(oneToTen, 0.75)).toBeCloseTo(7.75, 12);
    expect(quantileSorted(oneToTen, 0)).toBe(1);
    expect(quantileSorted(oneToTen, 1)).toBe(10);
  });
});

describe('Tukey fences (1977)', () => {
  it('1..10 and 30: Q1 3.5, Q3 8.5, fences −4 and 16 → 30 is the outlier (by hand)', () => {
    const v = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 30]);
    const f = tukeyFences(v);
    expect(f.q1).toBeCloseTo(3.5, 12);
    expect(f.q3).toBeCloseTo(8.5, 12);
    expect(f.lower).toBeCloseTo(-4, 12);
    expect(f.upper).toBeCloseTo(16, 12);
    expect(f.outliers).toEqual([10]);
  });
  it('fewer than five sites: no outliers called', () => {
    expect(tukeyFences(Float64Array.from([1, 1, 1, 100])).outliers).toEqual([]);
  });
});

describe('individuals chart (Montgomery 2009 §6.4)', () => {
  it('alternating 10, 12: centre 11, MR̄ 2, σ̂ = 2/1.128, limits 11 ± 3·σ̂', () => {
    const l = individualsLimits([10, 12, 10, 12, 10, 12])!;
    expect(l.centre).toBeCloseTo(11, 12);
    expect(l.averageMovingRange).toBeCloseTo(2, 12);
    expect(l.sigma).toBeCloseTo(2 / 1.128, 12);
    expect(l.upper).toBeCloseTo(11 + (3 * 2) / 1.128, 12);
    expect(l.lower).toBeCloseTo(11 - (3 * 2) / 1.128, 12);
  });
  it('one value has no limits', () => {
    expect(individualsLimits([3])).toBeUndefined();
  });
});

describe('Western Electric rules (1956)', () => {
  const rules = (v: number[]) => westernElectricBreaks(v, 0, 1).map((b) => `${b.rule}@${b.index}${b.side > 0 ? '+' : '-'}`);
  it('rule 1: a point beyond 3σ', () => {
    expect(rules([0.5, -0.5, 3.2, 0])).toEqual(['1@2+']);
  });
  it('rule 2: two of three beyond 2σ on one side, marked at the second', () => {
    expect(rules([2.5, 0, 2.2, 0.1])).toEqual(['2@2+']);
    // on opposite sides: no break
    expect(rules([2.5, 0, -2.2])).toEqual([]);
  });
  it('rule 3: four of five beyond 1σ on one side', () => {
    expect(rules([-1.5, -1.2, 0.3, -1.1, -1.4])).toEqual(['3@4-']);
  });
  it('rule 4: eight in a row on one side', () => {
    expect(rules([0.2, 0.3, 0.1, 0.4, 0.2, 0.3, 0.1, 0.2, -0.1])).toEqual(['4@7+']);
  });
  it('a centred, in-control sequence breaks nothing', () => {
    expect(rules([0.5, -0.5, 0.9, -0.2, 0.3, -0.8, 0.1, -0.4, 0.6, -0.6])).toEqual([]);
  });
});
