import { CandelaError } from '../errors.js';
import { assertUsableChains, CONSTANT_SPREAD_TOLERANCE } from './checkChains.js';
import { createAutocovarianceWorkspace } from './autocovariance.js';

/** Fewest steps per walker accepted (one lag needs two steps). */
export const MINIMUM_STEPS_FOR_TAU = 2;

/** The normalized autocorrelation function of an ensemble, averaged over its moving walkers. */
export interface EnsembleAutocorrelation {
  /** rho(t) for lags t = 0 .. steps - 1 (steps); rho(0) = 1. Dimensionless. */
  correlation: Float64Array;
  /** Walkers whose series varies (the ones averaged). */
  walkersUsed: number;
  /** 0-based indices of walkers whose series is constant (left out of the average). */
  constantWalkers: number[];
}

/**
 * The normalized autocorrelation function of an ensemble chain, one series
 * per walker: per walker rho_w(t) = gamma_w(t) / gamma_w(0) from the FFT of
 * the zero-padded series (biased autocovariance), then rho(t) = the mean of
 * rho_w(t) over the walkers that move (Goodman & Weare 2010, "Ensemble
 * samplers with affine invariance", Comm. App. Math. Comp. Sci. 5(1), 65,
 * sec. 4). integratedAutocorrelationTime sums it; figures draw it.
 *
 * Cost: two FFTs of length nextPowerOfTwo(2 steps) per pair of walkers, O(W n log n).
 * @param walkerSeries one series per walker, equal lengths >= 2, finite (any units).
 * @returns rho(t) at every lag, with the walkers used and left out.
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`, `diagnostics.too_few_draws`,
 *   `diagnostics.non_finite_draw`; `diagnostics.constant_draws` when every walker is constant.
 * @example ensembleAutocorrelation(walkersOfAnAr1Process).correlation[1] // about phi
 */
export function ensembleAutocorrelation(walkerSeries: readonly Float64Array[]): EnsembleAutocorrelation {
  assertUsableChains(walkerSeries, MINIMUM_STEPS_FOR_TAU, 'walkers');
  const steps = walkerSeries[0].length;
  const workspace = createAutocovarianceWorkspace(steps);
  const autocovariance = new Float64Array(steps);
  const autocovarianceSecond = new Float64Array(steps);
  const correlation = new Float64Array(steps);
  const constantWalkers: number[] = [];
  const accumulate = (series: Float64Array, walker: number, values: Float64Array): void => {
    const variance = values[0];
    if (!(variance > 0) || spreadOf(series) < CONSTANT_SPREAD_TOLERANCE) {
      constantWalkers.push(walker);
      return;
    }
    for (let lag = 0; lag < steps; lag++) correlation[lag] += values[lag] / variance;
  };
  // Two walkers per FFT (autocovariancePairInto): half the transforms.
  let walker = 0;
  for (; walker + 1 < walkerSeries.length; walker += 2) {
    workspace.autocovariancePairInto(walkerSeries[walker], walkerSeries[walker + 1], autocovariance, autocovarianceSecond);
    accumulate(walkerSeries[walker], walker, autocovariance);
    accumulate(walkerSeries[walker + 1], walker + 1, autocovarianceSecond);
  }
  if (walker < walkerSeries.length) accumulate(walkerSeries[walker], walker, workspace.autocovarianceInto(walkerSeries[walker], autocovariance));
  const walkersUsed = walkerSeries.length - constantWalkers.length;
  if (walkersUsed === 0) {
    throw new CandelaError({
      code: 'diagnostics.constant_draws',
      message: 'the autocorrelation time is undefined because no walker moved',
      expected: 'walkers whose positions change',
      found: `${walkerSeries.length} constant walkers`,
      fix: 'check that the parameter is free and that the walkers were started apart',
    });
  }
  for (let lag = 0; lag < steps; lag++) correlation[lag] /= walkersUsed;
  return { correlation, walkersUsed, constantWalkers };
}

/** max - min of a series. */
function spreadOf(series: Float64Array): number {
  let smallest = Infinity;
  let largest = -Infinity;
  for (let index = 0; index < series.length; index++) {
    if (series[index] < smallest) smallest = series[index];
    if (series[index] > largest) largest = series[index];
  }
  return largest - smallest;
}
