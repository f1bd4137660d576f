import { compensatedSum } from '../compensatedSum.js';

/**
 * Kish's effective number of samples of a weighted sample,
 * n_eff = (sum w)^2 / sum w^2 (Kish 1965, "Survey Sampling", Wiley): n for
 * equal weights, fewer when a few weights dominate. Used by kernel
 * bandwidth rules; it does not account for autocorrelation (that is the
 * diagnostics layer's ESS).
 *
 * Sums are compensated (Neumaier 1974), so normalized weights of a long
 * nested-sampling run keep their precision.
 *
 * Cost: O(n), one array of n doubles.
 * @param weights non-negative weights, or a count of equally weighted samples.
 * @returns the effective count (dimensionless); 0 when every weight is zero.
 * @example kishEffectiveCount([1, 1, 2]) // 16 / 6 = 2.667
 */
export function kishEffectiveCount(weights: ArrayLike<number> | number): number {
  if (typeof weights === 'number') return weights;
  const squares = new Float64Array(weights.length);
  for (let i = 0; i < weights.length; i++) squares[i] = weights[i] * weights[i];
  const sum = compensatedSum(weights);
  const sumSquares = compensatedSum(squares);
  return sumSquares > 0 ? (sum * sum) / sumSquares : 0;
}
