// Validation helper (not a test): the counting statistics of the coverage and calibration checks.
import { regularizedGammaQ } from '../../../src/math/index.js';

/**
 * Tail probability allowed on each side of a binomial or chi-square acceptance
 * region: a correct code fails a given check about once in 500 runs (common practice).
 */
export const FALSE_ALARM_TAIL = 0.001;

/**
 * The smallest and largest counts k of Binomial(trials, p) whose lower tail
 * P(X <= k) and upper tail P(X >= k) are each at least `tail`: the acceptance
 * band of an observed hit count. Exact sums of the probability mass function.
 * Cost: O(trials).
 * @param trials number of independent trials (integer >= 1).
 * @param p success probability in (0, 1).
 * @param tail probability allowed in each tail (default FALSE_ALARM_TAIL).
 * @example binomialBand(20, 0.5, 0.025) // [6, 14] (P(X <= 5) = 0.0207, by hand)
 */
export function binomialBand(trials: number, p: number, tail = FALSE_ALARM_TAIL): [number, number] {
  const mass: number[] = [];
  let coefficient = 1;
  for (let k = 0; k <= trials; k++) {
    mass.push(coefficient * p ** k * (1 - p) ** (trials - k));
    coefficient = (coefficient * (trials - k)) / (k + 1);
  }
  let low = 0;
  for (let below = mass[0]; below < tail; below += mass[++low]);
  let high = trials;
  for (let above = mass[trials]; above < tail; above += mass[--high]);
  return [low, high];
}

/**
 * Survival function of the chi-square distribution, P(X >= statistic) for
 * `degreesOfFreedom` degrees of freedom: Q(nu/2, x/2), the regularized upper
 * incomplete gamma function (Abramowitz & Stegun 1964, 26.4.19).
 * @example chiSquareSurvival(16.919, 9) // 0.0500 (A&S table 26.8)
 */
export function chiSquareSurvival(statistic: number, degreesOfFreedom: number): number {
  return regularizedGammaQ(degreesOfFreedom / 2, statistic / 2);
}

/** Pearson's chi-square test of equal cell probabilities. */
export interface UniformityTest {
  /** Sum over cells of (observed - expected)^2 / expected. */
  statistic: number;
  /** Cells - 1. */
  degreesOfFreedom: number;
  /** P(chi-square with that many degrees of freedom >= statistic) = Q(dof/2, statistic/2). */
  pValue: number;
}

/**
 * Pearson's (1900) chi-square goodness-of-fit test of counts against equal
 * cell probabilities, with p from {@link chiSquareSurvival}.
 * Cost: O(cells).
 * @param counts observed count per cell (non-negative integers, at least 2 cells, total > 0).
 * @example chiSquareUniformity([10, 10, 10, 10]).pValue // 1
 */
export function chiSquareUniformity(counts: readonly number[]): UniformityTest {
  const total = counts.reduce((sum, count) => sum + count, 0);
  const expected = total / counts.length;
  const statistic = counts.reduce((sum, count) => sum + (count - expected) ** 2 / expected, 0);
  const degreesOfFreedom = counts.length - 1;
  return { statistic, degreesOfFreedom, pValue: chiSquareSurvival(statistic, degreesOfFreedom) };
}

/**
 * Rank statistic of simulation-based calibration (Talts, Betancourt, Simpson,
 * Vehtari & Gelman 2018, algorithm 1): the number of posterior draws below
 * the value the data were simulated from, an integer in 0..draws.length.
 * @example rankOfTruth(Float64Array.of(0.1, 0.5, 0.9), 0.6) // 2
 */
export function rankOfTruth(draws: Float64Array, truth: number): number {
  let rank = 0;
  for (let i = 0; i < draws.length; i++) if (draws[i] < truth) rank += 1;
  return rank;
}

/**
 * Histogram of ranks 0..drawCount in `bins` equal groups of consecutive
 * ranks; (drawCount + 1) must be a multiple of `bins` so that every bin has
 * the same probability under uniformity (Talts et al. 2018, sec. 4.1).
 * @throws Error when drawCount + 1 is not a multiple of bins.
 * @example rankHistogram([0, 1, 2, 3], 3, 2) // [2, 2]
 */
export function rankHistogram(ranks: readonly number[], drawCount: number, bins: number): number[] {
  if ((drawCount + 1) % bins !== 0) throw new Error(`${drawCount + 1} possible ranks do not split into ${bins} equal bins`);
  const width = (drawCount + 1) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (const rank of ranks) counts[Math.floor(rank / width)] += 1;
  return counts;
}
