import { CandelaError } from '../errors.js';
import { compensatedSum } from './compensatedSum.js';
import { createRandomStream } from './random.js';

/**
 * Systematic resampling (Kitagawa 1996, J. Comput. Graph. Stat. 5, 1;
 * Carpenter, Clifford & Fearnhead 1999): turns weighted samples into `count`
 * equally weighted ones. One uniform u in [0, 1/count) places the points
 * u + k/count on the cumulative weight; row r is picked once for every point
 * falling in its share of the total. Each row is picked floor or ceil of
 * count x (its normalized weight) times, so the variance is the smallest of
 * the common schemes. Rows come out in ascending order.
 *
 * Deterministic for a seed (one draw from createRandomStream). Cost: O(rows + count).
 * @param weights non-negative weights (any scale), not all zero.
 * @param count number of equally weighted draws wanted (an integer >= 1).
 * @param seed seed string of the single uniform draw.
 * @returns the picked row indices, ascending, with repeats.
 * @throws CandelaError `run.bad_weights` when a weight is negative or not finite, or all are zero; `run.bad_resample` for a bad count.
 * @example resampleRowsByWeight(Float64Array.of(0.5, 0, 0.5), 4, 'demo') // Int32Array [0, 0, 2, 2]
 */
export function resampleRowsByWeight(weights: ArrayLike<number>, count: number, seed: string): Int32Array {
  if (!Number.isInteger(count) || count < 1) {
    throw new CandelaError({ code: 'run.bad_resample', message: 'the number of resampled draws must be a positive integer', expected: 'an integer >= 1', found: String(count) });
  }
  for (let r = 0; r < weights.length; r++) {
    if (!(weights[r] >= 0) || !Number.isFinite(weights[r])) {
      throw new CandelaError({ code: 'run.bad_weights', path: `weights[${r}]`, message: 'posterior weights must be finite and non-negative', expected: 'a finite number >= 0', found: String(weights[r]) });
    }
  }
  const total = compensatedSum(Float64Array.from(weights));
  if (!(total > 0)) {
    throw new CandelaError({ code: 'run.bad_weights', path: 'weights', message: 'every posterior weight is zero', expected: 'at least one positive weight', found: '0' });
  }
  const picks = new Int32Array(count);
  const step = total / count;
  let position = createRandomStream(seed).uniform() * step;
  let cumulative = 0;
  let row = -1;
  let lastPositive = 0;
  for (let k = 0; k < count; k++) {
    while (cumulative <= position && row < weights.length - 1) {
      row++;
      cumulative += weights[row];
      if (weights[row] > 0) lastPositive = row;
    }
    // Rounding can leave the last point just beyond the running sum: it then takes the last row with weight.
    picks[k] = lastPositive;
    position += step;
  }
  return picks;
}
