import { compensatedSum, meanOf, sampleVarianceOf } from '../math/index.js';
import { assertNotConstant } from './checkChains.js';
import { createAutocovarianceWorkspace } from './autocovariance.js';

/**
 * Effective sample size of m chains of n draws taken as they are (no
 * splitting, no rank normalization): the building block of the bulk, tail,
 * basic and mean ESS.
 *
 * Method (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021, Bayesian
 * Analysis 16(2), 667, sec. 3.2, eqs. 10-13; Gelman et al. 2013, BDA3 sec. 11.5):
 * - per chain, the biased autocovariance gamma_c(t) via FFT;
 * - W = mean_c gamma_c(0) n/(n-1), var+ = W (n-1)/n + B/n with B/n the sample
 *   variance of the chain means (for m > 1);
 * - the multi-chain autocorrelation rho(t) = 1 - (W - mean_c gamma_c(t)) / var+;
 * - Geyer's (1992, Statistical Science 7(4), 473) initial positive sequence:
 *   sums of pairs rho(2k) + rho(2k+1) are kept while they stay positive, then the
 *   initial monotone sequence makes the pair sums non-increasing;
 * - tau = -1 + 2 sum_{t < T} rho(t) + rho(T) (the last even lag added once more
 *   when positive, which reduces variance for antithetic chains), floored at
 *   1/log10(mn) so that ESS <= mn log10(mn); ESS = mn / tau.
 * Index conventions (loop limits, the pair kept at the end) follow the
 * reference implementation, R package posterior 1.4.0, so results agree to
 * rounding.
 *
 * Cost: O(m n log n).
 * @param chains m >= 1 equal-length chains of n >= 3 finite draws (any units).
 * @returns the effective number of independent draws (dimensionless), > 0.
 * @throws CandelaError `diagnostics.constant_draws` when every draw is equal.
 * @example effectiveSampleSizeOfChains(halvesOfIidChains) // close to the draw count
 */
export function effectiveSampleSizeOfChains(chains: readonly Float64Array[], quantity = 'the effective sample size'): number {
  assertNotConstant(chains, quantity);
  const chainCount = chains.length;
  const drawCount = chains[0].length;
  const workspace = createAutocovarianceWorkspace(drawCount);
  const autocovariance = new Float64Array(drawCount);
  const meanAutocovariance = new Float64Array(drawCount);
  const chainMeans = new Float64Array(chainCount);
  chains.forEach((chain, chainIndex) => {
    workspace.autocovarianceInto(chain, autocovariance);
    for (let lag = 0; lag < drawCount; lag++) meanAutocovariance[lag] += autocovariance[lag];
    chainMeans[chainIndex] = meanOf(chain);
  });
  for (let lag = 0; lag < drawCount; lag++) meanAutocovariance[lag] /= chainCount;

  const withinVariance = (meanAutocovariance[0] * drawCount) / (drawCount - 1);
  let pooledVariance = (withinVariance * (drawCount - 1)) / drawCount;
  if (chainCount > 1) pooledVariance += sampleVarianceOf(chainMeans);
  const correlationAt = (lag: number): number => 1 - (withinVariance - meanAutocovariance[lag]) / pooledVariance;

  // Geyer's initial positive sequence over pairs (even lag, odd lag).
  const rho = new Float64Array(drawCount);
  let lag = 0;
  let evenTerm = 1;
  let oddTerm = correlationAt(1);
  rho[0] = evenTerm;
  rho[1] = oddTerm;
  while (lag < drawCount - 5 && evenTerm + oddTerm > 0) {
    lag += 2;
    evenTerm = correlationAt(lag);
    oddTerm = correlationAt(lag + 1);
    if (evenTerm + oddTerm >= 0) {
      rho[lag] = evenTerm;
      rho[lag + 1] = oddTerm;
    }
  }
  const lastLag = lag;
  if (evenTerm > 0) rho[lastLag] = evenTerm;

  // Geyer's initial monotone sequence: pair sums may not increase.
  for (let pair = 2; pair <= lastLag - 2; pair += 2) {
    if (rho[pair] + rho[pair + 1] > rho[pair - 2] + rho[pair - 1]) {
      rho[pair] = (rho[pair - 2] + rho[pair - 1]) / 2;
      rho[pair + 1] = rho[pair];
    }
  }

  const totalDraws = chainCount * drawCount;
  // Sum of rho over lags 0..lastLag-1; when lastLag is 0 the reference sums lag 0
  // alone (R's 1:0 indexing), which this reproduces.
  const summed = compensatedSum(rho, Math.max(lastLag, 1));
  let tau = -1 + 2 * summed + rho[lastLag];
  const tauFloor = 1 / Math.log10(totalDraws);
  if (tau < tauFloor) tau = tauFloor;
  return totalDraws / tau;
}
