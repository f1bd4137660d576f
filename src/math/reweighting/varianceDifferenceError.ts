/**
 * Monte Carlo standard error of the difference of two weighted variances of
 * the same draws, s_a^2 - s_b^2, by the delta method (influence functions
 * of the self-normalized weighted variance; Owen 2013, "Monte Carlo theory,
 * methods and examples", section 9.2):
 *
 *   Var ~ sum_i ( a_i ((x_i - m_a)^2 - s_a^2) - b_i ((x_i - m_b)^2 - s_b^2) )^2
 *
 * with normalized weights a_i, b_i (each summing to 1; 1/n for equal
 * weights) and their weighted means and variances m, s^2. Errors shared by
 * both variances cancel, as they should when the weights are close.
 *
 * Cost: O(n).
 * @param values the parameter at each draw (finite).
 * @param weightsA normalized weights of the first variance.
 * @param weightsB normalized weights of the second.
 * @returns the standard error, in the parameter's unit squared.
 * @example varianceDifferenceError(x, w, w) // 0 (the same variance twice)
 */
export function varianceDifferenceError(values: ArrayLike<number>, weightsA: ArrayLike<number>, weightsB: ArrayLike<number>): number {
  const a = moments(values, weightsA);
  const b = moments(values, weightsB);
  let variance = 0;
  for (let i = 0; i < values.length; i++) {
    const influence = weightsA[i] * ((values[i] - a.mean) ** 2 - a.variance) - weightsB[i] * ((values[i] - b.mean) ** 2 - b.variance);
    variance += influence * influence;
  }
  return Math.sqrt(variance);
}

/** Weighted mean and (plug-in) variance with normalized weights. */
function moments(values: ArrayLike<number>, weights: ArrayLike<number>): { mean: number; variance: number } {
  let mean = 0;
  for (let i = 0; i < values.length; i++) mean += weights[i] * values[i];
  let variance = 0;
  for (let i = 0; i < values.length; i++) variance += weights[i] * (values[i] - mean) ** 2;
  return { mean, variance };
}

/**
 * The Monte Carlo error of a quadrature contribution c = f(D) = sign(D)
 * sqrt(|D|) from the error e of D = s_a^2 - s_b^2: half the width of the
 * image of [D - e, D + e], (f(D + e) - f(D - e)) / 2. Far from zero it is
 * the first-order e / (2 |c|); at c = 0 it is sqrt(e), the size of
 * sqrt(|D|) when D is pure noise, where first order would claim no error.
 * Cost O(1).
 * @example contributionError(0.5, 1e-6) // ~1e-6 (first order: 1e-6 / (2 x 0.5))
 * @example contributionError(0, 1e-4) // 0.01
 */
export function contributionError(contribution: number, varianceDifferenceErr: number): number {
  const difference = Math.sign(contribution) * contribution * contribution;
  const image = (x: number) => Math.sign(x) * Math.sqrt(Math.abs(x));
  return (image(difference + varianceDifferenceErr) - image(difference - varianceDifferenceErr)) / 2;
}
