/**
 * Compensated summation (Neumaier 1974, "Rundungsfehleranalyse einiger
 * Verfahren zur Summation endlicher Summen", ZAMM 54, 39), an improvement of
 * Kahan (1965) that also handles terms larger than the running sum.
 * Used for chi-square and log-likelihood sums so that the result does not
 * depend on the order of many small terms more than necessary.
 *
 * Cost: O(n), about 4 flops per term.
 * @example compensatedSum(Float64Array.of(1e100, 1, -1e100)) // => 1
 */
export function compensatedSum(values: ArrayLike<number>, count = values.length): number {
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < count; i++) {
    const value = values[i];
    const next = sum + value;
    if (Math.abs(sum) >= Math.abs(value)) compensation += sum - next + value;
    else compensation += value - next + sum;
    sum = next;
  }
  return sum + compensation;
}
