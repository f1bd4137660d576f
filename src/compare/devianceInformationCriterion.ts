import { CandelaError } from '../errors.js';
import { kishEffectiveCount, weightedMoments } from '../math/index.js';

/** DIC and its parts, all dimensionless (deviance D = -2 ln L). */
export interface DevianceInformation {
  /** DIC = D_bar + p_D (Spiegelhalter et al. 2002). */
  dic: number;
  /** Posterior mean deviance D_bar. */
  meanDeviance: number;
  /** D(theta_bar), the deviance at the posterior mean, as passed in. */
  devianceAtPosteriorMean: number;
  /** p_D = D_bar - D(theta_bar), the effective number of parameters. */
  effectiveParameters: number;
  /** p_V = var(D) / 2, the alternative of Gelman et al. (2004, Bayesian Data Analysis, 2nd ed.). */
  effectiveParametersFromVariance: number;
  /** D_bar + p_V. */
  dicFromVariance: number;
}

function invalid(path: string, expected: string, found: string): CandelaError {
  return new CandelaError({ code: 'compare.invalid_argument', path, message: `${path} is not valid for the deviance information criterion`, expected, found });
}

/**
 * Deviance information criterion (Spiegelhalter, Best, Carlin & van der Linde
 * 2002, J. R. Stat. Soc. B 64, 583): DIC = D_bar + p_D with
 * p_D = D_bar - D(theta_bar), from posterior draws of the deviance
 * D = -2 ln L and the deviance at the posterior mean (computed by the caller,
 * who alone knows the likelihood). Also returns p_V = var(D)/2 (Gelman et al.
 * 2004). For a linear Gaussian model with flat priors p_D = p_V = k.
 *
 * Weights (e.g. nested-sampling posterior weights) are allowed; the weighted
 * variance uses the unbiased reliability-weight form
 * sum w (D - D_bar)^2 / (sum w - sum w^2 / sum w), which is the usual n - 1
 * sample variance for equal weights: the weighted moments of math/statistics.
 *
 * Cost: O(n), allocates one array of n.
 * @param devianceSamples -2 ln L at each posterior draw (at least 2, all finite).
 * @param devianceAtPosteriorMean -2 ln L at the posterior mean of the parameters.
 * @param weights Optional non-negative weights, one per draw, not all zero.
 * @throws CandelaError `compare.invalid_argument` for fewer than 2 draws, non-finite values, mismatched or bad weights.
 * @example devianceInformationCriterion(Float64Array.of(10, 12, 14), 10).effectiveParameters // 2
 */
export function devianceInformationCriterion(devianceSamples: ArrayLike<number>, devianceAtPosteriorMean: number, weights?: ArrayLike<number>): DevianceInformation {
  const count = devianceSamples.length;
  if (count < 2) throw invalid('devianceSamples', 'at least 2 draws', String(count));
  if (!Number.isFinite(devianceAtPosteriorMean)) throw invalid('devianceAtPosteriorMean', 'a finite number', String(devianceAtPosteriorMean));
  if (weights && weights.length !== count) throw invalid('weights', `${count} weights`, String(weights.length));
  for (let k = 0; k < count; k++) {
    const value = devianceSamples[k];
    const w = weights ? weights[k] : 1;
    if (!Number.isFinite(value)) throw invalid(`devianceSamples[${k}]`, 'a finite deviance', String(value));
    if (!(w >= 0) || !Number.isFinite(w)) throw invalid(`weights[${k}]`, 'a finite weight >= 0', String(w));
  }
  // Kish count > 1 is the reliability-weight denominator sum w - sum w^2 / sum w being positive.
  if (!(kishEffectiveCount(weights ?? count) > 1)) throw invalid('weights', 'positive weight on at least two draws', 'fewer');
  const { mean: meanDeviance, variance } = weightedMoments(devianceSamples, weights, 'devianceSamples');
  const effectiveParameters = meanDeviance - devianceAtPosteriorMean;
  const effectiveParametersFromVariance = variance / 2;
  return {
    dic: meanDeviance + effectiveParameters,
    meanDeviance,
    devianceAtPosteriorMean,
    effectiveParameters,
    effectiveParametersFromVariance,
    dicFromVariance: meanDeviance + effectiveParametersFromVariance,
  };
}
