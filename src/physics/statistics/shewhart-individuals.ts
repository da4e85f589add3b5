/**
 * Shewhart individuals chart (X chart) with limits from the average moving range:
 *   centre = x̄,  σ̂ = MR̄ / d₂,  limits = x̄ ± 3·σ̂,  MR_i = |x_i − x_{i−1}|,  d₂ = 1.128 (n = 2).
 * Source: D. C. Montgomery, Introduction to Statistical Quality Control, 6th ed. (Wiley, 2009),
 * §6.4 "The Shewhart control chart for individual measurements"; d₂ for subgroups of two from the
 * table of control-chart constants there (also ASTM E2587, "Standard Practice for Use of Control
 * Charts in Statistical Process Control"). W. A. Shewhart, Economic Control of Quality of
 * Manufactured Product (1931) for the 3σ limits.
 *
 * Validity: needs at least two values (one moving range); the limits describe the process the
 * history came from, so a history with special causes in it gives wide limits.
 */

export const D2_SUBGROUP_OF_TWO = 1.128;
export const INDIVIDUALS_CHART_CITATION =
  'D. C. Montgomery, Introduction to Statistical Quality Control, 6th ed. (2009), §6.4: individuals chart, σ̂ = MR̄/d₂, d₂ = 1.128';

export interface IndividualsLimits {
  readonly count: number;
  readonly centre: number;
  readonly averageMovingRange: number;
  readonly sigma: number;
  readonly lower: number;
  readonly upper: number;
}

/** Limits of the individuals chart of values in time order; undefined for fewer than two values. */
export function individualsLimits(values: ArrayLike<number>): IndividualsLimits | undefined {
  const n = values.length;
  if (n < 2) return undefined;
  let sum = 0;
  let mr = 0;
  for (let i = 0; i < n; i++) {
    sum += values[i]!;
    if (i > 0) mr += Math.abs(values[i]! - values[i - 1]!);
  }
  const centre = sum / n;
  const averageMovingRange = mr / (n - 1);
  const sigma = averageMovingRange / D2_SUBGROUP_OF_TWO;
  return { count: n, centre, averageMovingRange, sigma, lower: centre - 3 * sigma, upper: centre + 3 * sigma };
}
