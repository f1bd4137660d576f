import { essMean } from './essMean.js';
import { sampleVarianceOf } from '../math/index.js';
import { concatenateChains } from './concatenateChains.js';

/**
 * Monte Carlo standard error of the posterior mean: sd / sqrt(ESS_mean), with
 * sd the sample standard deviation of all draws pooled (n - 1 denominator)
 * (Vehtari et al. 2021, sec. 3.2; `mcse_mean` of the R package posterior).
 *
 * Cost: O(S log S) for S draws in total.
 * @param chains one or more equal-length chains of >= 6 finite draws (units u).
 * @returns the standard error of the mean, in the units u of the draws.
 * @throws CandelaError like {@link essMean}.
 * @example mcseMean(fourIidStandardNormalChainsOf1000) // about 1/sqrt(4000) = 0.0158 (reference: 0.016056)
 */
export function mcseMean(chains: readonly Float64Array[]): number {
  const effective = essMean(chains);
  return Math.sqrt(sampleVarianceOf(concatenateChains(chains)) / effective);
}
