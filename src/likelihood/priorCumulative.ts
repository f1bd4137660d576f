import { standardNormalCumulative } from '../math/index.js';
import type { Prior } from './prior.js';
import { truncatedNormalCumulative } from './truncatedNormal.js';

/**
 * Prior cumulative distribution function F(x) = P(X <= x), in [0, 1].
 * The inverse of {@link priorQuantile}.
 *
 * Cost: O(1). Never throws.
 * @param prior a prior that passed {@link validatePrior}
 * @param x parameter value, in the parameter's units
 * @example priorCumulative({ kind: 'gaussian', mean: 0, sd: 1 }, 1.959963984540054) // 0.975
 */
export function priorCumulative(prior: Prior, x: number): number {
  switch (prior.kind) {
    case 'uniform':
      return x <= prior.min ? 0 : x >= prior.max ? 1 : (x - prior.min) / (prior.max - prior.min);
    case 'gaussian':
      return standardNormalCumulative((x - prior.mean) / prior.sd);
    case 'truncated_gaussian':
      return truncatedNormalCumulative(
        (x - prior.mean) / prior.sd,
        (prior.min - prior.mean) / prior.sd,
        (prior.max - prior.mean) / prior.sd,
      );
    case 'log_uniform':
      return x <= prior.min ? 0 : x >= prior.max ? 1 : Math.log(x / prior.min) / Math.log(prior.max / prior.min);
  }
}
