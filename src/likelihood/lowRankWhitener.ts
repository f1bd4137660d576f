import { choleskyInPlace, solveLowerInPlace } from '../math/index.js';
import type { LowRankGaussianOptions } from './lowRankGaussian.js';
import { buildLowRankCapacitance, dot } from './lowRankCapacitance.js';

/**
 * A mode whose part orthogonal to the previous ones is below this fraction
 * of its own length is taken as linearly dependent on them (a few hundred
 * units of rounding: the second Gram-Schmidt pass leaves errors of order
 * 1e-16 relative; "twice is enough", Giraud et al. 2005).
 */
const DEPENDENT_MODE_FRACTION = 1e-12;

/** A whitening operator for C = D + U U^T: v -> W v with W^T W = C^-1, O(N K) per vector. */
export interface LowRankWhitener {
  readonly kind: 'low_rank';
  /** N. */
  readonly size: number;
  /** K. */
  readonly modeCount: number;
  /** ln det C (matrix determinant lemma). */
  readonly logDeterminant: number;
  /** v <- W v (first N entries), so that |W r|^2 = r^T C^-1 r. 2 N K + N multiply-adds, no allocation. */
  whitenInPlace(v: Float64Array): void;
}

/**
 * A square root of C^-1 for a diagonal-plus-low-rank covariance, built
 * without an N x N matrix, so that code written for whitened vectors (least
 * squares, compression) can use C = D + U U^T. With V = D^-1/2 U = Q R (thin
 * QR by classical Gram-Schmidt with reorthogonalization; Giraud, Langou,
 * Rozloznik & van den Eshof 2005) and I + R R^T = L L^T (Cholesky),
 *
 *   W = [I + Q (L^-1 - I) Q^T] D^-1/2,   W^T W = D^-1/2 (I + V V^T)^-1 D^-1/2 = C^-1,
 *
 * because Q^T Q = I and (I + Q B Q^T)^-1 = I + Q ((I + B)^-1 - I) Q^T
 * (Woodbury 1950). W is not triangular: it whitens, it is not a Cholesky
 * factor of C. Linearly dependent modes get a zero column of Q, which
 * leaves W unchanged.
 *
 * Cost: set-up 2 N K^2 (QR) + N K^2/2 (determinant) multiply-adds, memory two
 * N x K arrays; per vector 2 N K + N.
 * @param options D (mag^2) and U (mag, N x K row major), as for createLowRankGaussian
 * @throws CandelaError `likelihood.low_rank_shape`, `likelihood.low_rank_variance`, `likelihood.low_rank_mode` (see createLowRankGaussian)
 * @example // D = diag(1, 4), U = (1, 2): C = [[2, 2], [2, 8]], r = (1, 1) has r^T C^-1 r = 0.5
 * const whitener = createLowRankWhitener({ diagonalVariance: Float64Array.of(1, 4), modes: Float64Array.of(1, 2) });
 * const r = Float64Array.of(1, 1); whitener.whitenInPlace(r); r[0] ** 2 + r[1] ** 2; // 0.5
 */
export function createLowRankWhitener(options: LowRankGaussianOptions): LowRankWhitener {
  const capacitance = buildLowRankCapacitance(options.diagonalVariance, options.modes);
  const { size, modeCount, inverseDeviation } = capacitance;
  // Q overwrites a copy of V^T (K x N, mode by mode); R is K x K upper triangular, R[j * K + k] for j <= k.
  const orthonormal = Float64Array.from(capacitance.scaledModes);
  const rows = Array.from({ length: modeCount }, (_, k) => orthonormal.subarray(k * size, (k + 1) * size));
  const upper = new Float64Array(modeCount * modeCount);
  for (let k = 0; k < modeCount; k++) {
    const column = rows[k];
    const original = Math.sqrt(dot(column, column, size));
    for (let pass = 0; pass < 2; pass++) {
      for (let j = 0; j < k; j++) {
        const coefficient = dot(rows[j], column, size);
        upper[j * modeCount + k] += coefficient;
        const basis = rows[j];
        for (let i = 0; i < size; i++) column[i] -= coefficient * basis[i];
      }
    }
    const norm = Math.sqrt(dot(column, column, size));
    if (!(norm > DEPENDENT_MODE_FRACTION * original)) {
      column.fill(0);
      continue;
    }
    upper[k * modeCount + k] = norm;
    for (let i = 0; i < size; i++) column[i] /= norm;
  }
  // I + R R^T = L L^T; every eigenvalue >= 1, so the factorization cannot fail for finite R.
  const factor = new Float64Array(modeCount * modeCount);
  for (let j = 0; j < modeCount; j++) {
    for (let l = 0; l <= j; l++) {
      let sum = j === l ? 1 : 0;
      for (let k = j; k < modeCount; k++) sum += upper[j * modeCount + k] * upper[l * modeCount + k];
      factor[j * modeCount + l] = sum;
    }
  }
  choleskyInPlace(factor, modeCount);
  const projection = new Float64Array(modeCount);
  const solved = new Float64Array(modeCount);
  return {
    kind: 'low_rank',
    size,
    modeCount,
    logDeterminant: capacitance.logDeterminantDiagonal + capacitance.logDeterminantCapacitance,
    whitenInPlace(v) {
      for (let i = 0; i < size; i++) v[i] *= inverseDeviation[i];
      for (let k = 0; k < modeCount; k++) projection[k] = dot(rows[k], v, size);
      solved.set(projection);
      solveLowerInPlace(factor, modeCount, solved);
      for (let k = 0; k < modeCount; k++) {
        const change = solved[k] - projection[k];
        const basis = rows[k];
        for (let i = 0; i < size; i++) v[i] += change * basis[i];
      }
    },
  };
}
