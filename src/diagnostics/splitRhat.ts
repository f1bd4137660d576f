import { assertUsableChains } from './checkChains.js';
import { potentialScaleReductionOfChains } from './potentialScaleReduction.js';
import { splitChains } from './splitChains.js';

/**
 * Basic split-R-hat: the potential scale reduction factor (Gelman & Rubin 1992)
 * of the chains split in halves, without rank normalization (Vehtari,
 * Gelman, Simpson, Carpenter & Buerkner 2021, Bayesian Analysis 16(2), 667,
 * eq. 4; `rhat_basic` of the R package posterior). Values near 1 (below about
 * 1.01) suggest the chains agree; it needs a finite variance.
 *
 * Cost: O(total draws).
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns R-hat (dimensionless); +Infinity when every half-chain is constant but they differ.
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`,
 *   `diagnostics.too_few_draws`, `diagnostics.non_finite_draw`, `diagnostics.constant_draws`.
 * @example splitRhat([Float64Array.of(1, 2, 3, 4, 5, 6)]) // => 2.2730303 (halves 1..3 and 4..6 disagree)
 */
export function splitRhat(chains: readonly Float64Array[]): number {
  assertUsableChains(chains);
  return potentialScaleReductionOfChains(splitChains(chains), 'the basic split-R-hat');
}
