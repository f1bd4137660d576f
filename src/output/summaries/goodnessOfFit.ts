import { regularizedGammaQ } from '../../math/index.js';
import { runWarning, type RunWarning } from './runWarning.js';

/** Below this chi-square p-value the errors look too small or the model wrong; above 1 minus it, the errors look too large (common practice). */
export const GOODNESS_OF_FIT_TAIL = 0.001;

/** The chi-square per degree of freedom at the best fit and its p-value. */
export interface GoodnessOfFit {
  chiSquare: number;
  degreesOfFreedom: number;
  /** chi-square / degrees of freedom (dimensionless). */
  reducedChiSquare: number;
  /** P(chi-square_k >= observed) = Q(k/2, chi-square/2), the regularized upper incomplete gamma function (Abramowitz & Stegun 1964, 26.4.2). */
  pValue: number;
  /** True when the p-value is below {@link GOODNESS_OF_FIT_TAIL} or above 1 - that. */
  flagged: boolean;
}

/**
 * The chi-square goodness of fit at the best fit: chi-square per degree of
 * freedom and the probability of a chi-square at least as large for that many
 * degrees of freedom. Null when either number is missing or there is no
 * degree of freedom.
 * Cost: one incomplete gamma function.
 * @param chiSquare the best fit's chi-square (dimensionless), or null.
 * @param degreesOfFreedom data points minus free parameters.
 * @returns the numbers, or null.
 * @throws nothing.
 * @example goodnessOfFit(10, 10)?.pValue // 0.4405 (chi-square table, k = 10)
 */
export function goodnessOfFit(chiSquare: number | null, degreesOfFreedom: number): GoodnessOfFit | null {
  if (chiSquare === null || !Number.isFinite(chiSquare) || !(degreesOfFreedom >= 1)) return null;
  const pValue = regularizedGammaQ(degreesOfFreedom / 2, chiSquare / 2);
  return {
    chiSquare, degreesOfFreedom, reducedChiSquare: chiSquare / degreesOfFreedom, pValue,
    flagged: pValue < GOODNESS_OF_FIT_TAIL || pValue > 1 - GOODNESS_OF_FIT_TAIL,
  };
}

/**
 * The warning for a flagged goodness of fit: errors too small (or a wrong
 * model) for a tiny p-value, errors too large for a p-value near 1.
 * @param fit the numbers of {@link goodnessOfFit}.
 * @returns the warning, or null when the fit is not flagged.
 * @example goodnessOfFitWarning(goodnessOfFit(430, 1000)!)?.code // 'goodness_of_fit'
 */
export function goodnessOfFitWarning(fit: GoodnessOfFit): RunWarning | null {
  if (!fit.flagged) return null;
  const low = fit.pValue < GOODNESS_OF_FIT_TAIL;
  const reading = low
    ? 'the scatter is larger than the errors allow: errors too small or the model incomplete'
    : 'the scatter is smaller than the errors allow: errors too large (e.g. an intrinsic dispersion counted twice, or plotting errors standing in for a covariance)';
  return runWarning('goodness_of_fit', null,
    `chi-square per degree of freedom ${fit.reducedChiSquare.toFixed(3)} (${fit.chiSquare.toFixed(2)} for ${fit.degreesOfFreedom}), p-value ${formatP(fit.pValue)}: ${reading}`,
    { chi_square: fit.chiSquare, degrees_of_freedom: fit.degreesOfFreedom, chi_square_per_degree_of_freedom: fit.reducedChiSquare, p_value: fit.pValue });
}

function formatP(p: number): string {
  if (p === 0) return '< 1e-300';
  if (p > 1 - 1e-4) return `1 - ${(1 - p).toExponential(1)}`;
  return p < 1e-3 ? p.toExponential(1) : p.toFixed(4);
}
