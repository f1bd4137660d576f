import { CandelaError } from '../errors.js';
import { choleskyInPlace, logDeterminantFromCholesky } from '../math/index.js';

/**
 * The covariance part of the Gaussian Fisher matrix,
 *
 *   F_ij = 1/2 tr(C^-1 C_,i C^-1 C_,j)
 *
 * (Tegmark, Taylor & Heavens 1997, ApJ 480, 22, eq. 15 from memory), for parameters that
 * change only the diagonal of C (C_,i = diag(d_i)), where it reduces to
 * 1/2 sum_ab (C^-1)_ab^2 d_i,a d_j,b. The entries of C^-1 are needed one by
 * one here, so the inverse is formed from the Cholesky factor:
 * C^-1 = L^-T L^-1 with L^-1 from forward substitution on unit vectors.
 * Cost: n^3/3 (factorization) + n^3/6 (L^-1) + n^3/6 (C^-1) + O(n^2 k) for
 * k derivatives; n^2 doubles of extra memory twice.
 * @param covariance the n x n covariance at the evaluation point, row major, mag^2.
 * @param n its dimension.
 * @param derivatives per parameter, the n derivatives of the diagonal, mag^2 per parameter unit.
 * @returns the k x k information matrix (row major) and ln det C.
 * @throws CandelaError `forecast.covariance_not_positive_definite` when C cannot be factorized.
 * @example covarianceInformation(Float64Array.of(2, 0, 0, 2), 2, [Float64Array.of(2, 2)]).information // [1]
 */
export function covarianceInformation(
  covariance: Float64Array, n: number, derivatives: readonly Float64Array[],
): { information: Float64Array; logDeterminant: number } {
  const factor = Float64Array.from(covariance);
  const outcome = choleskyInPlace(factor, n);
  if (!outcome.ok) {
    throw new CandelaError({
      code: 'forecast.covariance_not_positive_definite', path: `supernova ${outcome.index + 1}`,
      message: 'the covariance of the noise-free survey is not positive definite', found: `pivot ${outcome.pivot}`,
      fix: 'check the error models and the systematic settings of the survey',
    });
  }
  const logDeterminant = logDeterminantFromCholesky(factor, n);
  const inverseFactor = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    inverseFactor[j * n + j] = 1 / factor[j * n + j];
    for (let i = j + 1; i < n; i++) {
      let sum = 0;
      for (let k = j; k < i; k++) sum += factor[i * n + k] * inverseFactor[k * n + j];
      inverseFactor[i * n + j] = -sum / factor[i * n + i];
    }
  }
  // (C^-1)_ab = sum_{k >= max(a, b)} W_ka W_kb with W = L^-1; upper triangle then mirrored.
  const inverse = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const row = k * n;
    for (let a = 0; a <= k; a++) {
      const weight = inverseFactor[row + a];
      if (weight === 0) continue;
      const target = a * n;
      for (let b = a; b <= k; b++) inverse[target + b] += weight * inverseFactor[row + b];
    }
  }
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const squared = inverse[a * n + b] * inverse[a * n + b];
      inverse[a * n + b] = squared;
      inverse[b * n + a] = squared;
    }
  }
  const count = derivatives.length;
  const information = new Float64Array(count * count);
  const weighted = new Float64Array(n);
  for (let j = 0; j < count; j++) {
    const dj = derivatives[j];
    for (let a = 0; a < n; a++) {
      let sum = 0;
      const row = a * n;
      for (let b = 0; b < n; b++) sum += inverse[row + b] * dj[b];
      weighted[a] = sum;
    }
    for (let i = 0; i <= j; i++) {
      let sum = 0;
      for (let a = 0; a < n; a++) sum += derivatives[i][a] * weighted[a];
      information[i * count + j] = 0.5 * sum;
      information[j * count + i] = 0.5 * sum;
    }
  }
  return { information, logDeterminant };
}
