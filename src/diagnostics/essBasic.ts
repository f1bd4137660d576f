import { assertUsableChains } from './checkChains.js';
import { effectiveSampleSizeOfChains } from './multiChainEffectiveSampleSize.js';
import { splitChains } from './splitChains.js';

/**
 * Basic effective sample size: the multi-chain ESS (Geyer 1992 initial
 * monotone sequence) of the split chains without rank normalization
 * (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021, Bayesian Analysis
 * 16(2), 667, sec. 3.2; `ess_basic` of the R package posterior). It is the ESS
 * of the mean, so it needs a finite variance.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns the ESS, a number of draws.
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`,
 *   `diagnostics.too_few_draws`, `diagnostics.non_finite_draw`, `diagnostics.constant_draws`.
 * @example essBasic(fourAr1ChainsPhi09) // about 4000 (1 - 0.9)/(1 + 0.9) = 211 (reference case ar1_phi0.9: 211.68)
 */
export function essBasic(chains: readonly Float64Array[]): number {
  assertUsableChains(chains);
  return effectiveSampleSizeOfChains(splitChains(chains), 'the basic ESS');
}
