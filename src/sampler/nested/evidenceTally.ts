import { logAddExp } from './logAddExp.js';

/** Running evidence and information of a nested-sampling run. */
export interface EvidenceTally {
  /** ln Z so far (natural log). */
  logZ: number;
  /** Information H so far, in nats. */
  information: number;
}

/** An empty tally: ln Z = -Infinity, H = 0. */
export function createEvidenceTally(): EvidenceTally {
  return { logZ: -Infinity, information: 0 };
}

/**
 * Adds one dead point of log-likelihood `logLikelihood` and prior-mass width
 * w = X_(i-1) - X_i to the tally, with the update of Skilling (2006, Bayesian
 * Analysis 1, 833):
 *   Z_new = Z + w L,
 *   H_new = (w L / Z_new) ln L + (Z / Z_new)(H + ln Z) - ln Z_new.
 * A zero-likelihood point (ln L = -Infinity) changes nothing.
 *
 * Cost: O(1).
 * @param tally Updated in place.
 * @param logWidth ln w (nats).
 * @param logLikelihood ln L (nats).
 * @example addDeadPoint(tally, Math.log(0.5), 0) // tally.logZ = ln 0.5
 */
export function addDeadPoint(tally: EvidenceTally, logWidth: number, logLikelihood: number): void {
  const logWeight = logWidth + logLikelihood;
  if (logWeight === -Infinity) return;
  const logZNew = logAddExp(tally.logZ, logWeight);
  const fromPoint = Math.exp(logWeight - logZNew) * logLikelihood;
  const fromBefore = tally.logZ === -Infinity ? 0 : Math.exp(tally.logZ - logZNew) * (tally.information + tally.logZ);
  tally.information = fromPoint + fromBefore - logZNew;
  tally.logZ = logZNew;
}
