/**
 * Errors larger than this multiple of the median error mark a strongly
 * down-weighted point (e.g. a likely non-Ia with an inflated error); such
 * points are drawn but do not set the axis range.
 */
export const DOWNWEIGHTED_ERROR_FACTOR = 5;

/** The value at a quantile of sorted values: the element at floor(q (n - 1)) (a lower empirical quantile, common practice). */
function lowerQuantile(sorted: readonly number[], quantile: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.floor(quantile * (sorted.length - 1))))];
}

/** What robustDataRange found: the range of the values and the typical error. */
export interface RobustRange {
  /** Quantile range [low, high] of the values of the points that set the range (value units); NaN when there are none. */
  low: number;
  high: number;
  /** Median of the positive finite errors (value units; 0 without errors). */
  typicalError: number;
  /** Whether each point took part (finite value, error not above DOWNWEIGHTED_ERROR_FACTOR x the median). */
  counted: Uint8Array;
}

/**
 * A data range that the points themselves set, not their largest error
 * bars: the low and high quantiles of the finite values, leaving out the
 * points whose error exceeds DOWNWEIGHTED_ERROR_FACTOR times the median
 * error. A few supernovae with errors of hundreds of magnitudes then cannot
 * stretch the axis; they are drawn and their bars are cut at the axis.
 *
 * Cost: O(n log n) (two sorts).
 *
 * @param values data values (e.g. distance moduli or residuals, mag)
 * @param errors one-sigma errors, same length (mag); non-finite entries count as 0
 * @param lowQuantile lower quantile, 0..1 (e.g. 0.005)
 * @param highQuantile upper quantile, 0..1 (e.g. 0.995)
 * @returns the range, the typical error and which points were counted
 * @example robustDataRange([1, 2, 3, 50], [0.1, 0.1, 0.1, 900], 0, 1) // { low: 1, high: 3, typicalError: 0.1, ... }
 */
export function robustDataRange(values: ArrayLike<number>, errors: ArrayLike<number>, lowQuantile: number, highQuantile: number): RobustRange {
  const positive: number[] = [];
  for (let index = 0; index < errors.length; index++) if (Number.isFinite(errors[index]) && errors[index] > 0) positive.push(errors[index]);
  positive.sort((a, b) => a - b);
  const typicalError = positive.length ? lowerQuantile(positive, 0.5) : 0;
  const limit = typicalError > 0 ? DOWNWEIGHTED_ERROR_FACTOR * typicalError : Infinity;
  const counted = new Uint8Array(values.length);
  const kept: number[] = [];
  for (let index = 0; index < values.length; index++) {
    const error = Number.isFinite(errors[index]) ? Math.abs(errors[index]) : 0;
    if (!Number.isFinite(values[index]) || error > limit) continue;
    counted[index] = 1;
    kept.push(values[index]);
  }
  kept.sort((a, b) => a - b);
  if (kept.length === 0) return { low: Number.NaN, high: Number.NaN, typicalError, counted };
  return { low: lowerQuantile(kept, lowQuantile), high: lowerQuantile(kept, highQuantile), typicalError, counted };
}
