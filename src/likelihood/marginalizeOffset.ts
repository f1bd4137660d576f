import { compensatedDot, compensatedSumOfShiftedSquares } from './compensatedSquares.js';

/** Result of {@link marginalizeOffset}; mutable so that the hot path can reuse one record. */
export interface OffsetMarginal {
  /** chi^2 at the best offset, chi^2_min = A - B^2/E (computed as a sum of squares, without cancellation). */
  chiSquareAtBest: number;
  /** Best offset M* = B / E, in data units (mag). */
  bestOffset: number;
  /** E = 1^T C^-1 1, in 1/mag^2. */
  templatePrecision: number;
  /** ln(E / 2 pi): what marginalizing adds to -2 ln L. */
  marginalizationTerm: number;
}

/** A fresh record for {@link marginalizeOffset}. */
export function createOffsetMarginal(): OffsetMarginal {
  return { chiSquareAtBest: NaN, bestOffset: NaN, templatePrecision: NaN, marginalizationTerm: NaN };
}

/**
 * Analytic marginalization of an additive offset M (in the supernova case
 * the absolute magnitude together with 5 log10(c/H0)) with a flat prior of
 * unit density per mag (Goliath et al. 2001, A&A 380, 6; Conley et al. 2011,
 * ApJS 192, 1, appendix C). With the residual d = data - model without offset,
 *
 *   chi^2(M) = (d - M 1)^T C^-1 (d - M 1) = A - 2 B M + E M^2,
 *   A = d^T C^-1 d,  B = 1^T C^-1 d,  E = 1^T C^-1 1,
 *
 *   -2 ln integral exp(-chi^2(M)/2) dM = A - B^2/E + ln(E / 2 pi).
 *
 * So the marginal -2 ln L is chi^2_min + ln(E/2 pi) + ln det C + N ln 2 pi,
 * with chi^2_min = A - B^2/E reached at M* = B/E. Both inputs are whitened
 * (e = L^-1 d and w = L^-1 1, C = L L^T); chi^2_min is summed as
 * |e - M* w|^2 so that no large A and B^2/E cancel.
 *
 * Cost: O(n), no allocation. Never throws (E <= 0 gives NaN fields; callers
 * pass a whitened all-ones vector, for which E > 0).
 * @param whitenedResidual e = L^-1 d (length >= n), dimensionless
 * @param whitenedTemplate w = L^-1 1 (length >= n), in 1/mag
 * @param templatePrecision E = |w|^2, in 1/mag^2 (pass it when precomputed, else NaN to compute)
 * @param n number of data points
 * @param out record to fill
 * @example // C = I (n = 2), d = (1, 3): M* = 2, chi^2_min = 2, term ln(2 / 2 pi)
 * marginalizeOffset(Float64Array.of(1, 3), Float64Array.of(1, 1), 2, 2, createOffsetMarginal());
 */
export function marginalizeOffset(
  whitenedResidual: Float64Array,
  whitenedTemplate: Float64Array,
  templatePrecision: number,
  n: number,
  out: OffsetMarginal,
): OffsetMarginal {
  const precision = Number.isNaN(templatePrecision) ? compensatedDot(whitenedTemplate, whitenedTemplate, n) : templatePrecision;
  const projection = compensatedDot(whitenedTemplate, whitenedResidual, n);
  const best = projection / precision;
  out.templatePrecision = precision;
  out.bestOffset = best;
  out.chiSquareAtBest = compensatedSumOfShiftedSquares(whitenedResidual, whitenedTemplate, best, n);
  out.marginalizationTerm = Math.log(precision / (2 * Math.PI));
  return out;
}
