import { choleskyInPlace, logDeterminantFromCholesky, solveLowerInPlace, solveUpperTransposedInPlace } from '../math/index.js';
import { dot } from './lowRankCapacitance.js';

/**
 * Systematic modes on m_B in the hierarchical term's block path (private
 * helper): the K x K algebra of the Woodbury identity (Woodbury 1950; Hager
 * 1989, SIAM Review 31, 221) and the matrix determinant lemma, with no
 * N x N or 3N x 3N matrix.
 *
 * Where the modes enter. A mode k is a one-standard-deviation shift U_ik
 * (mag) of every supernova's m_B under systematic k, so the model of
 * hierarchicalBlock.ts gains a term V g with g ~ N(0, I_K) independent of
 * the latent (x, c), the intrinsic scatter and the light-curve noise:
 *
 *   o = b + A t* + A xi + e + V g,   V the 3N x K matrix with V[3i, k] = U_ik
 *                                    and zeros in the x1 and c rows.
 *
 * o is a sum of independent Gaussians, so integrating out xi (the latent x1
 * and c of every supernova) and g is exact in either order and the
 * covariances add:
 *
 *   o ~ N(m, Sigma),   Sigma = B + V V^T,   B = blockdiag(Sigma_i),
 *
 * Sigma_i = V_i + diag(sigma_int^2, 0, 0) + A D A^T the per-supernova
 * marginal of hierarchicalBlock.ts, unchanged. The modes couple supernovae
 * only through the rank-K term, added after the per-supernova marginal.
 *
 * Woodbury and the determinant lemma, S = I_K + V^T B^-1 V:
 *
 *   Sigma^-1 = B^-1 - B^-1 V S^-1 V^T B^-1,   ln det Sigma = ln det B + ln det S.
 *
 * V has entries on m_B only, so with B_i = L_i L_i^T, e_i = L_i^-1 d_i and
 * w_i = L_i^-1 (1, 0, 0) (the block path's whitened residual and template):
 *
 *   V^T B^-1 V = U^T P U,   P = diag(p_i),  p_i = (B_i^-1)_00 = |w_i|^2,
 *   V^T B^-1 d = U^T q,     q_i = e_1^T B_i^-1 d_i = w_i . e_i,
 *   V^T B^-1 u = U^T p      for the template u (1 on every m_B entry).
 *
 * With S = L_S L_S^T, y = L_S^-1 U^T q and y1 = L_S^-1 U^T p, the offset
 * marginalization of hierarchicalEvaluator.ts becomes
 *
 *   E = u^T Sigma^-1 u = |w|^2 - |y1|^2,   B = u^T Sigma^-1 d = w . e - y1 . y,
 *   chi^2(M) = |e - M w|^2 - |y - M y1|^2.
 *
 * The latent posterior needs Sigma^-1 d and the diagonal blocks of Sigma^-1:
 * with g_hat = S^-1 U^T q (the posterior mean of the mode amplitudes),
 * [Sigma^-1 d]_i = B_i^-1 (d_i - (U_i . g_hat, 0, 0)) and
 * (Sigma^-1)_ii = B_i^-1 - (U_i^T S^-1 U_i) B_i^-1 e_1 e_1^T B_i^-1.
 *
 * Cost per change of the covariance inputs: N K (K + 1)/2 multiply-adds for
 * S (the Gram matrix of the columns of P^1/2 U), N K multiplications, K^3/6 for
 * the Cholesky factor of S; per vector N K + K^2/2. Memory (2K + 1) N + K^2
 * (U^T and P^1/2 U, mode by mode). N = 10^4, K = 20: 2.1e6 multiply-adds.
 */
export interface HierarchicalModes {
  /** K. */
  readonly modeCount: number;
  /** Lower Cholesky factor of S = I + U^T P U from the last successful prepare(), K x K row major. */
  readonly capacitanceFactor: Float64Array;
  /**
   * Builds S = I + U^T diag(precision) U and factorizes it. No allocation.
   * @param precision p_i = (B_i^-1)_00 per supernova, 1/mag^2
   * @returns ln det S, or NaN when S is not positive definite (only non-finite input can do that: every eigenvalue is >= 1)
   */
  prepare(precision: Float64Array): number;
  /** out = L_S^-1 U^T v for a per-supernova vector v (length N); out has K entries. No allocation. */
  project(v: Float64Array, out: Float64Array): void;
  /** out_i = U_i . S^-1 U^T q for every supernova (mag when q is in 1/mag): the m_B shift of the posterior-mean mode amplitudes. No allocation. */
  modeShifts(q: Float64Array, out: Float64Array): void;
  /** U_i^T S^-1 U_i = |L_S^-1 U_i|^2, mag^2, for supernova i. No allocation. */
  modeVariance(i: number): number;
}

/**
 * out[k K + l] = rows[k] . rows[l] for l <= k (the lower triangle of the Gram
 * matrix of K rows of `length`), four entries per pass over the data (2 x 2
 * register blocks: half the memory traffic of one dot product per entry; an
 * odd last row is paired with itself). Plain sums, like the dot products of
 * the conventional modes path. Cost K (K + 1) length / 2 multiply-adds.
 */
function gramLowerTriangle(rows: Float64Array[], length: number, out: Float64Array): void {
  const size = rows.length;
  for (let k = 0; k < size; k += 2) {
    const pair = k + 1 < size;
    const first = rows[k];
    const second = pair ? rows[k + 1] : first;
    for (let l = 0; l <= k; l += 2) {
      const third = rows[l];
      const fourth = rows[l + 1 < size ? l + 1 : l];
      let s00 = 0;
      let s01 = 0;
      let s10 = 0;
      let s11 = 0;
      for (let i = 0; i < length; i++) {
        const a = first[i];
        const b = second[i];
        const c = third[i];
        const d = fourth[i];
        s00 += a * c; s01 += a * d; s10 += b * c; s11 += b * d;
      }
      out[k * size + l] = s00;
      if (l + 1 <= k) out[k * size + l + 1] = s01;
      if (pair) {
        out[(k + 1) * size + l] = s10;
        out[(k + 1) * size + l + 1] = s11;
      }
    }
  }
}

/**
 * The K x K part of the modes' Woodbury algebra (see {@link HierarchicalModes}).
 * Cost of construction O(N K); allocates (2K + 1) N + K^2 + 2K doubles.
 * @param modes U, N x K row major, mag (checked by checkSystematicModes; must not change)
 * @param count N
 * @param modeCount K (>= 1)
 * @example // one supernova, one mode U = 0.1 mag, p = 100 / mag^2: S = 1 + 100 * 0.01 = 2
 * createHierarchicalModes(Float64Array.of(0.1), 1, 1).prepare(Float64Array.of(100)); // ln 2
 */
export function createHierarchicalModes(modes: Float64Array, count: number, modeCount: number): HierarchicalModes {
  // U^T, K x N row major (mode by mode), so that S and U^T v are contiguous dot products.
  const transposed = new Float64Array(modeCount * count);
  for (let i = 0; i < count; i++) for (let k = 0; k < modeCount; k++) transposed[k * count + i] = modes[i * modeCount + k];
  const modeRows = Array.from({ length: modeCount }, (_, k) => transposed.subarray(k * count, (k + 1) * count));
  // sqrt(p_i) U_ik, mode by mode: S = I + (P^1/2 U)^T (P^1/2 U).
  const scaled = new Float64Array(modeCount * count);
  const scaledRows = Array.from({ length: modeCount }, (_, k) => scaled.subarray(k * count, (k + 1) * count));
  const root = new Float64Array(count);
  const capacitance = new Float64Array(modeCount * modeCount);
  const amplitudes = new Float64Array(modeCount);
  const scratch = new Float64Array(modeCount);
  const project = (v: Float64Array, out: Float64Array): void => {
    for (let k = 0; k < modeCount; k++) out[k] = dot(modeRows[k], v, count);
    solveLowerInPlace(capacitance, modeCount, out);
  };
  return {
    modeCount,
    capacitanceFactor: capacitance,
    prepare(precision) {
      for (let i = 0; i < count; i++) root[i] = Math.sqrt(precision[i]);
      for (let k = 0; k < modeCount; k++) {
        const from = modeRows[k];
        const to = scaledRows[k];
        for (let i = 0; i < count; i++) to[i] = from[i] * root[i];
      }
      gramLowerTriangle(scaledRows, count, capacitance);
      for (let k = 0; k < modeCount; k++) capacitance[k * modeCount + k] += 1;
      const factor = choleskyInPlace(capacitance, modeCount);
      return factor.ok ? logDeterminantFromCholesky(capacitance, modeCount) : NaN;
    },
    project,
    modeShifts(q, out) {
      project(q, amplitudes);
      solveUpperTransposedInPlace(capacitance, modeCount, amplitudes);
      for (let i = 0; i < count; i++) {
        let shift = 0;
        for (let k = 0; k < modeCount; k++) shift += modes[i * modeCount + k] * amplitudes[k];
        out[i] = shift;
      }
    },
    modeVariance(i) {
      for (let k = 0; k < modeCount; k++) scratch[k] = modes[i * modeCount + k];
      solveLowerInPlace(capacitance, modeCount, scratch);
      let sum = 0;
      for (let k = 0; k < modeCount; k++) sum += scratch[k] * scratch[k];
      return sum;
    },
  };
}
