// AssemblyScript source of the WebAssembly SIMD Cholesky kernel (compiled by `npm run build:wasm`
// into src/math/wasmCholeskyBinary.ts; loaded by src/math/wasmCholesky.ts). Not TypeScript: the
// types i32, usize, f64, v128 and the load/store builtins are AssemblyScript's.
//
// Same algorithm as src/math/blockedCholesky.ts: left-looking blocked Cholesky (Golub & Van Loan,
// Matrix Computations, 4th ed., section 4.2.9; Dongarra, Du Croz, Duff & Hammarling 1990), on a
// row-major matrix of doubles at `base`. The product updates run through a 2 x 4 register tile of
// f64x2 sums along k (two k per step, eight 128-bit sums, lanes added at the end).

/** Rows and columns per panel, and length of the k slices (as in blockedCholesky.ts). */
const BLOCK_ROWS: i32 = 64;
const BLOCK_DEPTH: i32 = 256;

let smallestPivotSeen: f64 = Infinity;
let failedPivotValue: f64 = 0;

/** Smallest squared diagonal entry of the last successful factorization. */
export function smallestPivot(): f64 {
  return smallestPivotSeen;
}

/** The pivot found at the failing row of the last failed factorization. */
export function failedPivot(): f64 {
  return failedPivotValue;
}

/** Grows the memory to hold an n x n matrix of doubles; returns its byte offset (16-byte aligned). */
export function reserveMatrix(n: i32): usize {
  const base: usize = (__heap_base + 15) & ~(<usize>15);
  const needed: usize = base + (<usize>n) * (<usize>n) * 8;
  const available: usize = (<usize>memory.size()) << 16;
  if (needed > available) {
    if (memory.grow(<i32>((needed - available + 0xffff) >> 16)) < 0) return 0;
  }
  return base;
}

@inline function at(base: usize, n: i32, row: i32, column: i32): usize {
  return base + ((<usize>row * <usize>n + <usize>column) << 3);
}

@inline function sumLanes(v: v128): f64 {
  return f64x2.extract_lane(v, 0) + f64x2.extract_lane(v, 1);
}

/** A[i..i+1][j..j+3] -= sum over k in [k0, k1) of L[i+r][k] L[j+c][k]: the 2 x 4 SIMD tile. */
function subtractTile(base: usize, n: i32, i: i32, j: i32, k0: i32, k1: i32): void {
  const stride: usize = <usize>n << 3;
  const a0 = at(base, n, i, 0);
  const a1 = a0 + stride;
  const b0 = at(base, n, j, 0);
  const b1 = b0 + stride;
  const b2 = b1 + stride;
  const b3 = b2 + stride;
  let s00 = f64x2.splat(0), s01 = f64x2.splat(0), s02 = f64x2.splat(0), s03 = f64x2.splat(0);
  let s10 = f64x2.splat(0), s11 = f64x2.splat(0), s12 = f64x2.splat(0), s13 = f64x2.splat(0);
  let k = k0;
  for (; k + 1 < k1; k += 2) {
    const offset: usize = <usize>k << 3;
    const c0 = v128.load(b0 + offset);
    const c1 = v128.load(b1 + offset);
    const c2 = v128.load(b2 + offset);
    const c3 = v128.load(b3 + offset);
    let x = v128.load(a0 + offset);
    s00 = f64x2.add(s00, f64x2.mul(x, c0));
    s01 = f64x2.add(s01, f64x2.mul(x, c1));
    s02 = f64x2.add(s02, f64x2.mul(x, c2));
    s03 = f64x2.add(s03, f64x2.mul(x, c3));
    x = v128.load(a1 + offset);
    s10 = f64x2.add(s10, f64x2.mul(x, c0));
    s11 = f64x2.add(s11, f64x2.mul(x, c1));
    s12 = f64x2.add(s12, f64x2.mul(x, c2));
    s13 = f64x2.add(s13, f64x2.mul(x, c3));
  }
  let t00 = sumLanes(s00), t01 = sumLanes(s01), t02 = sumLanes(s02), t03 = sumLanes(s03);
  let t10 = sumLanes(s10), t11 = sumLanes(s11), t12 = sumLanes(s12), t13 = sumLanes(s13);
  if (k < k1) {
    const offset: usize = <usize>k << 3;
    const c0 = load<f64>(b0 + offset), c1 = load<f64>(b1 + offset), c2 = load<f64>(b2 + offset), c3 = load<f64>(b3 + offset);
    const x0 = load<f64>(a0 + offset), x1 = load<f64>(a1 + offset);
    t00 += x0 * c0; t01 += x0 * c1; t02 += x0 * c2; t03 += x0 * c3;
    t10 += x1 * c0; t11 += x1 * c1; t12 += x1 * c2; t13 += x1 * c3;
  }
  const d0 = a0 + (<usize>j << 3);
  const d1 = a1 + (<usize>j << 3);
  store<f64>(d0, load<f64>(d0) - t00); store<f64>(d0 + 8, load<f64>(d0 + 8) - t01);
  store<f64>(d0 + 16, load<f64>(d0 + 16) - t02); store<f64>(d0 + 24, load<f64>(d0 + 24) - t03);
  store<f64>(d1, load<f64>(d1) - t10); store<f64>(d1 + 8, load<f64>(d1 + 8) - t11);
  store<f64>(d1 + 16, load<f64>(d1 + 16) - t12); store<f64>(d1 + 24, load<f64>(d1 + 24) - t13);
}

/** The same update for one entry (edges of the matrix): A[i][j] -= sum over k in [k0, k1) of L[i][k] L[j][k]. */
function subtractEntry(base: usize, n: i32, i: i32, j: i32, k0: i32, k1: i32): void {
  const rowI = at(base, n, i, 0);
  const rowJ = at(base, n, j, 0);
  let sum: f64 = 0;
  for (let k = k0; k < k1; k++) sum += load<f64>(rowI + (<usize>k << 3)) * load<f64>(rowJ + (<usize>k << 3));
  const cell = rowI + (<usize>j << 3);
  store<f64>(cell, load<f64>(cell) - sum);
}

/** Update of rows [i0, i1) x columns [j0, j1) over k in [k0, k1), in 2 x 4 tiles; edges one entry at a time. */
function subtractBlock(base: usize, n: i32, i0: i32, i1: i32, j0: i32, j1: i32, k0: i32, k1: i32): void {
  if (k1 <= k0) return;
  let i = i0;
  for (; i + 1 < i1; i += 2) {
    let j = j0;
    for (; j + 3 < j1; j += 4) subtractTile(base, n, i, j, k0, k1);
    for (; j < j1; j++) {
      subtractEntry(base, n, i, j, k0, k1);
      subtractEntry(base, n, i + 1, j, k0, k1);
    }
  }
  if (i < i1) for (let j = j0; j < j1; j++) subtractEntry(base, n, i, j, k0, k1);
}

/**
 * Factorizes the n x n matrix at `base` in place into its lower Cholesky factor (strict upper
 * triangle zeroed). Returns -1 on success, else the first row whose pivot was not positive
 * (its value: failedPivot()).
 */
export function factorize(base: usize, n: i32): i32 {
  let smallest: f64 = Infinity;
  for (let i0 = 0; i0 < n; i0 += BLOCK_ROWS) {
    const i1 = min(i0 + BLOCK_ROWS, n);
    for (let j0 = 0; j0 <= i0; j0 += BLOCK_ROWS) {
      const j1 = min(j0 + BLOCK_ROWS, n);
      const diagonal = j0 == i0;
      for (let k0 = 0; k0 < j0; k0 += BLOCK_DEPTH) {
        const k1 = min(k0 + BLOCK_DEPTH, j0);
        for (let i = i0; i < i1; i += 2) {
          const rowsEnd = min(i + 2, i1);
          // On the diagonal panel only columns up to the tile's last row are needed (whole 4-column tiles).
          const jEnd = diagonal ? min(j0 + (((rowsEnd - j0) + 3) & ~3), j1) : j1;
          subtractBlock(base, n, i, rowsEnd, j0, jEnd, k0, k1);
        }
      }
      for (let it = i0; it < i1; it += 4) {
        const ie = min(it + 4, i1);
        const jEnd = diagonal ? ie : j1;
        for (let jt = j0; jt < jEnd; jt += 4) {
          const je = min(jt + 4, jEnd);
          subtractBlock(base, n, it, ie, jt, je, j0, jt);
          for (let j = jt; j < je; j++) {
            const rowJ = at(base, n, j, 0);
            if (j >= it) {
              let pivot = load<f64>(rowJ + (<usize>j << 3));
              for (let k = jt; k < j; k++) {
                const value = load<f64>(rowJ + (<usize>k << 3));
                pivot -= value * value;
              }
              if (!(pivot > 0)) {
                failedPivotValue = pivot;
                return j;
              }
              smallest = min(smallest, pivot);
              store<f64>(rowJ + (<usize>j << 3), sqrt<f64>(pivot));
            }
            const diagonalJ = load<f64>(rowJ + (<usize>j << 3));
            for (let i = max(it, j + 1); i < ie; i++) {
              const rowI = at(base, n, i, 0);
              let sum = load<f64>(rowI + (<usize>j << 3));
              for (let k = jt; k < j; k++) sum -= load<f64>(rowI + (<usize>k << 3)) * load<f64>(rowJ + (<usize>k << 3));
              store<f64>(rowI + (<usize>j << 3), sum / diagonalJ);
            }
          }
        }
      }
    }
  }
  for (let i = 0; i < n; i++) memory.fill(at(base, n, i, i + 1), 0, <usize>(n - i - 1) << 3);
  smallestPivotSeen = smallest;
  return -1;
}
