import { ensembleAutocorrelation, MINIMUM_STEPS_FOR_TAU } from './ensembleAutocorrelation.js';

export { MINIMUM_STEPS_FOR_TAU };

/**
 * Window factor c of Sokal's automatic window: the smallest M with
 * M >= c tau(M). Sokal (1997) finds c between 4 and 10 adequate; 5 is the
 * value Goodman & Weare (2010) and common practice use for ensemble samplers.
 */
export const SOKAL_WINDOW_FACTOR = 5;

/**
 * The "50 tau" rule: a tau estimate is trusted, and a chain counts as long
 * enough, when it is at least this many tau long (common practice: shorter
 * chains underestimate tau; Goodman & Weare 2010 advise tens of tau). The one
 * home of this number: the run warnings, summary.json and the report use it.
 */
export const RELIABLE_STEPS_PER_TAU = 50;

/**
 * A tau estimate is trusted only when its window is at most this share of the
 * chain. With c = 5 this is the same demand as 50 tau for a correct estimate,
 * and it catches short chains whose estimate collapses: the biased
 * autocorrelations of a centred series sum to zero over all lags, so tau(M)
 * falls towards 0 at large M and a late window gives a small, wrong tau.
 */
export const RELIABLE_MAXIMUM_WINDOW_SHARE = 0.1;

/** Integrated autocorrelation time of one parameter, estimated from an ensemble. */
export interface AutocorrelationTimeEstimate {
  /** tau, in steps: how many steps of one walker are worth one independent draw (floored, see below). */
  tauSteps: number;
  /** Window M, in steps, at which the autocorrelation sum was cut. */
  windowSteps: number;
  /** Steps per walker used. */
  steps: number;
  /** Walkers whose series varies (the ones averaged). */
  walkersUsed: number;
  /** 0-based indices of walkers whose series is constant (left out of the average). */
  constantWalkers: number[];
  /** steps x walkersUsed / tau: independent draws in the whole ensemble. */
  effectiveSampleSize: number;
  /** steps >= 50 tau and window <= steps / 10. */
  reliable: boolean;
}

/**
 * Integrated autocorrelation time of an ensemble chain, one series per walker:
 * - rho(t), the normalized autocorrelation averaged over the walkers
 *   (ensembleAutocorrelation; Goodman & Weare 2010, "Ensemble samplers with
 *   affine invariance", Comm. App. Math. Comp. Sci. 5(1), 65, sec. 4, measure
 *   tau this way for ensemble samplers);
 * - tau(M) = 1 + 2 sum_{t=1}^{M} rho(t), with M the smallest lag such that
 *   M >= c tau(M), c = 5: the automatic window of Sokal (1997, "Monte Carlo
 *   methods in statistical mechanics: foundations and new algorithms", in
 *   Functional Integration, Springer, 131, sec. 3).
 * Walkers that never move are left out and listed. Because the estimator
 * cannot see an anticorrelated chain well, tau is floored at 1/log10(max(N, 10))
 * for N = steps x walkers, the cap Vehtari et al. (2021) put on the ESS.
 *
 * Cost: two FFTs of length nextPowerOfTwo(2 steps) per pair of walkers, O(W n log n).
 * @param walkerSeries one series per walker, equal lengths >= 2, finite (any units).
 * @returns the estimate with its window, ESS and reliability flag.
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.unequal_chains`, `diagnostics.too_few_draws`,
 *   `diagnostics.non_finite_draw`; `diagnostics.constant_draws` when every walker is constant.
 * @example integratedAutocorrelationTime(walkersOfAnAr1Process).tauSteps // about (1 + phi)/(1 - phi)
 */
export function integratedAutocorrelationTime(walkerSeries: readonly Float64Array[]): AutocorrelationTimeEstimate {
  const steps = walkerSeries[0]?.length ?? 0;
  const { correlation, walkersUsed, constantWalkers } = ensembleAutocorrelation(walkerSeries);

  // A window always exists up to rounding (tau(steps - 1) = 0, see
  // RELIABLE_MAXIMUM_WINDOW_SHARE); the last lag is the fallback.
  let tauAtWindow = 1;
  let windowSteps = steps - 1;
  for (let lag = 1; lag < steps; lag++) {
    tauAtWindow += 2 * correlation[lag];
    if (lag >= SOKAL_WINDOW_FACTOR * tauAtWindow) {
      windowSteps = lag;
      break;
    }
  }
  const tauFloor = 1 / Math.log10(Math.max(steps * walkersUsed, 10));
  const tauSteps = Math.max(tauAtWindow, tauFloor);
  return {
    tauSteps,
    windowSteps,
    steps,
    walkersUsed,
    constantWalkers,
    effectiveSampleSize: (steps * walkersUsed) / tauSteps,
    reliable: steps >= RELIABLE_STEPS_PER_TAU * tauSteps && windowSteps <= RELIABLE_MAXIMUM_WINDOW_SHARE * steps,
  };
}
