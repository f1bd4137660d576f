/**
 * Blocked, register-tiled Cholesky factorization in plain TypeScript on a
 * row-major Float64Array: the portable fast kernel behind choleskyInPlace.
 *
 * Algorithm: left-looking blocked Cholesky (Golub & Van Loan, Matrix
 * Computations, 4th ed., section 4.2.9, "block Cholesky"; the level-3 form
 * of Dongarra, Du Croz, Duff & Hammarling 1990). Row panel I of
 * BLOCK_ROWS rows meets every column panel J <= I: first the product update
 * A[I][J] -= L[I][0:j0] L[J][0:j0]^T over DEPTH-long slices of k (so that
 * both slices stay in the core's private cache), then panel J is finished
 * 4 x 4 tile by tile with the same update over [j0, jt) and a small scalar
 * triangle. Every update goes through a 4 x 4 register tile: 16 running sums
 * fed by 8 loads per step of k, instead of one sum per dot product, which
 * breaks the add-latency chain of the row-oriented kernel and reuses each
 * loaded value four times.
 *
 * Rows are L's rows, contiguous in k, so every inner loop walks memory with
 * stride 1. Results equal the row-oriented reference up to rounding (the sums
 * are taken in another order).
 */
import type { CholeskyFailure, CholeskySuccess } from './cholesky.js';

/** Rows (and columns) per panel; 64 x DEPTH doubles = 128 KB per panel slice. */
export const BLOCK_ROWS = 64;
/** Length of the k slices of the panel update. */
export const BLOCK_DEPTH = 256;
/** Register tile edge. */
const TILE = 4;

/**
 * A[i..i+3][j..j+3] -= sum_{k0 <= k < k1} L[i+r][k] L[j+c][k], a full 4 x 4 tile.
 * Also writes the strict upper part of a tile that straddles the diagonal;
 * those cells are zeroed at the end.
 */
function subtractTile(a: Float64Array, n: number, i: number, j: number, k0: number, k1: number): void {
  const r0 = i * n;
  const r1 = r0 + n;
  const r2 = r1 + n;
  const r3 = r2 + n;
  const c0 = j * n;
  const c1 = c0 + n;
  const c2 = c1 + n;
  const c3 = c2 + n;
  let s00 = 0, s01 = 0, s02 = 0, s03 = 0;
  let s10 = 0, s11 = 0, s12 = 0, s13 = 0;
  let s20 = 0, s21 = 0, s22 = 0, s23 = 0;
  let s30 = 0, s31 = 0, s32 = 0, s33 = 0;
  for (let k = k0; k < k1; k++) {
    const b0 = a[c0 + k];
    const b1 = a[c1 + k];
    const b2 = a[c2 + k];
    const b3 = a[c3 + k];
    let x = a[r0 + k];
    s00 += x * b0; s01 += x * b1; s02 += x * b2; s03 += x * b3;
    x = a[r1 + k];
    s10 += x * b0; s11 += x * b1; s12 += x * b2; s13 += x * b3;
    x = a[r2 + k];
    s20 += x * b0; s21 += x * b1; s22 += x * b2; s23 += x * b3;
    x = a[r3 + k];
    s30 += x * b0; s31 += x * b1; s32 += x * b2; s33 += x * b3;
  }
  a[r0 + j] -= s00; a[r0 + j + 1] -= s01; a[r0 + j + 2] -= s02; a[r0 + j + 3] -= s03;
  a[r1 + j] -= s10; a[r1 + j + 1] -= s11; a[r1 + j + 2] -= s12; a[r1 + j + 3] -= s13;
  a[r2 + j] -= s20; a[r2 + j + 1] -= s21; a[r2 + j + 2] -= s22; a[r2 + j + 3] -= s23;
  a[r3 + j] -= s30; a[r3 + j + 1] -= s31; a[r3 + j + 2] -= s32; a[r3 + j + 3] -= s33;
}

/** The same update for a partial tile (rows or columns < 4) at the matrix edge. */
function subtractEdgeTile(a: Float64Array, n: number, i: number, rows: number, j: number, columns: number, k0: number, k1: number): void {
  for (let row = i; row < i + rows; row++) {
    const r = row * n;
    for (let column = j; column < j + columns; column++) {
      const c = column * n;
      let sum = 0;
      for (let k = k0; k < k1; k++) sum += a[r + k] * a[c + k];
      a[r + column] -= sum;
    }
  }
}

/** Tile update of rows [i, i+rows) and columns [j, j+columns) over k in [k0, k1). */
function subtractBlock(a: Float64Array, n: number, i: number, rows: number, j: number, columns: number, k0: number, k1: number): void {
  if (rows === TILE && columns === TILE) subtractTile(a, n, i, j, k0, k1);
  else subtractEdgeTile(a, n, i, rows, j, columns, k0, k1);
}

/**
 * Factorizes the symmetric positive-definite n x n matrix `a` (row major) in
 * place into its lower Cholesky factor L (a = L L^T), strict upper triangle
 * set to zero; only the lower triangle is read. Same contract as the
 * reference kernel: never throws, and on failure returns the first row whose
 * pivot was not positive (then `a` holds partial work).
 *
 * Cost: n^3/6 multiply-adds (n^3/3 flops), about 5 GFLOP/s in Node.js 20 on
 * one core of the project's machine (bench/RESULTS.md).
 * @param a row-major n x n matrix, overwritten by L
 * @param n dimension
 * @example blockedCholeskyInPlace(Float64Array.of(4, 2, 2, 3), 2) // a becomes [2, 0, 1, 1.414...]
 */
export function blockedCholeskyInPlace(a: Float64Array, n: number): CholeskySuccess | CholeskyFailure {
  let smallestPivot = Infinity;
  for (let i0 = 0; i0 < n; i0 += BLOCK_ROWS) {
    const i1 = Math.min(i0 + BLOCK_ROWS, n);
    for (let j0 = 0; j0 <= i0; j0 += BLOCK_ROWS) {
      const j1 = Math.min(j0 + BLOCK_ROWS, n);
      const diagonal = j0 === i0;
      // Panel update with the finished columns [0, j0), k sliced for cache reuse.
      for (let k0 = 0; k0 < j0; k0 += BLOCK_DEPTH) {
        const k1 = Math.min(k0 + BLOCK_DEPTH, j0);
        for (let i = i0; i < i1; i += TILE) {
          const rows = Math.min(TILE, i1 - i);
          const jEnd = diagonal ? Math.min(i + TILE, j1) : j1;
          for (let j = j0; j < jEnd; j += TILE) subtractBlock(a, n, i, rows, j, Math.min(TILE, jEnd - j), k0, k1);
        }
      }
      // Finish panel J tile by tile: columns [j0, jt) first, then the tile's own triangle.
      for (let it = i0; it < i1; it += TILE) {
        const ie = Math.min(it + TILE, i1);
        const jEnd = diagonal ? ie : j1;
        for (let jt = j0; jt < jEnd; jt += TILE) {
          const je = Math.min(jt + TILE, jEnd);
          if (jt > j0) subtractBlock(a, n, it, ie - it, jt, je - jt, j0, jt);
          for (let j = jt; j < je; j++) {
            const rowJ = j * n;
            if (j >= it) {
              // Row j's own pivot lies in this tile (panels on the diagonal only).
              let pivot = a[rowJ + j];
              for (let k = jt; k < j; k++) pivot -= a[rowJ + k] * a[rowJ + k];
              if (!(pivot > 0)) return { ok: false, index: j, pivot };
              smallestPivot = Math.min(smallestPivot, pivot);
              a[rowJ + j] = Math.sqrt(pivot);
            }
            const diagonalJ = a[rowJ + j];
            for (let i = Math.max(it, j + 1); i < ie; i++) {
              const rowI = i * n;
              let sum = a[rowI + j];
              for (let k = jt; k < j; k++) sum -= a[rowI + k] * a[rowJ + k];
              a[rowI + j] = sum / diagonalJ;
            }
          }
        }
      }
    }
  }
  for (let i = 0; i < n; i++) a.fill(0, i * n + i + 1, (i + 1) * n);
  return { ok: true, smallestPivot };
}
