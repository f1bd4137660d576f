import { HALF_LOG_TWO_PI } from '../math/index.js';
import type { Prior } from './prior.js';
import { truncatedNormalMass } from './truncatedNormal.js';

/**
 * Normalized natural-log prior density ln pi(x), in ln(1/unit of x);
 * -Infinity outside the support (see {@link priorContains}), never NaN for a
 * valid prior and non-NaN x.
 *
 * - uniform: -ln(max - min)
 * - gaussian: -(x - mean)^2 / (2 sd^2) - ln sd - ln(2 pi)/2
 * - truncated_gaussian: the Gaussian value - ln(Phi(b) - Phi(a)), a, b the standardized bounds
 * - log_uniform: -ln x - ln ln(max/min)
 *
 * Cost: O(1) (the truncated Gaussian evaluates two normal tail probabilities).
 * @param prior a prior that passed {@link validatePrior}
 * @param x parameter value, in the parameter's units
 * @example priorLogDensity({ kind: 'uniform', min: 0, max: 2 }, 1) // -0.6931471805599453
 */
export function priorLogDensity(prior: Prior, x: number): number {
  switch (prior.kind) {
    case 'uniform':
      return x >= prior.min && x <= prior.max ? -Math.log(prior.max - prior.min) : -Infinity;
    case 'gaussian': {
      if (!Number.isFinite(x)) return -Infinity;
      const z = (x - prior.mean) / prior.sd;
      return -0.5 * z * z - Math.log(prior.sd) - HALF_LOG_TWO_PI;
    }
    case 'truncated_gaussian': {
      if (!(x >= prior.min && x <= prior.max)) return -Infinity;
      const z = (x - prior.mean) / prior.sd;
      const mass = truncatedNormalMass((prior.min - prior.mean) / prior.sd, (prior.max - prior.mean) / prior.sd);
      return -0.5 * z * z - Math.log(prior.sd) - HALF_LOG_TWO_PI - Math.log(mass);
    }
    case 'log_uniform':
      return x >= prior.min && x <= prior.max ? -Math.log(x) - Math.log(Math.log(prior.max / prior.min)) : -Infinity;
  }
}
