import { checkSamples } from './checkSamples.js';

/**
 * A sample sorted by value with its running (cumulative) weight, the common
 * input of quantiles and highest-density intervals. Samples with zero weight
 * are dropped: they carry no probability.
 */
export interface SortedSample {
  /** Values in ascending order (unit of the parameter). */
  values: Float64Array;
  /** cumulativeWeight[i] = sum of the weights of values[0..i]; unit weights when none were given. */
  cumulativeWeight: Float64Array;
  /** Sum of all weights (= count for unit weights). */
  totalWeight: number;
}

/**
 * Sorts a sample by value and accumulates its weights. The running sum uses
 * Neumaier compensation (Neumaier 1974) so that the last entry equals the
 * total weight to rounding.
 *
 * Cost: O(n log n) time, 3n doubles of memory.
 * @param values sample values (any unit), all finite.
 * @param weights optional non-negative weights (e.g. nested-sampling
 *   posterior weights); unit weights when omitted.
 * @param label parameter name for error messages.
 * @throws CandelaError when a value is not finite, a weight is negative or
 *   not finite, the lengths differ or every weight is zero.
 * @example sortSample([3, 1, 2]).values // Float64Array [1, 2, 3]; cumulativeWeight [1, 2, 3]
 */
export function sortSample(values: ArrayLike<number>, weights?: ArrayLike<number>, label = 'sample'): SortedSample {
  checkSamples(values, weights, label);
  if (!weights) {
    const sorted = Float64Array.from(values).sort();
    const cumulative = new Float64Array(sorted.length);
    for (let i = 0; i < sorted.length; i++) cumulative[i] = i + 1;
    return { values: sorted, cumulativeWeight: cumulative, totalWeight: sorted.length };
  }
  const order: number[] = [];
  for (let i = 0; i < values.length; i++) if (weights[i] > 0) order.push(i);
  order.sort((a, b) => values[a] - values[b]);
  const sorted = new Float64Array(order.length);
  const cumulative = new Float64Array(order.length);
  let sum = 0;
  let compensation = 0;
  for (let k = 0; k < order.length; k++) {
    const weight = weights[order[k]];
    sorted[k] = values[order[k]];
    const next = sum + weight;
    compensation += Math.abs(sum) >= weight ? sum - next + weight : weight - next + sum;
    sum = next;
    cumulative[k] = sum + compensation;
  }
  return { values: sorted, cumulativeWeight: cumulative, totalWeight: cumulative[cumulative.length - 1] };
}
