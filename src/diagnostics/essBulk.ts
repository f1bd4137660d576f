import { assertUsableChains } from './checkChains.js';
import { effectiveSampleSizeOfChains } from './multiChainEffectiveSampleSize.js';
import { rankNormalize } from './rankNormalize.js';
import { splitChains } from './splitChains.js';

/**
 * Bulk effective sample size: the multi-chain ESS (Geyer 1992 initial
 * monotone sequence) of the rank-normalized split chains (Vehtari, Gelman,
 * Simpson, Carpenter & Buerkner 2021, Bayesian Analysis 16(2), 667, sec. 4.3;
 * `ess_bulk` of the R package posterior). It measures how well the centre of
 * the distribution is sampled and exists for heavy tails. The paper suggests
 * trusting R-hat and the quantile estimates once it exceeds 100 per chain.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns the bulk ESS, a number of draws (may exceed S for antithetic chains, at most S log10 S).
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`,
 *   `diagnostics.too_few_draws`, `diagnostics.non_finite_draw`, `diagnostics.constant_draws`.
 * @example essBulk(fourIidNormalChainsOf1000) // about 4000 (reference case iid_normal: 3837.5)
 */
export function essBulk(chains: readonly Float64Array[]): number {
  assertUsableChains(chains);
  return effectiveSampleSizeOfChains(rankNormalize(splitChains(chains)), 'the bulk ESS');
}
