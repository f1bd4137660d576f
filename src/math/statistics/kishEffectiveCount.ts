/**
 * Kish's effective number of samples of a weighted sample,
 * n_eff = (sum w)^2 / sum w^2 (Kish 1965, "Survey Sampling", Wiley): n for
 * equal weights, fewer when a few weights dominate. Used by kernel
 * bandwidth rules; it does not account for autocorrelation (that is the
 * diagnostics layer's ESS).
 *
 * Cost: O(n).
 * @param weights non-negative weights, or a count of equally weighted samples.
 * @returns the effective count (dimensionless); 0 when every weight is zero.
 * @example kishEffectiveCount([1, 1, 2]) // 16 / 6 = 2.667
 */
export function kishEffectiveCount(weights: ArrayLike<number> | number): number {
  if (typeof weights === 'number') return weights;
  let sum = 0;
  let sumSquares = 0;
  for (let i = 0; i < weights.length; i++) {
    sum += weights[i];
    sumSquares += weights[i] * weights[i];
  }
  return sumSquares > 0 ? (sum * sum) / sumSquares : 0;
}
