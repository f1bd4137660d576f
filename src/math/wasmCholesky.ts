/**
 * The WebAssembly SIMD Cholesky kernel: the algorithm of blockedCholesky.ts
 * compiled from AssemblyScript (wasm/choleskyKernel.ts, built by
 * `npm run build:wasm` into wasmCholeskyBinary.ts), with 2 x 4 register
 * tiles of f64x2 sums. About twice the blocked TypeScript kernel's speed:
 * 10-11 GFLOP/s on one core of the project's machine (bench/RESULTS.md).
 *
 * The module is compiled once per thread on first use. Its memory holds one
 * matrix: it grows to the largest n factorized in this thread (8 n^2 bytes,
 * 27 MB at n = 1,829) and is kept for the next call. Each call copies the
 * matrix in and the factor out (2 n^2 doubles, a few percent of the
 * factorization at n >= 100).
 */
import type { CholeskyFailure, CholeskySuccess } from './cholesky.js';
import { CHOLESKY_WASM_BASE64 } from './wasmCholeskyBinary.js';

/** The few members of the WebAssembly JavaScript API used here (the project's TypeScript lib, ES2022 without DOM, does not declare them). */
declare const WebAssembly: {
  validate(bytes: Uint8Array): boolean;
  Module: new (bytes: Uint8Array) => object;
  Instance: new (module: object, imports: object) => { exports: unknown };
};

interface CholeskyExports {
  memory: { readonly buffer: ArrayBuffer };
  reserveMatrix(n: number): number;
  factorize(base: number, n: number): number;
  smallestPivot(): number;
  failedPivot(): number;
}

/** undefined: not tried yet; null: unavailable (no WebAssembly, or no SIMD). */
let kernel: CholeskyExports | null | undefined;

function decodeBase64(text: string): Uint8Array {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i++) bytes[i] = binary.charCodeAt(i);
  return bytes;
}

function loadKernel(): CholeskyExports | null {
  if (kernel !== undefined) return kernel;
  kernel = null;
  if (typeof WebAssembly !== 'object' || WebAssembly === null) return kernel;
  const bytes = decodeBase64(CHOLESKY_WASM_BASE64);
  // validate() is false when the runtime lacks the SIMD proposal: the caller then uses the TypeScript kernel.
  if (!WebAssembly.validate(bytes)) return kernel;
  const instance = new WebAssembly.Instance(new WebAssembly.Module(bytes), {});
  kernel = instance.exports as unknown as CholeskyExports;
  return kernel;
}

/** True when this runtime can run the WebAssembly SIMD kernel (compiles it on the first call). */
export function wasmCholeskyAvailable(): boolean {
  return loadKernel() !== null;
}

/**
 * Factorizes the symmetric positive-definite n x n matrix `a` (row major) in
 * place into its lower Cholesky factor L, strict upper triangle zeroed; only
 * the lower triangle is read. Same contract as choleskyInPlace: never throws
 * for a matrix that is not positive definite, returns the first row whose
 * pivot was not positive (then `a` holds partial work).
 *
 * Cost: n^3/6 multiply-adds, plus copying 2 n^2 doubles.
 * @param a row-major n x n matrix, overwritten by L
 * @param n dimension
 * @throws Error when the kernel is unavailable (check wasmCholeskyAvailable) or its memory cannot grow to 8 n^2 bytes
 * @example wasmCholeskyInPlace(Float64Array.of(4, 2, 2, 3), 2) // a becomes [2, 0, 1, 1.414...]
 */
export function wasmCholeskyInPlace(a: Float64Array, n: number): CholeskySuccess | CholeskyFailure {
  const exports = loadKernel();
  if (!exports) throw new Error('the WebAssembly SIMD Cholesky kernel is not available in this runtime');
  const base = exports.reserveMatrix(n);
  if (base === 0) throw new Error(`the WebAssembly Cholesky kernel could not grow its memory to ${((8 * n * n) / 2 ** 20).toFixed(0)} MB`);
  const size = n * n;
  new Float64Array(exports.memory.buffer, base, size).set(a.subarray(0, size));
  const failedRow = exports.factorize(base, n);
  a.set(new Float64Array(exports.memory.buffer, base, size));
  if (failedRow >= 0) return { ok: false, index: failedRow, pivot: exports.failedPivot() };
  return { ok: true, smallestPivot: exports.smallestPivot() };
}
