import { choleskyInPlace, logDeterminantFromCholesky, solveLowerInPlace } from '../math/index.js';

/**
 * A covariance C = L L^T prepared for whitening: v -> L^-1 v, so that
 * r^T C^-1 r = |L^-1 r|^2 without ever forming C^-1.
 *
 * Fill `matrix` (dense: row-major size x size, only the lower triangle is read;
 * diagonal and low_rank: the size variances of the diagonal part), then call
 * `factorize()`; the buffer is then overwritten by the factor (dense) or the
 * standard deviations (diagonal), and kept as given (low_rank). A low_rank
 * whitener's operator W is not triangular (see createModesWhitener).
 */
export interface Whitener {
  readonly kind: 'dense' | 'diagonal' | 'low_rank';
  readonly size: number;
  /** Input buffer for C (see above), in squared data units (mag^2). */
  readonly matrix: Float64Array;
  /** Factorizes what `matrix` holds. Returns null on success, or why C is not positive definite. */
  factorize(): string | null;
  /** ln det C after a successful factorize(). */
  readonly logDeterminant: number;
  /** v <- L^-1 v (first `size` entries). Dense O(size^2/2), diagonal O(size), low_rank O(2 size K). */
  whitenInPlace(v: Float64Array): void;
}

/**
 * A dense whitener by Cholesky factorization (Golub & Van Loan, Matrix
 * Computations, algorithm 4.2.1) and forward substitution.
 * Cost: factorize size^3/3 multiply-adds; whitenInPlace size^2/2. Allocates
 * one size x size buffer here, nothing per call.
 * @param size matrix dimension N
 * @example const w = createDenseWhitener(2); w.matrix.set([4, 2, 2, 3]); w.factorize(); // null
 */
export function createDenseWhitener(size: number): Whitener {
  const matrix = new Float64Array(size * size);
  let logDeterminant = NaN;
  return {
    kind: 'dense',
    size,
    matrix,
    get logDeterminant() {
      return logDeterminant;
    },
    factorize() {
      const result = choleskyInPlace(matrix, size);
      if (!result.ok) {
        logDeterminant = NaN;
        return `covariance matrix is not positive definite (pivot ${result.pivot.toPrecision(3)} at row ${result.index + 1})`;
      }
      logDeterminant = logDeterminantFromCholesky(matrix, size);
      return null;
    },
    whitenInPlace(v) {
      solveLowerInPlace(matrix, size, v);
    },
  };
}

/**
 * A diagonal whitener: C = diag(variance), L = diag(sqrt(variance)).
 * Cost: factorize and whitenInPlace O(size).
 * @param size number of variances N
 * @example const w = createDiagonalWhitener(2); w.matrix.set([4, 9]); w.factorize(); w.logDeterminant // ln 36
 */
export function createDiagonalWhitener(size: number): Whitener {
  const matrix = new Float64Array(size);
  let logDeterminant = NaN;
  return {
    kind: 'diagonal',
    size,
    matrix,
    get logDeterminant() {
      return logDeterminant;
    },
    factorize() {
      let sum = 0;
      for (let i = 0; i < size; i++) {
        const variance = matrix[i];
        if (!(variance > 0) || variance === Infinity) {
          logDeterminant = NaN;
          return `variance ${variance} of row ${i + 1} is not a positive finite number`;
        }
        sum += Math.log(variance);
        matrix[i] = Math.sqrt(variance);
      }
      logDeterminant = sum;
      return null;
    },
    whitenInPlace(v) {
      for (let i = 0; i < size; i++) v[i] /= matrix[i];
    },
  };
}
