import { parseParameterName } from '../config/index.js';
import type { SupernovaTerm } from '../likelihood/index.js';
import { covarianceInformation } from './forecastCovarianceInformation.js';

/**
 * Step of the variance derivatives, relative to max(1, |value|): the
 * variances are quadratic in alpha, beta and sigma_int, so central
 * differences are exact for any step; this one keeps rounding near 1e-13.
 */
const VARIANCE_RELATIVE_STEP = 1e-3;
/** Largest relative disagreement of ln det C between the likelihood and the matrix assembled here before it is a bug. */
const LOG_DETERMINANT_AGREEMENT = 1e-8;

/**
 * The covariance part of the Fisher matrix, 1/2 tr(C^-1 C_,i C^-1 C_,j)
 * (covarianceInformation), for the free parameters that move the variances
 * of the fit's likelihood: the inputs of the supernova covariance model,
 * alpha and beta (light-curve errors) and sigma_int. Their derivatives come
 * from the likelihood's own variances (HubbleDiagram errors squared) by
 * central differences; a parameter whose derivatives are all zero (alpha and
 * beta with a frozen covariance) adds nothing. C at the truth is the
 * off-diagonal part of the systematic matrix plus those variances (which are
 * the whole diagonal of C), checked against the likelihood's ln det C.
 * Cost: 1 + 2k likelihood evaluations (each an N x N factorization when C
 * follows the parameters) and O(N^3) for covarianceInformation, only when k > 0.
 * @param createTerm builds the likelihood as the fit would (called only when needed).
 * @param atTruth every parameter value at the truth.
 * @param names the free parameters.
 * @param systematic the survey's systematic covariance (N x N, mag^2) or null.
 * @param n the number of supernovae.
 * @returns the parameters that contribute and their k x k information matrix.
 * @throws Error when the assembled covariance disagrees with the likelihood's (a bug, not bad input).
 * @example covariancePart(() => term, truth, ['omega_m', 'alpha'], null, 800).names // ['alpha'] with exact alpha-beta covariance
 */
export function covariancePart(
  createTerm: () => SupernovaTerm, atTruth: Record<string, number>, names: readonly string[], systematic: Float64Array | null, n: number,
): { names: string[]; information: Float64Array } {
  // The inputs of the supernova covariance model: alpha, beta (light-curve errors) and sigma_int.
  const candidates = names.filter((name) => ['alpha', 'beta', 'sigma_int'].includes(parseParameterName(name)?.base ?? ''));
  if (candidates.length === 0) return { names: [], information: new Float64Array(0) };
  const term = createTerm();
  const variances = (p: Record<string, number>): Float64Array => Float64Array.from(term.hubbleDiagram(p).distanceModulusErrorMag, (s) => s * s);
  const used: string[] = [];
  const derivatives: Float64Array[] = [];
  for (const name of candidates) {
    const h = VARIANCE_RELATIVE_STEP * Math.max(1, Math.abs(atTruth[name]));
    const plus = variances({ ...atTruth, [name]: atTruth[name] + h });
    const minus = variances({ ...atTruth, [name]: atTruth[name] - h });
    const derivative = Float64Array.from(plus, (value, a) => (value - minus[a]) / (2 * h));
    if (derivative.some((value) => value !== 0)) {
      used.push(name);
      derivatives.push(derivative);
    }
  }
  if (used.length === 0) return { names: used, information: new Float64Array(0) };
  const v0 = variances(atTruth);
  const covariance = new Float64Array(n * n);
  if (systematic) covariance.set(systematic);
  for (let a = 0; a < n; a++) covariance[a * n + a] = v0[a]; // the Hubble-diagram variances are diag C, systematics included
  const { information, logDeterminant } = covarianceInformation(covariance, n, derivatives);
  const expected = term.bestFitExtras?.(atTruth).log_det_covariance ?? logDeterminant;
  if (!(Math.abs(expected - logDeterminant) <= LOG_DETERMINANT_AGREEMENT * Math.max(1, Math.abs(expected)))) {
    throw new Error(`forecast: the covariance assembled for the Fisher matrix (ln det ${logDeterminant}) disagrees with the likelihood's (${expected})`);
  }
  return { names: used, information };
}
