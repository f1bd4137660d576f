/**
 * Dense Cholesky factorization and triangular solves on row-major
 * Float64Array matrices. Hand-written because these are the likelihood's hot
 * path (no JS linear-algebra package works in place on typed arrays without
 * allocation).
 *
 * `choleskyInPlace` picks the fastest kernel available: from
 * SMALL_CHOLESKY_DIMENSION to 16,000, the WebAssembly SIMD kernel
 * (wasmCholesky.ts) when the runtime has WebAssembly SIMD, else the blocked,
 * register-tiled TypeScript kernel (blockedCholesky.ts), and for small
 * matrices the row-oriented Cholesky-Banachiewicz form (Golub & Van Loan,
 * Matrix Computations, 4th ed., algorithm 4.2.1), kept as
 * `referenceCholeskyInPlace`: the reference the faster kernels are tested
 * against and the baseline of the benchmark.
 */
import { blockedCholeskyInPlace } from './blockedCholesky.js';
import { wasmCholeskyAvailable, wasmCholeskyInPlace } from './wasmCholesky.js';

/** Below this dimension the row-oriented kernel is used (tiles and copies do not pay off; same results as before for small matrices). */
export const SMALL_CHOLESKY_DIMENSION = 32;
/** Above this dimension the matrix (8 n^2 bytes) would not fit the 2 GB the WebAssembly kernel addresses: the TypeScript kernel takes it. */
const WASM_MAX_DIMENSION = 16_000;

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
 * Dispatches to the fastest kernel (see the top of this file); all agree
 * with `referenceCholeskyInPlace` to rounding (tested to 1e-10 of each
 * row's norm).
 *
 * Cost: n^3/6 multiply-adds (n^3/3 flops). Never throws: returns a failure
 * record naming the first pivot that was not positive (then `a` holds
 * partial work).
 * @example choleskyInPlace(Float64Array.of(4, 2, 2, 3), 2) // a becomes [2,0,1,1.414...]
 */
export function choleskyInPlace(a: Float64Array, n: number): CholeskySuccess | CholeskyFailure {
  if (n < SMALL_CHOLESKY_DIMENSION) return referenceCholeskyInPlace(a, n);
  if (n <= WASM_MAX_DIMENSION && wasmCholeskyAvailable()) return wasmCholeskyInPlace(a, n);
  return blockedCholeskyInPlace(a, n);
}

/**
 * The row-oriented reference kernel (Cholesky-Banachiewicz, Golub & Van Loan
 * algorithm 4.2.1): one dot product per entry, one running sum each.
 * Factorizes the symmetric positive-definite n x n matrix `a` (row major)
 * in place into its lower Cholesky factor L (a = L L^T); the strict upper
 * triangle is set to zero. Only the lower triangle of `a` is read.
 *
 * Cost: n^3/6 multiply-adds (n^3/3 flops), 0.3 to 2 GFLOP/s in Node.js 20:
 * each sum waits for the previous add, and every row j is reread from memory
 * for each row i. Never throws: returns a failure record naming the first
 * pivot that was not positive.
 * @example referenceCholeskyInPlace(Float64Array.of(4, 2, 2, 3), 2) // a becomes [2,0,1,1.414...]
 */
export function referenceCholeskyInPlace(a: Float64Array, n: number): CholeskySuccess | CholeskyFailure {
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
 * Each row's dot product runs in four interleaved partial sums (no waiting on
 * the previous add).
 * Cost: n^2/2 multiply-adds.
 */
export function solveLowerInPlace(lower: Float64Array, n: number, b: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let s0 = 0;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    let k = 0;
    for (; k + 3 < i; k += 4) {
      s0 += lower[row + k] * b[k];
      s1 += lower[row + k + 1] * b[k + 1];
      s2 += lower[row + k + 2] * b[k + 2];
      s3 += lower[row + k + 3] * b[k + 3];
    }
    for (; k < i; k++) s0 += lower[row + k] * b[k];
    b[i] = (b[i] - ((s0 + s1) + (s2 + s3))) / lower[row + i];
  }
  return b;
}

/**
 * Solves L^T x = y in place (back substitution), L lower triangular row major.
 * Column-oriented: once x_i is known, x_i times row i of L is subtracted from
 * y[0..i), so L is read along its rows (stride 1).
 * Cost: n^2/2 multiply-adds.
 */
export function solveUpperTransposedInPlace(lower: Float64Array, n: number, y: Float64Array): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    const x = y[i] / lower[row + i];
    y[i] = x;
    for (let k = 0; k < i; k++) y[k] -= x * lower[row + k];
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
