import { CandelaError } from '../errors.js';

/** A log evidence with its uncertainty (natural logs). */
export interface LogEvidence {
  /** ln Z. */
  logZ: number;
  /** One-sigma uncertainty of ln Z (>= 0). */
  logZError: number;
}

/** ln B with its uncertainty. */
export interface LogBayesFactorEstimate {
  /** ln B = ln Z_model - ln Z_base (positive favours the model). */
  logBayesFactor: number;
  /** sqrt(e_model^2 + e_base^2), treating the two runs as independent. */
  error: number;
}

/**
 * Log Bayes factor of a model against a base model from their evidences
 * (Jeffreys 1961; Kass & Raftery 1995, J. Am. Stat. Assoc. 90, 773):
 * ln B = ln Z_model - ln Z_base, with error sqrt(e_model^2 + e_base^2) for
 * independent runs (e.g. the sqrt(H/N) errors of two nested-sampling runs).
 *
 * Cost: O(1).
 * @param model ln Z and its error (nats).
 * @param base ln Z and its error of the reference model (nats).
 * @throws CandelaError `compare.invalid_argument` for a non-finite ln Z or a negative or non-finite error.
 * @example logBayesFactor({ logZ: -10, logZError: 0.3 }, { logZ: -12, logZError: 0.4 }) // { logBayesFactor: 2, error: 0.5 }
 */
export function logBayesFactor(model: LogEvidence, base: LogEvidence): LogBayesFactorEstimate {
  for (const [path, evidence] of [['model', model], ['base', base]] as const) {
    if (!Number.isFinite(evidence.logZ) || !(evidence.logZError >= 0) || !Number.isFinite(evidence.logZError)) {
      throw new CandelaError({ code: 'compare.invalid_argument', path, message: `the ${path} evidence is not usable`, expected: 'finite ln Z and error >= 0', found: `ln Z = ${evidence.logZ}, error = ${evidence.logZError}` });
    }
  }
  return { logBayesFactor: model.logZ - base.logZ, error: Math.hypot(model.logZError, base.logZError) };
}
