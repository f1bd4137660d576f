import { choleskyInPlace, choleskySolveInPlace } from '../cholesky.js';
import { quadraticLogRatioFit } from './quadraticLogRatioFit.js';

/** The Gaussian prediction of a reweighted posterior, or why there is none. */
export type LinearResponse =
  | {
    ok: true;
    /** Predicted change of each parameter's mean (target minus draws), unit of the parameter. */
    shift: Float64Array;
    /** Predicted standard deviation of each parameter under the target. */
    sd: Float64Array;
    /** Predicted covariance under the target, p x p row major. */
    covariance: Float64Array;
  }
  | { ok: false; reason: string };

/**
 * Predicts the mean and covariance of a target posterior q from draws of p
 * and the log ratio r = ln q - ln p at each draw, assuming p is Gaussian and
 * r quadratic in the parameters: the Gaussian linear-response closure.
 * With x the standardized deviation of a draw from the mean of the draws,
 * r(x) = c + g^T x - x^T H x / 2 is fitted by least squares over the draws
 * (quadraticLogRatioFit), and the product of Gaussians gives
 *
 *   q(x) ∝ N(x; 0, R) exp(g^T x - x^T H x / 2)  =>  Cov_q = (R^-1 + H)^-1,  E_q[x] = Cov_q g,
 *
 * with R the covariance of the standardized draws (completing the square;
 * e.g. Bishop 2006, "Pattern Recognition and Machine Learning", section
 * 2.3.3). To first order this is the linear-response covariance formula
 * dE[theta] = Cov_p(theta, r) of Giordano, Broderick & Jordan (2018, JMLR
 * 19, 51). For a linear model with Gaussian errors and a flat prior both
 * posteriors are Gaussian and r is exactly quadratic, so the prediction
 * is exact up to the Monte Carlo error of the draws' mean and covariance;
 * unlike importance weights it does not degrade when q lies in the tail of
 * p, which makes it the cross-check of a reweighting whose effective count
 * collapsed.
 *
 * Cost: O(n p^4) for the fit (p(p+3)/2 + 1 coefficients), O(p^3) after.
 * @param draws n x p row major, the parameters of each draw (finite).
 * @param dimension p, the number of parameters.
 * @param logRatio ln q - ln p per draw (nats); draws with -Infinity are left out of the fit.
 * @returns the predicted shift, standard deviations and covariance, or ok false with the reason
 *   (too few usable draws, a singular fit, or a fitted curvature that makes R^-1 + H not positive definite).
 * @example gaussianLinearResponse(drawsOfNormal01, 1, draws.map((t) => t)) // shift ~ [1], sd ~ [1] (q = N(1, 1))
 */
export function gaussianLinearResponse(draws: Float64Array, dimension: number, logRatio: ArrayLike<number>): LinearResponse {
  const fit = quadraticLogRatioFit(draws, dimension, logRatio);
  if (!fit.ok) return fit;
  const { scale, gradient, curvature, covariance } = fit;
  const p = dimension;
  // Precision of the standardized draws: R^-1, column by column from the Cholesky factor of R.
  const factor = Float64Array.from(covariance);
  if (!choleskyInPlace(factor, p).ok) return { ok: false, reason: 'the draws span fewer directions than there are parameters' };
  const precision = new Float64Array(p * p);
  for (let column = 0; column < p; column++) {
    const unit = new Float64Array(p);
    unit[column] = 1;
    choleskySolveInPlace(factor, p, unit);
    for (let row = 0; row < p; row++) precision[row * p + column] = unit[row] + curvature[row * p + column];
  }
  if (!choleskyInPlace(precision, p).ok) {
    return { ok: false, reason: 'the fitted log ratio curves upwards too much for a Gaussian target (R^-1 + H is not positive definite)' };
  }
  const standardizedShift = choleskySolveInPlace(precision, p, Float64Array.from(gradient));
  const shift = new Float64Array(p);
  const target = new Float64Array(p * p);
  for (let column = 0; column < p; column++) {
    shift[column] = scale[column] * standardizedShift[column];
    const unit = new Float64Array(p);
    unit[column] = 1;
    choleskySolveInPlace(precision, p, unit);
    for (let row = 0; row < p; row++) target[row * p + column] = scale[row] * scale[column] * unit[row];
  }
  const sd = Float64Array.from({ length: p }, (_, j) => Math.sqrt(target[j * p + j]));
  return { ok: true, shift, sd, covariance: target };
}
