import type { RandomStream } from '../math/index.js';
import type { Prior } from './prior.js';
import { samplePrior } from './samplePrior.js';

/** Draws from the prior whose spread sets a search step (enough for a spread to ~10%; common practice). */
export const PRIOR_SPREAD_DRAWS = 50;
/** The search step as a fraction of the prior's spread. */
export const SEARCH_STEP_FRACTION = 0.1;
/** Smallest search step, in the parameter's units (a prior narrower than this is searched with this step). */
export const SMALLEST_SEARCH_STEP = 1e-3;

/**
 * The starting step of a best-fit search (e.g. a Nelder-Mead simplex) along
 * one parameter: SEARCH_STEP_FRACTION of the standard deviation (divisor n)
 * of PRIOR_SPREAD_DRAWS draws from its prior, at least SMALLEST_SEARCH_STEP.
 * Takes PRIOR_SPREAD_DRAWS numbers from the stream.
 * Cost O(PRIOR_SPREAD_DRAWS).
 * @param prior the parameter's prior.
 * @param random the seeded stream to draw from (advanced).
 * @returns the step, in the parameter's units.
 * @throws nothing.
 * @example priorSearchStep({ kind: 'uniform', min: 0, max: 1 }, createRandomStream('1')) // about 0.029 (0.1 / sqrt(12))
 */
export function priorSearchStep(prior: Prior, random: RandomStream): number {
  const values = Array.from({ length: PRIOR_SPREAD_DRAWS }, () => samplePrior(prior, random));
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  return Math.max(SMALLEST_SEARCH_STEP, SEARCH_STEP_FRACTION * Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / values.length));
}
