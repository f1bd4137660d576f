import { weightedMoments } from '../statistics/weightedMoments.js';

/** One parameter's mean and spread before and after reweighting, and the shift between them. */
export interface ReweightedShift {
  /** Mean of the equally weighted draws (unit of the parameter). */
  baseMean: number;
  /** Standard deviation of the equally weighted draws. */
  baseSd: number;
  /** Weighted mean (the target posterior's mean). */
  mean: number;
  /** Weighted standard deviation (the target posterior's spread). */
  sd: number;
  /** mean - baseMean. */
  shift: number;
  /**
   * Monte Carlo standard error of `shift` for independent draws (delta
   * method, see {@link reweightedShift}); multiply by the square root of the
   * integrated autocorrelation time for correlated ones.
   */
  shiftMcError: number;
}

/**
 * Mean and standard deviation of one parameter under equal weights (the
 * posterior p the draws come from) and under importance weights (the target
 * q), the shift of the mean, and its Monte Carlo error. Both means use the
 * same draws, so their errors are correlated; the delta method for the
 * difference of the two self-normalized estimators (Owen 2013, "Monte Carlo
 * theory, methods and examples", section 9.2) gives
 *
 *   Var(shift) ~ sum_i ( w_i (x_i - mean) - (x_i - baseMean) / n )^2
 *
 * with normalized weights w_i (sum 1). It is exact to first order in 1/n
 * for independent draws.
 *
 * Cost: O(n) time, a few arrays of n doubles.
 * @param values the parameter at each draw (any unit), finite.
 * @param weights normalized importance weights (sum 1), e.g. from importanceWeights.
 * @param label parameter name for error messages.
 * @throws CandelaError from weightedMoments (empty or non-finite draws, bad weights).
 * @example reweightedShift([0, 1], [0.25, 0.75]).shift // 0.75 - 0.5 = 0.25
 */
export function reweightedShift(values: ArrayLike<number>, weights: ArrayLike<number>, label = 'sample'): ReweightedShift {
  const base = weightedMoments(values, undefined, label);
  const target = weightedMoments(values, weights, label);
  const count = values.length;
  let variance = 0;
  for (let i = 0; i < count; i++) {
    const influence = weights[i] * (values[i] - target.mean) - (values[i] - base.mean) / count;
    variance += influence * influence;
  }
  return {
    baseMean: base.mean, baseSd: base.sd, mean: target.mean, sd: target.sd,
    shift: target.mean - base.mean, shiftMcError: Math.sqrt(variance),
  };
}
