// Behaviour every Cholesky kernel must have, written once and run for each kernel: closed-form
// factors of classic test matrices, agreement with the row-oriented reference kernel, and the
// failure record. Sizes are chosen to cross the register tiles (4), the panels (64 rows) and
// the k slices (256) of the blocked kernels, with ragged edges.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  choleskyInPlace, referenceCholeskyInPlace, blockedCholeskyInPlace, wasmCholeskyInPlace, wasmCholeskyAvailable, logDeterminantFromCholesky,
  choleskySolveInPlace, createRandomStream,
} from '../../src/math/index.js';
import { CHOLESKY_WASM_SOURCE_SHA256 } from '../../src/math/wasmCholeskyBinary.js';
import { maxRowRelativeDifference } from '../../bench/factorization.js';
import type { CholeskyFailure, CholeskySuccess } from '../../src/math/index.js';

type Kernel = (a: Float64Array, n: number) => CholeskySuccess | CholeskyFailure;
const KERNELS: Array<[string, Kernel]> = [
  ['blockedCholeskyInPlace', blockedCholeskyInPlace],
  ['wasmCholeskyInPlace', wasmCholeskyInPlace],
  ['choleskyInPlace (dispatch)', choleskyInPlace],
];

describe('the WebAssembly SIMD kernel', () => {
  it('is available in Node.js 20 (WebAssembly SIMD is on by default since Node.js 16.4, from memory)', () => {
    expect(wasmCholeskyAvailable()).toBe(true);
  });
  it('was compiled from the AssemblyScript source in the repository as it is now (npm run build:wasm)', () => {
    const source = readFileSync('wasm/choleskyKernel.ts');
    expect(createHash('sha256').update(source).digest('hex')).toBe(CHOLESKY_WASM_SOURCE_SHA256);
  });
});

/** Agreement asked of every fast kernel: 1e-10 of the row's norm ||L_i|| = sqrt(A_ii) (common practice: a norm-wise relative bound, since entries that cancel to near zero have no meaningful elementwise relative error). */
const AGREEMENT = 1e-10;

function fill(n: number, entry: (i: number, j: number) => number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a[i * n + j] = entry(i, j);
  return a;
}

/** A covariance shaped like a supernova compilation's: diagonal errors plus a few smooth systematic modes (C = D + U U^T), seeded. */
function compilationLikeCovariance(n: number, modes: number, seed: string): Float64Array {
  const random = createRandomStream(seed);
  const u = Float64Array.from({ length: n * modes }, () => 0.02 * random.normal());
  return fill(n, (i, j) => {
    let sum = i === j ? 0.01 + 0.02 * random.uniform() : 0;
    for (let k = 0; k < modes; k++) sum += u[i * modes + k] * u[j * modes + k];
    return sum;
  });
}

describe.each(KERNELS)('%s', (_name, kernel) => {
  it('factorizes the Kac-Murdock-Szego matrix rho^|i-j| into its closed form (n = 333)', () => {
    // Kac, Murdock & Szego (1953) matrix; L[i][0] = rho^i, L[i][j] = rho^(i-j) sqrt(1 - rho^2) for 1 <= j <= i
    // (from memory; checked by multiplying out: the sum over k is a geometric series giving rho^(i-j)).
    const n = 333;
    const rho = 0.9;
    const a = fill(n, (i, j) => rho ** Math.abs(i - j));
    expect(kernel(a, n).ok).toBe(true);
    const c = Math.sqrt(1 - rho * rho);
    let worst = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const expected = j > i ? 0 : j === 0 ? rho ** i : rho ** (i - j) * c;
        worst = Math.max(worst, Math.abs(a[i * n + j] - expected));
      }
    }
    expect(worst).toBeLessThan(1e-12); // entries are <= 1: double-precision rounding over 333 terms (common practice)
  });

  it('solves with the Kac-Murdock-Szego factor to give its tridiagonal inverse, and its ln det (n = 301)', () => {
    // KMS inverse (from memory; checked by multiplying out): tridiagonal, diagonal (1, 1 + rho^2, ..., 1 + rho^2, 1) / (1 - rho^2),
    // off-diagonal -rho / (1 - rho^2); det = (1 - rho^2)^(n - 1), from the closed-form factor's diagonal.
    const n = 301;
    const rho = 0.6;
    const a = fill(n, (i, j) => rho ** Math.abs(i - j));
    expect(kernel(a, n).ok).toBe(true);
    expect(logDeterminantFromCholesky(a, n)).toBeCloseTo((n - 1) * Math.log(1 - rho * rho), 10);
    const scale = 1 / (1 - rho * rho);
    let worst = 0;
    for (const column of [0, 1, 150, 299, 300]) {
      const x = new Float64Array(n);
      x[column] = 1;
      choleskySolveInPlace(a, n, x);
      for (let i = 0; i < n; i++) {
        const expected = i === column ? (i === 0 || i === n - 1 ? 1 : 1 + rho * rho) * scale : Math.abs(i - column) === 1 ? -rho * scale : 0;
        worst = Math.max(worst, Math.abs(x[i] - expected));
      }
    }
    expect(worst).toBeLessThan(1e-12); // entries of size 1/(1 - rho^2) = 1.6: rounding only (common practice)
  });

  it('factorizes min(i, j) + 1 into the lower triangle of ones exactly (n = 331)', () => {
    // The covariance of a random walk: A = L L^T with L the lower-triangular matrix of ones (common practice;
    // every partial sum is a small integer, so the factor is exact in any summation order).
    const n = 331;
    const a = fill(n, (i, j) => Math.min(i, j) + 1);
    const result = kernel(a, n);
    expect(result).toEqual({ ok: true, smallestPivot: 1 });
    let mismatches = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (a[i * n + j] !== (j <= i ? 1 : 0)) mismatches++;
    expect(mismatches).toBe(0);
  });

  it('factorizes the symmetric Pascal matrix into the lower Pascal matrix of binomial coefficients exactly (n = 26)', () => {
    // Edelman & Strang (2004), "Pascal matrices": S_ij = C(i+j, i) = L L^T with L_ij = C(i, j). All entries are
    // integers below 2^53 for n <= 26 and every pivot is 1, so the factor is exact.
    const n = 26;
    const binomial = (m: number, k: number): number => {
      let value = 1;
      for (let t = 1; t <= k; t++) value = (value * (m - k + t)) / t;
      return Math.round(value);
    };
    const a = fill(n, (i, j) => binomial(i + j, i));
    expect(kernel(a, n).ok).toBe(true);
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) expect(a[i * n + j]).toBe(binomial(i, j));
  });

  it.each([257, 330, 741])('agrees with the reference kernel to 1e-10 of the row norm on a compilation-like covariance (n = %i)', (n) => {
    const original = compilationLikeCovariance(n, 12, `kernels-${n}`);
    const reference = original.slice();
    const factor = original.slice();
    const expected = referenceCholeskyInPlace(reference, n) as CholeskySuccess;
    const result = kernel(factor, n) as CholeskySuccess;
    expect(result.ok).toBe(true);
    expect(maxRowRelativeDifference(factor, reference, original, n)).toBeLessThan(AGREEMENT);
    expect(Math.abs(result.smallestPivot - expected.smallestPivot)).toBeLessThan(AGREEMENT * expected.smallestPivot);
    const logDet = logDeterminantFromCholesky(factor, n);
    expect(Math.abs(logDet - logDeterminantFromCholesky(reference, n))).toBeLessThan(AGREEMENT * Math.abs(logDet));
    let upperNonZero = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (factor[i * n + j] !== 0) upperNonZero++;
    expect(upperNonZero).toBe(0);
  });

  it('agrees with the reference kernel on the Pantheon binned systematic covariance plus its statistical errors', () => {
    // Scolnic et al. (2018) binned release (../shared/data-real/pantheon2018): 40 x 40 systematic matrix, dmb column.
    const folder = '../shared/data-real/pantheon2018/Binned_data/';
    const systematic = readFileSync(`${folder}sys_DS17f.txt`, 'utf8').trim().split(/\s+/).map(Number);
    const n = systematic[0];
    const rows = readFileSync(`${folder}lcparam_DS17f.txt`, 'utf8').trim().split('\n').slice(1).map((line) => line.trim().split(/\s+/));
    expect(rows.length).toBe(n);
    const original = fill(n, (i, j) => systematic[1 + i * n + j] + (i === j ? Number(rows[i][5]) ** 2 : 0));
    const reference = original.slice();
    const factor = original.slice();
    expect(referenceCholeskyInPlace(reference, n).ok).toBe(true);
    expect(kernel(factor, n).ok).toBe(true);
    expect(maxRowRelativeDifference(factor, reference, original, n)).toBeLessThan(AGREEMENT);
  });

  it('names the first non-positive pivot like the reference kernel (n = 300, pivot 0 at row 150)', () => {
    // min(i, j) + 1 with A[150][150] lowered by 1: rows before 150 factor exactly, pivot 150 is exactly 0.
    const n = 300;
    const a = fill(n, (i, j) => Math.min(i, j) + 1 - (i === 150 && j === 150 ? 1 : 0));
    expect(kernel(a.slice(), n)).toEqual({ ok: false, index: 150, pivot: 0 });
    expect(referenceCholeskyInPlace(a.slice(), n)).toEqual({ ok: false, index: 150, pivot: 0 });
    const withNaN = fill(n, (i, j) => (i === j ? 1 : 0));
    withNaN[200 * n + 3] = NaN;
    const failure = kernel(withNaN, n) as CholeskyFailure;
    expect(failure.ok).toBe(false);
    expect(failure.index).toBe(200);
    expect(failure.pivot).toBeNaN();
  });
});
