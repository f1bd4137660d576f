import { CandelaError } from '../errors.js';
import { choleskyInPlace, logDeterminantFromCholesky } from '../math/index.js';

/**
 * The set-up shared by every evaluation of a covariance C = D + U U^T
 * (private helper of {@link createLowRankGaussian}): the inverse standard
 * deviations s_i = D_ii^-1/2, the scaled modes V = D^-1/2 U (stored mode by
 * mode, K x N, so that each V^T y is K contiguous dot products), and the
 * Cholesky factor L of the K x K capacitance matrix S = I + V^T V
 * (Woodbury 1950; Hager 1989, SIAM Review 31, 221).
 */
export interface LowRankCapacitance {
  readonly size: number;
  readonly modeCount: number;
  /** s_i = 1/sqrt(D_ii), 1/mag. */
  readonly inverseDeviation: Float64Array;
  /** V^T, K x N row major: scaledModes[k * N + i] = U_ik / sqrt(D_ii), dimensionless. */
  readonly scaledModes: Float64Array;
  /** Lower Cholesky factor of S = I + V^T V, K x K row major. */
  readonly capacitanceFactor: Float64Array;
  /** ln det D = sum_i ln D_ii (ln mag^2 per entry). */
  readonly logDeterminantDiagonal: number;
  /** ln det S, so that ln det C = ln det D + ln det S (matrix determinant lemma). */
  readonly logDeterminantCapacitance: number;
}

function shapeError(message: string, found: string, fix: string): CandelaError {
  return new CandelaError({ code: 'likelihood.low_rank_shape', path: 'modes', message, found, fix });
}

/**
 * Validates D and U and builds the capacitance factor.
 * Cost: N K^2/2 multiply-adds (S) + K^3/3 (its Cholesky) + N K (scaling);
 * memory: one N x K copy of the modes.
 * @param diagonalVariance D, N positive finite variances, mag^2
 * @param modes U, N x K row major, mag
 * @throws CandelaError `likelihood.low_rank_shape` (empty D, modes length not a multiple of N),
 *   `likelihood.low_rank_variance` (a variance not positive and finite), `likelihood.low_rank_mode` (a non-finite mode entry)
 */
export function buildLowRankCapacitance(diagonalVariance: Float64Array, modes: Float64Array): LowRankCapacitance {
  const size = diagonalVariance.length;
  if (size === 0) throw shapeError('the diagonal part of the covariance is empty', '0 variances', 'pass one variance per data point');
  if (modes.length % size !== 0) {
    throw shapeError(`modes must be N x K row major with N = ${size}, but their length is not a multiple of N`, `${modes.length} entries`, 'pass N x K numbers, mode values of one data point together');
  }
  const modeCount = modes.length / size;
  const inverseDeviation = new Float64Array(size);
  let logDeterminantDiagonal = 0;
  let compensation = 0;
  for (let i = 0; i < size; i++) {
    const variance = diagonalVariance[i];
    if (!(variance > 0) || variance === Infinity) {
      throw new CandelaError({
        code: 'likelihood.low_rank_variance', path: 'diagonalVariance', row: i + 1,
        message: `variance of row ${i + 1} is not a positive finite number`, expected: 'a variance > 0', found: String(variance),
      });
    }
    inverseDeviation[i] = 1 / Math.sqrt(variance);
    // Neumaier (1974) compensated sum of ln D_ii.
    const term = Math.log(variance);
    const next = logDeterminantDiagonal + term;
    compensation += Math.abs(logDeterminantDiagonal) >= Math.abs(term) ? logDeterminantDiagonal - next + term : term - next + logDeterminantDiagonal;
    logDeterminantDiagonal = next;
  }
  logDeterminantDiagonal += compensation;
  const scaledModes = new Float64Array(size * modeCount);
  for (let i = 0; i < size; i++) {
    for (let k = 0; k < modeCount; k++) {
      const value = modes[i * modeCount + k];
      if (!Number.isFinite(value)) {
        throw new CandelaError({
          code: 'likelihood.low_rank_mode', path: 'modes', row: i + 1,
          message: `mode ${k + 1} of row ${i + 1} is not a finite number`, expected: 'finite numbers', found: String(value),
        });
      }
      scaledModes[k * size + i] = value * inverseDeviation[i];
    }
  }
  const capacitanceFactor = new Float64Array(modeCount * modeCount);
  for (let k = 0; k < modeCount; k++) {
    const rowK = scaledModes.subarray(k * size, (k + 1) * size);
    for (let l = 0; l <= k; l++) capacitanceFactor[k * modeCount + l] = dot(rowK, scaledModes.subarray(l * size, (l + 1) * size), size);
    capacitanceFactor[k * modeCount + k] += 1;
  }
  // S = I + V^T V has every eigenvalue >= 1, so only non-finite input could make this fail.
  const factor = choleskyInPlace(capacitanceFactor, modeCount);
  if (!factor.ok) {
    throw new CandelaError({ code: 'likelihood.low_rank_mode', path: 'modes', message: `the capacitance matrix I + U^T D^-1 U is not positive definite (pivot ${factor.pivot} at mode ${factor.index + 1}); the modes are too large for double precision`, fix: 'rescale the modes or the variances' });
  }
  const logDeterminantCapacitance = logDeterminantFromCholesky(capacitanceFactor, modeCount);
  return { size, modeCount, inverseDeviation, scaledModes, capacitanceFactor, logDeterminantDiagonal, logDeterminantCapacitance };
}

/** sum_i a[i] b[i] over i < count with two interleaved accumulators (plain, not compensated: the inputs of S and V^T y). */
export function dot(a: Float64Array, b: Float64Array, count: number): number {
  let even = 0;
  let odd = 0;
  let i = 0;
  for (; i + 1 < count; i += 2) {
    even += a[i] * b[i];
    odd += a[i + 1] * b[i + 1];
  }
  if (i < count) even += a[i] * b[i];
  return even + odd;
}
