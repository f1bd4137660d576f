import { parseParameterName } from '../parameters/index.js';
import type { SystematicModes } from '../data/index.js';
import { CandelaError } from '../errors.js';
import { buildLowRankCapacitance, type SupernovaTerm } from '../likelihood/index.js';
import { solveLowerInPlace } from '../math/index.js';
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
 * With systematic modes U (C = D + U U^T, D diagonal) no N x N matrix is
 * formed: C^-1 = D^-1 - W W^T with W = D^-1 U L^-T, L L^T = I + U^T D^-1 U
 * (Woodbury 1950), so that
 *
 *   sum_ab (C^-1)_ab^2 d_i,a d_j,b = sum_a d_i,a d_j,a (1/D_a^2 - 2 |W_a|^2 / D_a) + sum_pq G^i_pq G^j_pq,
 *   G^i = W^T diag(d_i) W (K x K),
 *
 * exact algebra, and ln det C = ln det D + ln det(I + U^T D^-1 U) (the
 * matrix determinant lemma).
 * Cost: 1 + 2k likelihood evaluations (each an N x N factorization when C
 * follows the parameters) and, only when k > 0, O(N^3) for a dense
 * systematic matrix (covarianceInformation) or O(N K^2 (1 + k) + k^2 (N + K^2)) for modes.
 * @param createTerm builds the likelihood as the fit would (called only when needed).
 * @param atTruth every parameter value at the truth.
 * @param names the free parameters.
 * @param systematic the survey's systematic covariance (N x N, mag^2), its modes U (N x K, mag), or null.
 * @param n the number of supernovae.
 * @returns the parameters that contribute and their k x k information matrix.
 * @throws CandelaError `forecast.covariance_not_positive_definite` when C (or its diagonal part D with modes) cannot be factorized.
 * @throws Error when the assembled covariance disagrees with the likelihood's (a bug, not bad input).
 * @example covariancePart(() => term, truth, ['omega_m', 'alpha'], null, 800).names // ['alpha'] with exact alpha-beta covariance
 */
export function covariancePart(
  createTerm: () => SupernovaTerm, atTruth: Record<string, number>, names: readonly string[],
  systematic: Float64Array | SystematicModes | null, n: number,
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
  const { information, logDeterminant } = systematic instanceof Float64Array || systematic === null
    ? covarianceInformation(denseCovariance(v0, systematic, n), n, derivatives)
    : lowRankInformation(v0, systematic, derivatives);
  const expected = term.bestFitExtras?.(atTruth).log_det_covariance ?? logDeterminant;
  if (!(Math.abs(expected - logDeterminant) <= LOG_DETERMINANT_AGREEMENT * Math.max(1, Math.abs(expected)))) {
    throw new Error(`forecast: the covariance assembled for the Fisher matrix (ln det ${logDeterminant}) disagrees with the likelihood's (${expected})`);
  }
  return { names: used, information };
}

/** C at the truth: the systematic matrix off the diagonal, the Hubble-diagram variances (the whole diagonal of C, systematics included) on it. */
function denseCovariance(variances: Float64Array, systematic: Float64Array | null, n: number): Float64Array {
  const covariance = new Float64Array(n * n);
  if (systematic) covariance.set(systematic);
  for (let a = 0; a < n; a++) covariance[a * n + a] = variances[a];
  return covariance;
}

function notPositiveDefinite(where: string, found: string): CandelaError {
  return new CandelaError({
    code: 'forecast.covariance_not_positive_definite', path: where,
    message: 'the covariance of the noise-free survey is not positive definite', found,
    fix: 'check the error models and the systematic settings of the survey',
  });
}

/**
 * The information matrix of covarianceInformation for C = D + U U^T without
 * an N x N matrix (the formula in covariancePart's comment). D is the
 * Hubble-diagram variances minus the modes' share |U_a|^2.
 */
function lowRankInformation(
  variances: Float64Array, modes: SystematicModes, derivatives: readonly Float64Array[],
): { information: Float64Array; logDeterminant: number } {
  const { count: n, modeCount: k, values: u } = modes;
  const diagonal = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    let share = 0;
    for (let p = 0; p < k; p++) share += u[a * k + p] * u[a * k + p];
    diagonal[a] = variances[a] - share;
    if (!(diagonal[a] > 0)) throw notPositiveDefinite(`supernova ${a + 1}`, `diagonal variance ${diagonal[a]}`);
  }
  // V = D^-1/2 U and the Cholesky factor L of I + V^T V, as the likelihood's Woodbury path builds them.
  const { inverseDeviation, scaledModes, capacitanceFactor, logDeterminantDiagonal, logDeterminantCapacitance } = buildLowRankCapacitance(diagonal, u);
  const logDeterminant = logDeterminantDiagonal + logDeterminantCapacitance;
  // W = D^-1 U L^-T, row by row: L w_a = U_a / D_a = s_a V_a; and the diagonal weight 1/D_a^2 - 2 |W_a|^2 / D_a.
  const w = new Float64Array(n * k);
  const weight = new Float64Array(n);
  for (let a = 0; a < n; a++) {
    const row = w.subarray(a * k, a * k + k);
    for (let p = 0; p < k; p++) row[p] = scaledModes[p * n + a] * inverseDeviation[a];
    solveLowerInPlace(capacitanceFactor, k, row);
    let norm = 0;
    for (let p = 0; p < k; p++) norm += row[p] * row[p];
    weight[a] = 1 / (diagonal[a] * diagonal[a]) - (2 * norm) / diagonal[a];
  }
  const gram = derivatives.map((d) => {
    const g = new Float64Array(k * k);
    for (let a = 0; a < n; a++) {
      for (let p = 0; p < k; p++) {
        const left = d[a] * w[a * k + p];
        for (let q = 0; q < k; q++) g[p * k + q] += left * w[a * k + q];
      }
    }
    return g;
  });
  const count = derivatives.length;
  const information = new Float64Array(count * count);
  for (let i = 0; i < count; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let a = 0; a < n; a++) sum += derivatives[i][a] * derivatives[j][a] * weight[a];
      for (let p = 0; p < k * k; p++) sum += gram[i][p] * gram[j][p];
      information[i * count + j] = 0.5 * sum;
      information[j * count + i] = 0.5 * sum;
    }
  }
  return { information, logDeterminant };
}
