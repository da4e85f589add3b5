/**
 * Sample quantiles, definition 7 of R. J. Hyndman & Y. Fan, "Sample quantiles in statistical
 * packages", The American Statistician 50, 361–365 (1996): for sorted x₁ ≤ … ≤ xₙ and
 * probability p, h = (n − 1)·p + 1, Q(p) = x⌊h⌋ + (h − ⌊h⌋)·(x⌊h⌋₊₁ − x⌊h⌋). (The default of R and
 * of NumPy's percentile, so an engineer's spreadsheet check agrees.)
 */

/** Quantile p ∈ [0, 1] of values already sorted ascending (NaN for none). */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0 || !(p >= 0 && p <= 1)) return Number.NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}
