import { inverseNormalCdf as standardNormalQuantile } from '../math/index.js';
import type { Prior } from './prior.js';
import { truncatedNormalQuantile } from './truncatedNormal.js';

/**
 * Prior quantile (inverse cumulative distribution): the x with F(x) = u.
 * This is the unit-cube transform of nested sampling (Skilling 2006,
 * Bayesian Analysis 1, 833): u uniform on (0, 1) gives x distributed as the prior.
 *
 * For bounded priors u = 0 and u = 1 give the bounds; for the Gaussian they
 * give -Infinity and +Infinity. u outside [0, 1] gives NaN.
 *
 * Cost: O(1) for uniform and log-uniform; one inverse normal CDF (AS241) and a
 * few normal tail evaluations for the Gaussians.
 * @param prior a prior that passed {@link validatePrior}
 * @param u cumulative probability, dimensionless in [0, 1]
 * @returns the parameter value, in the parameter's units
 * @example priorQuantile({ kind: 'log_uniform', min: 1, max: 100 }, 0.5) // 10
 */
export function priorQuantile(prior: Prior, u: number): number {
  if (!(u >= 0 && u <= 1)) return NaN;
  switch (prior.kind) {
    case 'uniform':
      return Math.min(prior.max, prior.min + u * (prior.max - prior.min));
    case 'gaussian':
      return prior.mean + prior.sd * standardNormalQuantile(u);
    case 'truncated_gaussian': {
      const t = truncatedNormalQuantile(u, (prior.min - prior.mean) / prior.sd, (prior.max - prior.mean) / prior.sd);
      return Math.min(prior.max, Math.max(prior.min, prior.mean + prior.sd * t));
    }
    case 'log_uniform': {
      const logMin = Math.log(prior.min);
      return Math.min(prior.max, Math.max(prior.min, Math.exp(logMin + u * (Math.log(prior.max) - logMin))));
    }
  }
}
