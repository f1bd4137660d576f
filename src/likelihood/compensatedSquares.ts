/**
 * Sums of squares with Neumaier's compensated summation (Neumaier 1974, ZAMM
 * 54, 39), written out so that the hot path needs no scratch array of squares
 * (private helper of the likelihood layer).
 */

/** sum_i v[i]^2 over i < count, compensated. Cost: O(count). @example compensatedSumOfSquares(Float64Array.of(3, 4), 2) // 25 */
export function compensatedSumOfSquares(values: Float64Array, count: number): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < count; i++) {
    const term = values[i] * values[i];
    const next = sum + term;
    compensation += sum >= term ? sum - next + term : term - next + sum;
    sum = next;
  }
  return sum + compensation;
}

/** sum_i (a[i] - scale b[i])^2 over i < count, compensated. Cost: O(count). @example compensatedSumOfShiftedSquares(Float64Array.of(1, 3), Float64Array.of(1, 1), 2, 2) // 2 */
export function compensatedSumOfShiftedSquares(a: Float64Array, b: Float64Array, scale: number, count: number): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < count; i++) {
    const difference = a[i] - scale * b[i];
    const term = difference * difference;
    const next = sum + term;
    compensation += sum >= term ? sum - next + term : term - next + sum;
    sum = next;
  }
  return sum + compensation;
}

/** sum_i a[i] b[i] over i < count, compensated. Cost: O(count). @example compensatedDot(Float64Array.of(1, 2), Float64Array.of(3, 4), 2) // 11 */
export function compensatedDot(a: Float64Array, b: Float64Array, count: number): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < count; i++) {
    const term = a[i] * b[i];
    const next = sum + term;
    compensation += Math.abs(sum) >= Math.abs(term) ? sum - next + term : term - next + sum;
    sum = next;
  }
  return sum + compensation;
}
