import type { RandomStream } from '../math/index.js';
import type { Prior } from './prior.js';
import { priorQuantile } from './priorQuantile.js';

/**
 * One random draw from the prior, using only the given seeded stream.
 * Gaussian: mean + sd * rng.normal(); the others by inverse transform
 * {@link priorQuantile} of a uniform deviate (u = 0 is redrawn so that an
 * open-interval draw never lands on a bound that has zero density).
 *
 * Cost: O(1) (one or two deviates). Never throws.
 * @param prior a prior that passed {@link validatePrior}
 * @param rng seeded stream from createRandomStream
 * @returns a value in the prior support, in the parameter's units
 * @example samplePrior({ kind: 'uniform', min: 0, max: 1 }, createRandomStream('1')) // a number in [0, 1)
 */
export function samplePrior(prior: Prior, rng: RandomStream): number {
  if (prior.kind === 'gaussian') return prior.mean + prior.sd * rng.normal();
  let u = rng.uniform();
  while (u === 0) u = rng.uniform();
  return priorQuantile(prior, u);
}
