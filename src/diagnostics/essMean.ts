import { essBasic } from './essBasic.js';

/**
 * Effective sample size for the posterior mean (Vehtari et al. 2021,
 * sec. 3.2; `ess_mean` of the R package posterior). The same computation as
 * {@link essBasic} (split chains, no rank normalization); it has its own name
 * because it is the ESS that enters the Monte Carlo standard error of the mean.
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (any units).
 * @returns the ESS, a number of draws.
 * @throws CandelaError like {@link essBasic}.
 * @example essMean(chains) === essBasic(chains) // => true
 */
export function essMean(chains: readonly Float64Array[]): number {
  return essBasic(chains);
}
