/**
 * Outlier sites by Tukey's fences: J. W. Tukey, Exploratory Data Analysis (Addison-Wesley, 1977),
 * ch. 2: a value below Q1 − k·IQR or above Q3 + k·IQR is an outlier, IQR = Q3 − Q1, k = 1.5
 * ("outside"; k = 3 "far out"). Quartiles by Hyndman & Fan definition 7
 * (quantiles-hyndman-fan-1996.ts; Tukey's own hinges differ slightly for small n).
 *
 * Validity: a screening rule, not a test with a stated false-alarm rate; with fewer than 5 sites
 * no site is called an outlier. It assumes nothing about normality, which suits wafer maps whose
 * edge sites skew the distribution.
 */
import { quantileSorted } from './quantiles-hyndman-fan-1996.js';

export const TUKEY_FENCE_FACTOR = 1.5;
export const TUKEY_MINIMUM_COUNT = 5;
export const TUKEY_CITATION = 'J. W. Tukey, Exploratory Data Analysis (Addison-Wesley, 1977), ch. 2 (fences at Q1 − 1.5·IQR and Q3 + 1.5·IQR)';

export interface TukeyFences {
  readonly q1: number;
  readonly q3: number;
  readonly lower: number;
  readonly upper: number;
  /** Indexes (into the input) of the values outside the fences, ascending. */
  readonly outliers: readonly number[];
}

/** Fences of values[i] for every included, non-NaN i; outliers are indexes into values. */
export function tukeyFences(values: Float64Array, include?: Uint8Array, k = TUKEY_FENCE_FACTOR): TukeyFences {
  const kept: number[] = [];
  for (let i = 0; i < values.length; i++) if ((!include || include[i]) && !Number.isNaN(values[i]!)) kept.push(values[i]!);
  const sorted = Float64Array.from(kept).sort();
  const q1 = quantileSorted(sorted, 0.25);
  const q3 = quantileSorted(sorted, 0.75);
  const iqr = q3 - q1;
  const lower = q1 - k * iqr;
  const upper = q3 + k * iqr;
  const outliers: number[] = [];
  if (sorted.length >= TUKEY_MINIMUM_COUNT) {
    for (let i = 0; i < values.length; i++) {
      const v = values[i]!;
      if ((include && !include[i]) || Number.isNaN(v)) continue;
      if (v < lower || v > upper) outliers.push(i);
    }
  }
  return { q1, q3, lower, upper, outliers };
}
