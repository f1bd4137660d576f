import type { Issue } from '../errors.js';
import { choleskyInPlace } from '../math/index.js';
import { CANONICAL_BLOCK_ORDER } from './reorderLightCurveCovariance.js';

/**
 * Checks that `values` (+ an optional diagonal) is positive definite by
 * attempting a Cholesky factorization (Golub & Van Loan, Matrix Computations,
 * algorithm 4.2.1) of a copy. Cost n^3/3 multiply-adds, n^2 memory.
 * @param values symmetric row-major size x size matrix (not modified).
 * @param size its dimension.
 * @param diagonalAdd values added to the diagonal first (e.g. squared statistical errors, mag^2), or null.
 * @param displayName the file name for the message.
 * @param ids optional supernova ids: with size = N they name row i, with size = 3N row i is supernova floor(i/3) and parameter i mod 3 (m_b, x1, color).
 * @returns null when positive definite, else an issue naming the failing row (and supernova) and the non-positive pivot found there.
 * @example checkPositiveDefinite(Float64Array.of(1, 2, 2, 1), 2, null, 'c.txt')?.row // 2
 */
export function checkPositiveDefinite(
  values: Float64Array, size: number, diagonalAdd: Float64Array | null, displayName: string, ids?: readonly string[],
): Issue | null {
  const copy = values.slice(0, size * size);
  if (diagonalAdd) for (let i = 0; i < size; i++) copy[i * size + i] += diagonalAdd[i];
  const result = choleskyInPlace(copy, size);
  if (result.ok) return null;
  const row = result.index;
  let who = '';
  if (ids && ids.length === size) who = ` (supernova ${ids[row]})`;
  else if (ids && 3 * ids.length === size) who = ` (supernova ${ids[Math.floor(row / 3)]}, ${CANONICAL_BLOCK_ORDER[row % 3]})`;
  return {
    code: 'covariance.not_positive_definite', file: displayName, row: row + 1,
    message: `the covariance${diagonalAdd ? ' plus its diagonal terms' : ''} is not positive definite: the Cholesky factorization fails at row ${row + 1}${who}`,
    expected: 'a positive pivot', found: `pivot ${result.pivot.toPrecision(4)}`,
    fix: 'check that the statistical errors are added to a systematic-only matrix, that no supernova appears twice, and the scale factor',
  };
}
