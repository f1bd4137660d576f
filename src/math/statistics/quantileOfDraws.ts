/**
 * Sample quantile of sorted draws by linear interpolation between order
 * statistics, definition 7 of Hyndman & Fan (1996, "Sample quantiles in
 * statistical packages", The American Statistician 50(4), 361): with the
 * sorted draws x(1) <= ... <= x(S) and h = 1 + (S - 1) p, the quantile is
 * x(floor h) + (h - floor h)(x(ceil h) - x(floor h)), written as R's
 * `quantile(type = 7)` evaluates it: (1 - g) x(lo) + g x(hi).
 *
 * Cost: O(1).
 * @param sorted the draws in ascending order (any units; the quantile has the same).
 * @param probability p in [0, 1].
 * @example quantileOfSortedDraws(Float64Array.of(1, 2, 3, 4), 0.5) // => 2.5
 */
export function quantileOfSortedDraws(sorted: ArrayLike<number>, probability: number): number {
  const position = 1 + (sorted.length - 1) * probability;
  const lower = Math.floor(position);
  const upper = Math.ceil(position);
  const atLower = sorted[lower - 1];
  const atUpper = sorted[upper - 1];
  if (position > lower && atUpper !== atLower) {
    const fraction = position - lower;
    return (1 - fraction) * atLower + fraction * atUpper;
  }
  return atLower;
}

/**
 * Type-7 sample quantile of unsorted draws (see {@link quantileOfSortedDraws}).
 *
 * Cost: one sort of a copy, O(S log S).
 * @param draws the draws (any units; the quantile has the same).
 * @param probability p in [0, 1].
 * @example quantileOfDraws(Float64Array.of(4, 1, 3, 2), 0.5) // => 2.5
 */
export function quantileOfDraws(draws: ArrayLike<number>, probability: number): number {
  return quantileOfSortedDraws(Float64Array.from(draws).sort(), probability);
}
