import { CandelaError } from '../../errors.js';
import { sortSample } from '../../math/index.js';
import type { SortedSample } from '../../math/index.js';

/** Relative tolerance (times the total weight) for "the window holds the requested mass". */
const MASS_TOLERANCE = 1e-12;

/**
 * Shortest interval of a sorted, weighted sample holding at least the given
 * probability mass: the Monte Carlo estimate of the highest-posterior-density
 * interval of Chen & Shao (1999, "Monte Carlo estimation of Bayesian credible
 * and HPD intervals", J. Comp. Graph. Stat. 8, 69). Among all windows
 * [x_i, x_j] of consecutive sorted samples whose weights sum to >= mass, it
 * returns the narrowest (the first one on ties). For n unit weights the
 * window holds ceil(mass n) samples. For a unimodal posterior this converges
 * to the HPD interval; for a multimodal one it is the shortest single
 * interval, which can include a low-density gap between modes.
 *
 * Cost: O(n) with two moving pointers.
 * @param sample output of {@link sortSample}.
 * @param mass probability in (0, 1], e.g. ONE_SIGMA_MASS.
 * @returns [low, high] in the unit of the sample.
 * @throws CandelaError `output.bad_probability` for a mass outside (0, 1].
 * @example highestDensityIntervalOfSorted(sortSample([0, 1, 1.1, 1.2, 5]), 0.6) // [1, 1.2]
 */
export function highestDensityIntervalOfSorted(sample: SortedSample, mass: number): [number, number] {
  if (!(mass > 0 && mass <= 1)) {
    throw new CandelaError({ code: 'output.bad_probability', message: 'an interval needs a mass in (0, 1]', expected: '0 < mass <= 1', found: String(mass) });
  }
  const { values, cumulativeWeight, totalWeight } = sample;
  const count = values.length;
  const needed = mass * totalWeight - MASS_TOLERANCE * totalWeight;
  let bestLow = values[0];
  let bestHigh = values[count - 1];
  let bestWidth = Infinity;
  let end = 0;
  for (let start = 0; start < count; start++) {
    const before = start === 0 ? 0 : cumulativeWeight[start - 1];
    if (end < start) end = start;
    while (end < count && cumulativeWeight[end] - before < needed) end++;
    if (end === count) break;
    const width = values[end] - values[start];
    if (width < bestWidth) {
      bestWidth = width;
      bestLow = values[start];
      bestHigh = values[end];
    }
  }
  return [bestLow, bestHigh];
}

/**
 * Shortest interval holding the given mass of a (weighted) sample; see
 * {@link highestDensityIntervalOfSorted}. Cost: O(n log n) for the sort.
 * @param values sample values (any unit).
 * @param mass probability in (0, 1].
 * @param weights optional non-negative weights.
 * @throws CandelaError on non-finite values, bad weights or a bad mass.
 * @example highestDensityInterval([5, 0, 1.2, 1, 1.1], 0.6) // [1, 1.2]
 */
export function highestDensityInterval(values: ArrayLike<number>, mass: number, weights?: ArrayLike<number>): [number, number] {
  return highestDensityIntervalOfSorted(sortSample(values, weights), mass);
}
