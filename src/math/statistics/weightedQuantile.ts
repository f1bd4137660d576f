import { CandelaError } from '../../errors.js';
import { sortSample } from './sortSample.js';
import type { SortedSample } from './sortSample.js';

/**
 * Relative tolerance (times the total weight) within which a running weight
 * counts as landing exactly on p x total: absorbs rounding in sums of
 * non-integer weights (R uses a similar fuzz of 4 machine epsilons on n p).
 */
const QUANTILE_TIE_TOLERANCE = 1e-12;

/**
 * Quantile of a sorted, weighted sample: the inverse of the weighted
 * empirical distribution function, averaging the two neighbours where the
 * running weight lands exactly on p (definition 2 of Hyndman & Fan 1996,
 * "Sample quantiles in statistical packages", Am. Stat. 50, 361, extended
 * to weights). Written here rather than taken from simple-statistics, whose
 * quantiles are unweighted and interpolating (definition 7): this rule
 * depends only on the weights' ratios, so normalized nested-sampling weights
 * and integer repeat counts give the same answer, and for integer weights it
 * equals the quantile of the sample with each value repeated that many times.
 *
 * Cost: O(log n) by binary search on the running weight.
 * @param sample output of {@link sortSample}.
 * @param probability p in [0, 1].
 * @returns the quantile, in the unit of the sample.
 * @throws CandelaError `math.bad_probability` when p is outside [0, 1].
 * @example weightedQuantileOfSorted(sortSample([1, 2, 3, 4]), 0.5) // 2.5
 */
export function weightedQuantileOfSorted(sample: SortedSample, probability: number): number {
  if (!(probability >= 0 && probability <= 1)) {
    throw new CandelaError({ code: 'math.bad_probability', message: 'a quantile needs a probability between 0 and 1', expected: '0 <= p <= 1', found: String(probability) });
  }
  const { values, cumulativeWeight, totalWeight } = sample;
  const target = probability * totalWeight;
  const tolerance = QUANTILE_TIE_TOLERANCE * totalWeight;
  let low = 0;
  let high = values.length - 1;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (cumulativeWeight[middle] >= target - tolerance) high = middle;
    else low = middle + 1;
  }
  if (low < values.length - 1 && Math.abs(cumulativeWeight[low] - target) <= tolerance) {
    return 0.5 * (values[low] + values[low + 1]);
  }
  return values[low];
}

/**
 * Several quantiles of a (weighted) sample; sorts once.
 * See {@link weightedQuantileOfSorted} for the definition.
 *
 * Cost: O(n log n).
 * @param values sample values (any unit).
 * @param probabilities each in [0, 1].
 * @param weights optional non-negative weights.
 * @throws CandelaError on non-finite values, bad weights or probabilities.
 * @example weightedQuantiles([1, 2, 3], [0.5], [1, 0, 1]) // [2]  (the sample {1, 3} gives (1 + 3) / 2)
 */
export function weightedQuantiles(values: ArrayLike<number>, probabilities: readonly number[], weights?: ArrayLike<number>): number[] {
  const sorted = sortSample(values, weights);
  return probabilities.map((p) => weightedQuantileOfSorted(sorted, p));
}
