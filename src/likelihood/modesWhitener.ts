import { isCandelaError } from '../errors.js';
import { createLowRankWhitener, type LowRankWhitener } from './lowRankWhitener.js';
import type { Whitener } from './whitener.js';

/**
 * A {@link Whitener} for C = D + U U^T with fixed systematic modes U and a
 * diagonal D that is filled into `matrix` (the N variances, mag^2) before each
 * `factorize()`. Factorizing builds the low-rank whitening operator of
 * {@link createLowRankWhitener} (Woodbury 1950; QR of D^-1/2 U), so no N x N
 * matrix is ever formed and the evaluators written for a triangular factor
 * (exact, compressed) work unchanged: they only need |W r|^2 = r^T C^-1 r and
 * ln det C.
 *
 * Cost: factorize 2 N K^2 + N K^2/2 multiply-adds and two N x K arrays (so a
 * covariance that changes every call, e.g. a sampled sigma_int, allocates
 * them every call: O(N K^2) instead of the dense path's N^3/3); whitenInPlace 2 N K + N.
 * @param size N
 * @param modes U, N x K row major, mag (not copied; must not change)
 * @example const w = createModesWhitener(2, Float64Array.of(1, 2)); w.matrix.set([1, 4]); w.factorize(); // null; C = [[2, 2], [2, 8]]
 */
export function createModesWhitener(size: number, modes: Float64Array): Whitener {
  const matrix = new Float64Array(size);
  let operator: LowRankWhitener | null = null;
  return {
    kind: 'low_rank',
    size,
    matrix,
    get logDeterminant() {
      return operator ? operator.logDeterminant : NaN;
    },
    factorize() {
      operator = null;
      try {
        operator = createLowRankWhitener({ diagonalVariance: matrix, modes });
        return null;
      } catch (error) {
        if (isCandelaError(error)) return error.issues[0].message;
        throw error;
      }
    },
    whitenInPlace(v) {
      if (!operator) throw new Error('createModesWhitener: whitenInPlace before a successful factorize');
      operator.whitenInPlace(v);
    },
  };
}
