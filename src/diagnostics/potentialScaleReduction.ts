import { assertNotConstant } from './checkChains.js';
import { meanOf, sampleVarianceOf } from '../math/index.js';

/**
 * Potential scale reduction factor of m chains of n draws taken as they are
 * (Gelman & Rubin 1992, Statistical Science 7(4), 457; in the form of
 * Gelman et al. 2013, BDA3 eqs. 11.2-11.4, as Vehtari et al. 2021 eq. 3 restate it):
 * B = n var(chain means), W = mean of the chain variances (n - 1 denominators),
 * R-hat = sqrt(((n - 1)/n W + B/n) / W).
 *
 * Cost: O(m n).
 * @param chains m >= 2 equal-length chains of n >= 2 finite draws (any units).
 * @returns R-hat (dimensionless, about 1 at convergence).
 * @throws CandelaError `diagnostics.constant_draws` when every draw is equal.
 * @example potentialScaleReductionOfChains([Float64Array.of(0, 2), Float64Array.of(1, 3)]) // => sqrt(0.75) = 0.8660254
 * (B = 1, W = 2). Returns +Infinity when every chain is constant but the chains differ (W = 0).
 */
export function potentialScaleReductionOfChains(chains: readonly Float64Array[], quantity = 'R-hat'): number {
  assertNotConstant(chains, quantity);
  const drawCount = chains[0].length;
  const chainMeans = new Float64Array(chains.length);
  let varianceSum = 0;
  chains.forEach((chain, chainIndex) => {
    const mean = meanOf(chain);
    chainMeans[chainIndex] = mean;
    varianceSum += sampleVarianceOf(chain);
  });
  const betweenVariance = drawCount * sampleVarianceOf(chainMeans);
  const withinVariance = varianceSum / chains.length;
  return Math.sqrt((betweenVariance / withinVariance + drawCount - 1) / drawCount);
}
