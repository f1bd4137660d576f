import type { Prior } from './prior.js';

/**
 * Support test: true when `x` has positive prior density (bounds included).
 * A Gaussian prior contains every finite number; NaN is never contained.
 *
 * Cost: O(1). Never throws.
 * @param prior the prior (units of its parameter)
 * @param x the parameter value, same units
 * @example priorContains({ kind: 'uniform', min: 0, max: 1 }, 1.2) // false
 */
export function priorContains(prior: Prior, x: number): boolean {
  switch (prior.kind) {
    case 'gaussian':
      return Number.isFinite(x);
    case 'uniform':
    case 'log_uniform':
    case 'truncated_gaussian':
      return x >= prior.min && x <= prior.max;
  }
}
