import { CandelaError } from '../errors.js';

/** Burn-in length in units of the largest autocorrelation time (common practice: a few tau). */
export const BURN_IN_TAU_MULTIPLE = 2;
/** The burn-in never takes more than this share of the chain, so that draws remain. */
export const MAXIMUM_BURN_IN_SHARE = 0.5;

/**
 * Chooses how many initial steps to discard: ceil(2 x max tau), capped at
 * floor(steps / 2). Common practice: after a few autocorrelation times the
 * walkers have forgotten their starting ball; the cap keeps at least half the
 * chain, and a chain where the cap binds is too short (its tau estimate is also
 * unreliable, see {@link integratedAutocorrelationTime}).
 *
 * Cost: O(number of parameters).
 * @param tauSteps integrated autocorrelation time per parameter, in steps (finite, > 0).
 * @param steps steps per walker in the chain (a non-negative integer).
 * @returns steps to discard from the start of every walker (an integer, 0 <= result <= steps / 2).
 * @throws CandelaError `diagnostics.no_tau` for an empty list, `diagnostics.tau_value` for a tau
 *   that is not finite and positive, `diagnostics.step_count` for a bad step count.
 * @example chooseBurnIn([12.3, 40.2, 7], 5000) // => 81
 */
export function chooseBurnIn(tauSteps: readonly number[], steps: number): number {
  if (!Number.isInteger(steps) || steps < 0) {
    throw new CandelaError({ code: 'diagnostics.step_count', message: 'the step count must be a non-negative integer', expected: 'an integer >= 0', found: String(steps) });
  }
  if (tauSteps.length === 0) {
    throw new CandelaError({ code: 'diagnostics.no_tau', message: 'no autocorrelation time was given to choose the burn-in from', expected: 'one tau per parameter', found: '0' });
  }
  const bad = tauSteps.findIndex((tau) => !(Number.isFinite(tau) && tau > 0));
  if (bad >= 0) {
    throw new CandelaError({ code: 'diagnostics.tau_value', message: 'an autocorrelation time is not a positive number', path: `tau[${bad}]`, expected: 'a finite tau > 0', found: String(tauSteps[bad]) });
  }
  const longest = Math.max(...tauSteps);
  return Math.min(Math.ceil(BURN_IN_TAU_MULTIPLE * longest), Math.floor(MAXIMUM_BURN_IN_SHARE * steps));
}
