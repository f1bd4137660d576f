import type { ParameterValues } from './likelihoodTerm.js';
import { compensatedSumOfShiftedSquares } from './compensatedSquares.js';
import { marginalizeOffset, type OffsetMarginal } from './marginalizeOffset.js';
import type { SupernovaPath } from './supernovaTermOptions.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/** One evaluation of the supernova term (a mutable record reused by the hot path). */
export interface SupernovaEvaluation {
  /** ln L, fully normalized (see createSupernovaTerm); -Infinity when rejected. */
  logLikelihood: number;
  /** r^T C^-1 r at the absolute magnitude used (its best fit when marginalized). */
  chiSquare: number;
  /** ln det C. */
  logDeterminant: number;
  /** ln(E/2 pi) when the offset is marginalized, else 0. */
  marginalizationTerm: number;
  /** Best-fit absolute magnitude given the other parameters, mag. */
  bestAbsoluteMagnitude: number;
  /** Why logLikelihood is -Infinity, else null. */
  reason: string | null;
}

/** A fresh evaluation record. */
export function createSupernovaEvaluation(): SupernovaEvaluation {
  return { logLikelihood: NaN, chiSquare: NaN, logDeterminant: NaN, marginalizationTerm: NaN, bestAbsoluteMagnitude: NaN, reason: null };
}

/** One evaluation strategy of the supernova term. */
export interface SupernovaEvaluator {
  readonly path: SupernovaPath;
  /** Fills `out` at p. No allocation. */
  evaluate(p: ParameterValues, out: SupernovaEvaluation): void;
  /** Lines for describe(): the strategy, its cost, its accuracy. */
  describe(): string[];
}

/** Marks the record as rejected with a reason. */
export function rejectEvaluation(out: SupernovaEvaluation, reason: string): void {
  out.logLikelihood = -Infinity;
  out.chiSquare = NaN;
  out.reason = reason;
}

/**
 * Completes an evaluation from the whitened offset-free residual e = L^-1 d
 * and the whitened ones w = L^-1 1:
 *   marginalized: -2 ln L = chi^2_min + ln(E/2 pi) + ln det C + N ln 2 pi (Conley et al. 2011, appendix C);
 *   sampled:      -2 ln L = |e - M w|^2 + ln det C + N ln 2 pi.
 * The conditional best M* = w.e / E is reported in both cases. O(N).
 */
export function finishEvaluation(
  e: Float64Array, w: Float64Array, precision: number, logDeterminant: number, n: number,
  sampledAbsoluteMagnitude: number | null, marginal: OffsetMarginal, out: SupernovaEvaluation,
): void {
  marginalizeOffset(e, w, precision, n, marginal);
  out.bestAbsoluteMagnitude = marginal.bestOffset;
  out.logDeterminant = logDeterminant;
  if (sampledAbsoluteMagnitude === null) {
    out.chiSquare = marginal.chiSquareAtBest;
    out.marginalizationTerm = marginal.marginalizationTerm;
  } else {
    out.chiSquare = compensatedSumOfShiftedSquares(e, w, sampledAbsoluteMagnitude, n);
    out.marginalizationTerm = 0;
  }
  completeEvaluation(n, out);
}

/** Sets logLikelihood from chiSquare, logDeterminant and marginalizationTerm (or rejects a non-finite total). */
export function completeEvaluation(n: number, out: SupernovaEvaluation): void {
  const total = out.chiSquare + out.logDeterminant + n * LOG_TWO_PI + out.marginalizationTerm;
  if (Number.isFinite(total)) {
    out.logLikelihood = -0.5 * total;
    out.reason = null;
  } else {
    rejectEvaluation(out, `chi-square is not finite (${out.chiSquare}); a parameter or a data value is not a finite number`);
  }
}
