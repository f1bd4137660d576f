import { CandelaError } from '../../errors.js';
import { kishEffectiveCount } from '../statistics/kishEffectiveCount.js';

/** Normalized importance weights of one set of draws and how many draws they are worth. */
export interface ImportanceWeights {
  /** One weight per draw, non-negative, summing to 1 (dimensionless). */
  weights: Float64Array;
  /** Kish effective count (sum w)^2 / sum w^2 of the weights (Kish 1965); n for equal weights. */
  effectiveCount: number;
  /** effectiveCount / n, between 1/n and 1 (dimensionless). */
  effectiveFraction: number;
}

/**
 * Importance weights that turn draws of one posterior p into draws of
 * another, q, from the log ratio ln q(theta_i) - ln p(theta_i) at each draw
 * (unnormalized is fine: constants cancel in the self-normalized estimator,
 * Owen 2013, "Monte Carlo theory, methods and examples", section 9.2). When
 * the priors agree the log ratio is the difference of the log likelihoods,
 * ln L_q - ln L_p. The largest log ratio is subtracted before exponentiating,
 * so no weight overflows; a log ratio of -Infinity (q excludes the draw)
 * gives weight 0. The Kish effective count says how many equally weighted
 * draws the weighted set is worth; a small fraction means q is poorly
 * covered by p and the reweighted statistics cannot be trusted.
 *
 * Cost: O(n) time, two arrays of n doubles.
 * @param logRatio ln q - ln p per draw (nats), finite or -Infinity.
 * @returns the normalized weights with their Kish effective count.
 * @throws CandelaError `math.empty_sample` (no draw), `math.non_finite_sample`
 *   (a NaN or +Infinity log ratio, with its row), `math.zero_weight` (every
 *   log ratio is -Infinity).
 * @example importanceWeights([0, Math.log(3)]).weights // [0.25, 0.75]; effectiveCount 1.6
 */
export function importanceWeights(logRatio: ArrayLike<number>): ImportanceWeights {
  const count = logRatio.length;
  if (count === 0) {
    throw new CandelaError({ code: 'math.empty_sample', path: 'log ratio', message: 'no draws to reweight', fix: 'pass at least one draw' });
  }
  let largest = -Infinity;
  for (let i = 0; i < count; i++) {
    const value = logRatio[i];
    if (Number.isNaN(value) || value === Infinity) {
      throw new CandelaError({
        code: 'math.non_finite_sample', path: 'log ratio', row: i + 1, message: `the log ratio of draw ${i + 1} is not a number below +Infinity`,
        expected: 'a finite number or -Infinity', found: String(value), fix: 'check the log likelihoods of both posteriors at this draw',
      });
    }
    if (value > largest) largest = value;
  }
  if (largest === -Infinity) {
    throw new CandelaError({
      code: 'math.zero_weight', path: 'log ratio', message: 'the target posterior excludes every draw (every log ratio is -Infinity)',
      fix: 'sample the target posterior directly instead of reweighting',
    });
  }
  const weights = new Float64Array(count);
  let total = 0;
  for (let i = 0; i < count; i++) {
    weights[i] = Math.exp(logRatio[i] - largest);
    total += weights[i];
  }
  for (let i = 0; i < count; i++) weights[i] /= total;
  const effectiveCount = kishEffectiveCount(weights);
  return { weights, effectiveCount, effectiveFraction: effectiveCount / count };
}
