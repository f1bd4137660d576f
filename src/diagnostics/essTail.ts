import { assertNotConstant, assertUsableChains } from './checkChains.js';
import { concatenateChains } from './concatenateChains.js';
import { effectiveSampleSizeOfChains } from './multiChainEffectiveSampleSize.js';
import { quantileOfDraws } from '../math/index.js';
import { splitChains } from './splitChains.js';

/** Lower quantile probed by the tail ESS (Vehtari et al. 2021, sec. 4.3). */
export const TAIL_LOWER_PROBABILITY = 0.05;
/** Upper quantile probed by the tail ESS (Vehtari et al. 2021, sec. 4.3). */
export const TAIL_UPPER_PROBABILITY = 0.95;

/**
 * Effective sample size for estimating the `probability` quantile: the
 * multi-chain ESS of the split indicator chains I(x <= q), with q the pooled
 * type-7 sample quantile (Vehtari et al. 2021, sec. 4.3 and eq. 15;
 * `ess_quantile` of the R package posterior; p = 1 is moved to (S - 1/2)/S as there).
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @param probability quantile probability in [0, 1].
 * @returns the ESS, a number of draws.
 * @throws CandelaError like {@link essTail}; `diagnostics.constant_draws` when the indicator is constant.
 * @example essQuantile(fourIidNormalChainsOf1000, 0.05) // about 4000
 */
export function essQuantile(chains: readonly Float64Array[], probability: number): number {
  assertUsableChains(chains);
  assertNotConstant(chains, 'a quantile ESS');
  const pooled = concatenateChains(chains);
  const effectiveProbability = probability === 1 ? (pooled.length - 0.5) / pooled.length : probability;
  const threshold = quantileOfDraws(pooled, effectiveProbability);
  const indicators = chains.map((chain) => chain.map((value) => (value <= threshold ? 1 : 0)));
  return effectiveSampleSizeOfChains(splitChains(indicators), `the ESS of the ${probability} quantile`);
}

/**
 * Tail effective sample size: the smaller of the ESS of the 5% and the 95%
 * quantile (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021, Bayesian
 * Analysis 16(2), 667, sec. 4.3; `ess_tail` of the R package posterior). It
 * measures how well the tails, and so 90% intervals, are sampled; chains that
 * differ in scale lower it even when the bulk ESS is large.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns the tail ESS, a number of draws.
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`, `diagnostics.too_few_draws`,
 *   `diagnostics.non_finite_draw`, `diagnostics.constant_draws` (draws or a quantile indicator constant).
 * @example essTail(fourIidNormalChainsOf1000) // about 4000 (reference case iid_normal: 3775.1)
 */
export function essTail(chains: readonly Float64Array[]): number {
  return Math.min(essQuantile(chains, TAIL_LOWER_PROBABILITY), essQuantile(chains, TAIL_UPPER_PROBABILITY));
}
