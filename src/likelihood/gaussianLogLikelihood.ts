import { compensatedSumOfSquares } from './compensatedSquares.js';
import { createOffsetMarginal, marginalizeOffset } from './marginalizeOffset.js';
import { createDenseWhitener, createDiagonalWhitener, type Whitener } from './whitener.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/** Parts of a Gaussian log-likelihood, all in natural-log units except the offset. */
export interface GaussianLogLikelihood {
  /** ln L, fully normalized: -(chi^2 + ln det C + N ln 2 pi [+ ln(E/2 pi)]) / 2. -Infinity when C is not positive definite. */
  logLikelihood: number;
  /** r^T C^-1 r (at the best offset when it is marginalized). */
  chiSquare: number;
  /** ln det C. */
  logDeterminant: number;
  /** Best additive offset M* (data units) when marginalized, else 0. */
  bestOffset: number;
  /** ln(E/2 pi) added by offset marginalization, else 0. */
  marginalizationTerm: number;
  /** Why logLikelihood is -Infinity, else null. */
  reason: string | null;
}

/**
 * The multivariate Gaussian log-likelihood of a residual vector r = data -
 * model with covariance C, on generic vectors (not the hot path: it allocates
 * and factorizes on every call; the supernova term keeps factors around).
 *
 *   -2 ln L = r^T C^-1 r + ln det C + N ln 2 pi,
 *
 * by Cholesky factorization and triangular solves, never an inverse. With
 * `marginalizeOffset`, an additive offset M common to all entries is
 * integrated out with a flat prior ({@link marginalizeOffset}: Goliath et
 * al. 2001; Conley et al. 2011, appendix C), adding ln(E/2 pi), E = 1^T C^-1 1.
 *
 * Cost: N^3/3 (dense) or O(N) (diagonal) multiply-adds.
 * @param residual r, length N, data units (mag)
 * @param covariance row-major N x N matrix (mag^2), or the N variances when `diagonal` is true
 * @param options `diagonal`: covariance holds variances only; `marginalizeOffset`: integrate out a common offset
 * @returns the parts; never throws, never NaN (a non-positive-definite C gives -Infinity with a reason)
 * @example gaussianLogLikelihood(Float64Array.of(1), Float64Array.of(1)).logLikelihood // -(1 + ln 2 pi)/2
 */
export function gaussianLogLikelihood(
  residual: Float64Array,
  covariance: Float64Array,
  options: { diagonal?: boolean; marginalizeOffset?: boolean } = {},
): GaussianLogLikelihood {
  const n = residual.length;
  const whitener: Whitener = options.diagonal ? createDiagonalWhitener(n) : createDenseWhitener(n);
  whitener.matrix.set(covariance.subarray(0, whitener.matrix.length));
  const failure = whitener.factorize();
  if (failure) {
    return { logLikelihood: -Infinity, chiSquare: NaN, logDeterminant: NaN, bestOffset: NaN, marginalizationTerm: NaN, reason: failure };
  }
  const whitened = Float64Array.from(residual);
  whitener.whitenInPlace(whitened);
  let chiSquare: number;
  let bestOffset = 0;
  let marginalizationTerm = 0;
  if (options.marginalizeOffset) {
    const template = new Float64Array(n).fill(1);
    whitener.whitenInPlace(template);
    const marginal = marginalizeOffset(whitened, template, NaN, n, createOffsetMarginal());
    chiSquare = marginal.chiSquareAtBest;
    bestOffset = marginal.bestOffset;
    marginalizationTerm = marginal.marginalizationTerm;
  } else {
    chiSquare = compensatedSumOfSquares(whitened, n);
  }
  const logDeterminant = whitener.logDeterminant;
  const total = chiSquare + logDeterminant + n * LOG_TWO_PI + marginalizationTerm;
  if (!Number.isFinite(total)) {
    return { logLikelihood: -Infinity, chiSquare, logDeterminant, bestOffset, marginalizationTerm, reason: 'residual or covariance is not finite' };
  }
  return { logLikelihood: -0.5 * total, chiSquare, logDeterminant, bestOffset, marginalizationTerm, reason: null };
}
