/**
 * Dense Cholesky factorization and triangular solves on row-major
 * Float64Array matrices. Hand-written because these are the likelihood's hot
 * path (no JS linear-algebra package works in place on typed arrays without
 * allocation). Algorithm: the row-oriented Cholesky-Banachiewicz form
 * (Golub & Van Loan, Matrix Computations, 4th ed., algorithm 4.2.1).
 */

/** Why a factorization failed: the first non-positive pivot and its index. */
export interface CholeskyFailure {
  ok: false;
  /** 0-based row at which the pivot was not positive. */
  index: number;
  /** The pivot value found (<= 0 or NaN). */
  pivot: number;
}

/** Success marker with the smallest pivot (diagonal of L squared) seen. */
export interface CholeskySuccess {
  ok: true;
  /** Smallest squared diagonal entry of L, a cheap conditioning hint. */
  smallestPivot: number;
}

/**
 * Factorizes the symmetric positive-definite n x n matrix `a` (row major)
 * in place into its lower Cholesky factor L (a = L L^T); the strict upper
 * triangle is set to zero. Only the lower triangle of `a` is read.
 *
 * Cost: n^3/3 multiply-adds. Never throws: returns a failure record naming
 * the first pivot that was not positive.
 * @example choleskyInPlace(Float64Array.of(4, 2, 2, 3), 2) // a becomes [2,0,1,1.414...]
 */
export function choleskyInPlace(a: Float64Array, n: number): CholeskySuccess | CholeskyFailure {
  let smallestPivot = Infinity;
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    for (let j = 0; j <= i; j++) {
      const rowJ = j * n;
      let sum = a[rowI + j];
      for (let k = 0; k < j; k++) sum -= a[rowI + k] * a[rowJ + k];
      if (i === j) {
        if (!(sum > 0)) return { ok: false, index: i, pivot: sum };
        if (sum < smallestPivot) smallestPivot = sum;
        a[rowI + i] = Math.sqrt(sum);
      } else {
        a[rowI + j] = sum / a[rowJ + j];
      }
    }
    for (let j = i + 1; j < n; j++) a[rowI + j] = 0;
  }
  return { ok: true, smallestPivot };
}

/**
 * Solves L y = b in place (forward substitution), L lower triangular row major.
 * Cost: n^2/2 multiply-adds.
 */
export function solveLowerInPlace(lower: Float64Array, n: number, b: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let sum = b[i];
    for (let k = 0; k < i; k++) sum -= lower[row + k] * b[k];
    b[i] = sum / lower[row + i];
  }
  return b;
}

/**
 * Solves L^T x = y in place (back substitution), L lower triangular row major.
 * Cost: n^2/2 multiply-adds.
 */
export function solveUpperTransposedInPlace(lower: Float64Array, n: number, y: Float64Array): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    let sum = y[i];
    for (let k = i + 1; k < n; k++) sum -= lower[k * n + i] * y[k];
    y[i] = sum / lower[i * n + i];
  }
  return y;
}

/** Solves (L L^T) x = b in place. Cost: n^2 multiply-adds. */
export function choleskySolveInPlace(lower: Float64Array, n: number, b: Float64Array): Float64Array {
  solveLowerInPlace(lower, n, b);
  return solveUpperTransposedInPlace(lower, n, b);
}

/** ln det(A) = 2 sum ln L_ii from the Cholesky factor L of A. */
export function logDeterminantFromCholesky(lower: Float64Array, n: number): number {
  let sum = 0;
  for (let i = 0; i < n; i++) sum += Math.log(lower[i * n + i]);
  return 2 * sum;
}
