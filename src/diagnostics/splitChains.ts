/**
 * Splits every chain into its first and second half, giving twice as many
 * chains, so that a drift within one chain shows up as a disagreement between
 * chains (Gelman et al. 2013, Bayesian Data Analysis 3rd ed., sec. 11.4;
 * Vehtari et al. 2021, sec. 3). With an odd number of draws n the middle draw
 * is dropped: halves are draws [0, floor(n/2)) and [ceil(n/2 + 1) - 1, n), the
 * rule of the reference implementation (R package posterior). A chain of one
 * draw is returned as it is.
 *
 * Cost: O(total draws); the halves are views (subarray), not copies.
 * @param chains equal-length chains (any units).
 * @returns all first halves (in chain order), then all second halves.
 * @example splitChains([Float64Array.of(1, 2, 3, 4, 5)]) // => [[1, 2], [4, 5]]
 */
export function splitChains(chains: readonly Float64Array[]): Float64Array[] {
  const firstHalves: Float64Array[] = [];
  const secondHalves: Float64Array[] = [];
  for (const chain of chains) {
    const drawCount = chain.length;
    if (drawCount <= 1) {
      firstHalves.push(chain);
      continue;
    }
    const half = drawCount / 2;
    firstHalves.push(chain.subarray(0, Math.floor(half)));
    secondHalves.push(chain.subarray(Math.ceil(half + 1) - 1, drawCount));
  }
  return [...firstHalves, ...secondHalves];
}
