/**
 * Summary statistics of one quantity over a wafer's sites, and the two non-uniformity figures
 * fabs report (the definitions are common practice, no source; each reply states them):
 *
 *   nonUniformityPercent      = 100 · s / mean        (s: sample standard deviation, n − 1)
 *   rangeNonUniformityPercent = 100 · (max − min) / (2 · mean)
 *
 * Mean and s by two passes (the second pass sums squared deviations from the mean, which keeps
 * full precision for values like 1e16 ± 1e13; Chan, Golub & LeVeque, "Algorithms for computing the
 * sample variance", Am. Stat. 37, 242 (1983), the two-pass algorithm). Values that are NaN or
 * excluded are skipped.
 */

export interface UniformityStatistics {
  readonly count: number;
  readonly mean: number;
  /** Sample standard deviation (n − 1); NaN for one value. */
  readonly standardDeviation: number;
  readonly minimum: number;
  readonly maximum: number;
  /** 100 · s / mean; NaN for fewer than two values or a zero mean. */
  readonly nonUniformityPercent: number;
  /** 100 · (max − min) / (2 · mean). */
  readonly rangeNonUniformityPercent: number;
}

export const NON_UNIFORMITY_DEFINITION = 'non-uniformity = 1σ / mean × 100 % (σ: sample standard deviation, n − 1)';
export const RANGE_NON_UNIFORMITY_DEFINITION = 'range non-uniformity = (max − min) / (2 × mean) × 100 %';

/** Statistics of values[i] for every i with include[i] (all when include is absent), skipping NaN. */
export function uniformityStatistics(values: Float64Array, include?: Uint8Array): UniformityStatistics {
  let count = 0;
  let sum = 0;
  let minimum = Number.POSITIVE_INFINITY;
  let maximum = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if ((include && !include[i]) || Number.isNaN(v)) continue;
    count++;
    sum += v;
    if (v < minimum) minimum = v;
    if (v > maximum) maximum = v;
  }
  if (count === 0) {
    return { count, mean: Number.NaN, standardDeviation: Number.NaN, minimum: Number.NaN, maximum: Number.NaN, nonUniformityPercent: Number.NaN, rangeNonUniformityPercent: Number.NaN };
  }
  const mean = sum / count;
  let squares = 0;
  let deviations = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if ((include && !include[i]) || Number.isNaN(v)) continue;
    const d = v - mean;
    squares += d * d;
    deviations += d;
  }
  // Corrected two-pass: subtracting (Σd)²/n removes the rounding left in the mean.
  const standardDeviation = count > 1 ? Math.sqrt(Math.max(squares - (deviations * deviations) / count, 0) / (count - 1)) : Number.NaN;
  return {
    count,
    mean,
    standardDeviation,
    minimum,
    maximum,
    nonUniformityPercent: count > 1 && mean !== 0 ? (100 * standardDeviation) / Math.abs(mean) : Number.NaN,
    rangeNonUniformityPercent: mean !== 0 ? (100 * (maximum - minimum)) / (2 * Math.abs(mean)) : Number.NaN,
  };
}
