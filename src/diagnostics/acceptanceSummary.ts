import { CandelaError } from '../errors.js';
import { compensatedSum, quantileOfSortedDraws } from '../math/index.js';

/**
 * A walker is stuck when its acceptance fraction is below this share of the
 * ensemble median (or exactly 0). Common practice: in a healthy ensemble the
 * fractions scatter by tens of percent around the median, so a walker at a
 * fifth of it has fallen into a region the others do not visit.
 */
export const STUCK_SHARE_OF_MEDIAN = 0.2;

/** Acceptance of the proposals of an ensemble, with the walkers that look stuck. */
export interface AcceptanceSummary {
  /** Mean acceptance fraction over walkers (0..1). */
  mean: number;
  /** Median acceptance fraction over walkers (0..1). */
  median: number;
  /** Smallest acceptance fraction (0..1). */
  min: number;
  /** Largest acceptance fraction (0..1). */
  max: number;
  /** 0-based indices of walkers with fraction 0 or below 0.2 x median, ascending. */
  stuckWalkers: number[];
}

/**
 * Summarizes per-walker acceptance fractions and flags stuck walkers.
 * Rule: walker w is stuck when fraction[w] === 0 or fraction[w] < 0.2 x median
 * ({@link STUCK_SHARE_OF_MEDIAN}). For the stretch move Goodman & Weare (2010)
 * and common practice expect ensemble fractions of roughly 0.2 to 0.5.
 *
 * Cost: one sort of a copy, O(W log W).
 * @param fractions accepted / proposed per walker, each in [0, 1] (dimensionless).
 * @throws CandelaError `diagnostics.no_walkers` for an empty array,
 *   `diagnostics.acceptance_range` for a fraction outside [0, 1] or NaN.
 * @example acceptanceSummary(Float64Array.of(0.3, 0.35, 0.05, 0.4, 0))
 * // => { mean: 0.22, median: 0.3, min: 0, max: 0.4, stuckWalkers: [2, 4] }
 */
export function acceptanceSummary(fractions: Float64Array): AcceptanceSummary {
  if (fractions.length === 0) {
    throw new CandelaError({ code: 'diagnostics.no_walkers', message: 'no acceptance fractions were given', expected: 'one fraction per walker', found: '0' });
  }
  const outOfRange = fractions.findIndex((fraction) => !(fraction >= 0 && fraction <= 1));
  if (outOfRange >= 0) {
    throw new CandelaError({
      code: 'diagnostics.acceptance_range',
      message: 'an acceptance fraction lies outside [0, 1]',
      path: `walkers[${outOfRange}]`,
      expected: '0 <= fraction <= 1',
      found: String(fractions[outOfRange]),
    });
  }
  const sorted = Float64Array.from(fractions).sort();
  const median = quantileOfSortedDraws(sorted, 0.5);
  const stuckWalkers: number[] = [];
  fractions.forEach((fraction, walker) => {
    if (fraction === 0 || fraction < STUCK_SHARE_OF_MEDIAN * median) stuckWalkers.push(walker);
  });
  return {
    mean: compensatedSum(fractions) / fractions.length,
    median,
    min: sorted[0],
    max: sorted[sorted.length - 1],
    stuckWalkers,
  };
}
