import { assertUsableChains } from './checkChains.js';
import { foldAboutMedian } from './foldAboutMedian.js';
import { potentialScaleReductionOfChains } from './potentialScaleReduction.js';
import { rankNormalize } from './rankNormalize.js';
import { splitChains } from './splitChains.js';

/** Components of the rank-normalized split-R-hat. */
export interface RankNormalizedRhat {
  /** Split-R-hat of the rank-normalized draws (location). */
  bulk: number;
  /** Split-R-hat of the rank-normalized draws folded about the median (scale, tails). */
  tail: number;
  /** max(bulk, tail): the value to report. */
  rhat: number;
}

/**
 * Both parts of the rank-normalized split-R-hat of Vehtari, Gelman, Simpson,
 * Carpenter & Buerkner (2021, Bayesian Analysis 16(2), 667, sec. 4.1-4.2):
 * bulk = split-R-hat of the rank-normalized split chains; tail = the same for
 * the draws first folded about the pooled median |x - median|.
 * Order of steps as in the R package posterior: split, then rank over all
 * halves; the median is taken over all draws before splitting.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns bulk, tail and their maximum (dimensionless).
 * @throws CandelaError like {@link splitRhat}; `diagnostics.constant_draws` also when the folded draws are constant.
 * @example rankNormalizedSplitRhatParts(chains).rhat // same as rankNormalizedSplitRhat(chains)
 */
export function rankNormalizedSplitRhatParts(chains: readonly Float64Array[]): RankNormalizedRhat {
  assertUsableChains(chains);
  const bulk = potentialScaleReductionOfChains(rankNormalize(splitChains(chains)), 'the bulk R-hat');
  const tail = potentialScaleReductionOfChains(rankNormalize(splitChains(foldAboutMedian(chains))), 'the tail (folded) R-hat');
  return { bulk, tail, rhat: Math.max(bulk, tail) };
}

/**
 * Rank-normalized split-R-hat: the larger of the bulk and the folded (tail)
 * R-hat (Vehtari et al. 2021, sec. 4.2; `rhat` of the R package posterior).
 * The paper recommends using the draws only when it is below 1.01.
 * Works for heavy tails (no finite variance needed).
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns R-hat (dimensionless, >= about 1).
 * @throws CandelaError like {@link rankNormalizedSplitRhatParts}.
 * @example rankNormalizedSplitRhat(fourIidNormalChains) // about 1.000 (reference case iid_normal: 0.99998)
 */
export function rankNormalizedSplitRhat(chains: readonly Float64Array[]): number {
  return rankNormalizedSplitRhatParts(chains).rhat;
}
