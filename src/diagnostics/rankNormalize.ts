import { ascendingOrder } from './ascendingOrder.js';
import { inverseNormalCdf } from '../math/index.js';
import { concatenateChains } from './concatenateChains.js';

/** Blom's offset c in (r - c) / (S - 2c + 1) (Blom 1958; Vehtari et al. 2021, eq. 14 uses c = 3/8). */
export const RANK_OFFSET = 3 / 8;

/**
 * Ranks of all draws pooled, 1-based, ties sharing the average of their ranks
 * (as R's `rank(ties.method = "average")`): a run of equal values at sorted
 * positions i..j (1-based) all get (i + j) / 2.
 *
 * Cost: one radix sort, O(S).
 * @returns ranks in the same layout as the pooled draws (chain after chain).
 * @example averageRanks(Float64Array.of(2, 1, 2, 3, 2, 1)) // => [4, 1.5, 4, 6, 4, 1.5]
 */
export function averageRanks(pooled: Float64Array): Float64Array {
  const order = ascendingOrder(pooled);
  const ranks = new Float64Array(pooled.length);
  let runStart = 0;
  while (runStart < order.length) {
    const value = pooled[order[runStart]];
    let runEnd = runStart;
    while (runEnd + 1 < order.length && pooled[order[runEnd + 1]] === value) runEnd++;
    const sharedRank = (runStart + 1 + runEnd + 1) / 2;
    for (let position = runStart; position <= runEnd; position++) ranks[order[position]] = sharedRank;
    runStart = runEnd + 1;
  }
  return ranks;
}

/**
 * Rank normalization (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021,
 * "Rank-normalization, folding, and localization: an improved R-hat for
 * assessing convergence of MCMC", Bayesian Analysis 16(2), 667, eq. 14):
 * every draw is replaced by z = Phi^-1((r - 3/8) / (S + 1/4)), where r is its
 * average rank among all S draws of all chains. The result has the same
 * chains and lengths and is standard normal whatever the tails of the input,
 * so R-hat and ESS computed from it exist even when the variance does not.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains chains of draws (any units; the result is in standard deviations).
 * @returns new chains of normal scores.
 * @example rankNormalize([Float64Array.of(10, 30), Float64Array.of(20, 20)])
 * // ranks 1, 4, 2.5, 2.5 -> [[-1.0491314, 1.0491314], [0, 0]]
 */
export function rankNormalize(chains: readonly Float64Array[]): Float64Array[] {
  const pooled = concatenateChains(chains);
  const ranks = averageRanks(pooled);
  const total = pooled.length;
  const scores = chains.map((chain) => new Float64Array(chain.length));
  let offset = 0;
  for (const score of scores) {
    for (let draw = 0; draw < score.length; draw++) {
      score[draw] = inverseNormalCdf((ranks[offset + draw] - RANK_OFFSET) / (total - 2 * RANK_OFFSET + 1));
    }
    offset += score.length;
  }
  return scores;
}
