import { solveLowerInPlace } from '../math/index.js';
import { compensatedDot, compensatedSumOfShiftedSquares, compensatedSumOfSquares } from './compensatedSquares.js';
import type { GaussianLogLikelihood } from './gaussianLogLikelihood.js';
import { buildLowRankCapacitance, dot } from './lowRankCapacitance.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/** The covariance C = D + U U^T of {@link createLowRankGaussian}. */
export interface LowRankGaussianOptions {
  /** D: the N variances of the diagonal part, mag^2 (positive, finite). */
  diagonalVariance: Float64Array;
  /** U: N x K row major (the K mode values of data point i at i*K .. i*K+K-1), mag; K = modes.length / N, 0 allowed. */
  modes: Float64Array;
}

/** A Gaussian likelihood whose covariance is diagonal plus low rank. */
export interface LowRankGaussian {
  /** N, the number of data points. */
  readonly size: number;
  /** K, the number of modes. */
  readonly modeCount: number;
  /** ln det C = ln det D + ln det(I + U^T D^-1 U). */
  readonly logDeterminant: number;
  /** E = 1^T C^-1 1, 1/mag^2 (what offset marginalization needs). */
  readonly templatePrecision: number;
  /** r^T C^-1 r for a residual r of length N (mag). O(N K), no allocation. */
  chiSquare(residual: Float64Array): number;
  /**
   * The normalized log-likelihood of the offset-free residual d = data - model (mag, length N)
   * with an additive offset M: 'marginalize' integrates M out with a flat prior, a number uses
   * that M (mag). Fills and returns `out` (create one with createLowRankEvaluation). O(N K).
   */
  evaluate(offsetFreeResidual: Float64Array, offset: 'marginalize' | number, out: GaussianLogLikelihood): GaussianLogLikelihood;
}

/** A fresh result record for {@link LowRankGaussian.evaluate}. */
export function createLowRankEvaluation(): GaussianLogLikelihood {
  return { logLikelihood: NaN, chiSquare: NaN, logDeterminant: NaN, bestOffset: NaN, marginalizationTerm: NaN, reason: null };
}

/**
 * The Gaussian likelihood with a covariance that is diagonal plus K
 * systematic modes, C = D + U U^T, evaluated through the Woodbury identity
 * (Woodbury 1950; Hager 1989, SIAM Review 31, 221) and the matrix
 * determinant lemma, without ever forming an N x N matrix:
 *
 *   r^T C^-1 r = r^T D^-1 r - (U^T D^-1 r)^T S^-1 (U^T D^-1 r),   S = I + U^T D^-1 U,
 *   ln det C   = ln det D + ln det S.
 *
 * S^-1 is applied through the Cholesky factor of S, never inverted. With
 * y = D^-1/2 r and V = D^-1/2 U the first term is |y|^2 and the second
 * |L^-1 V^T y|^2 (S = L L^T), so chi^2 is a difference of two sums of
 * squares; the second never exceeds the first, and the difference loses
 * about log10(r^T D^-1 r / chi^2) digits, one or two when the modes are of
 * the size of the per-point errors.
 *
 * Offset marginalization (flat prior on M; Goliath et al. 2001, Conley et
 * al. 2011 appendix C): with A, B = 1^T C^-1 d and E = 1^T C^-1 1, the
 * best offset is M* = B/E and -2 ln L gains ln(E/2 pi). The offset is
 * subtracted entry by entry, z = y - M D^-1/2 1, before any square is
 * summed, so a large common offset (an absolute magnitude near -19) never
 * cancels against itself; only the Woodbury correction of z is subtracted.
 *
 *   -2 ln L = chi^2(M) + ln det C + N ln 2 pi [+ ln(E/2 pi) when marginalized].
 *
 * E = 1^T C^-1 1 is the same kind of difference; it loses about
 * log10(1 + N s^2/sigma^2) digits when one mode is a common offset of s mag
 * on N points with errors sigma (three digits for N = 10^5, s = sigma/10).
 *
 * Cost: set-up N K^2/2 + K^3/3 multiply-adds and one N x K copy of the modes;
 * per call N K + 3 N multiply-adds and K^2 for the small solves. The N K
 * part streams the whole N x K mode array (40 MB for N = 10^5, K = 50) once
 * per call, so it is bound by memory bandwidth at large N.
 * @param options D (mag^2) and U (mag), see {@link LowRankGaussianOptions}
 * @throws CandelaError `likelihood.low_rank_shape`, `likelihood.low_rank_variance`, `likelihood.low_rank_mode`
 *   for an empty D, a modes length that is not a multiple of N, a variance that is not positive and finite,
 *   a non-finite mode entry
 * @example // D = diag(1, 4), one mode U = (1, 2): C = [[2, 2], [2, 8]], det C = 12
 * const gaussian = createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 4), modes: Float64Array.of(1, 2) });
 * gaussian.chiSquare(Float64Array.of(1, 1)); // 0.5
 * gaussian.logDeterminant; // ln 12
 */
export function createLowRankGaussian(options: LowRankGaussianOptions): LowRankGaussian {
  const capacitance = buildLowRankCapacitance(options.diagonalVariance, options.modes);
  const { size, modeCount, inverseDeviation, scaledModes, capacitanceFactor } = capacitance;
  const logDeterminant = capacitance.logDeterminantDiagonal + capacitance.logDeterminantCapacitance;
  const whitened = new Float64Array(size);
  const projection = new Float64Array(modeCount);
  const onesProjection = new Float64Array(modeCount);
  const solved = new Float64Array(modeCount);
  const modeRows = Array.from({ length: modeCount }, (_, k) => scaledModes.subarray(k * size, (k + 1) * size));

  /** out = V^T v (K dot products of length N). */
  const projectModes = (v: Float64Array, out: Float64Array): void => {
    for (let k = 0; k < modeCount; k++) out[k] = dot(modeRows[k], v, size);
  };
  /** |L^-1 c|^2 = c^T S^-1 c for a K-vector c (copied into `solved`). */
  const capacitanceQuadratic = (c: Float64Array): number => {
    solved.set(c);
    solveLowerInPlace(capacitanceFactor, modeCount, solved);
    return compensatedSumOfSquares(solved, modeCount);
  };

  // Ones, whitened by D: y1 = s. a1 = V^T y1; E = |y1|^2 - a1^T S^-1 a1 and g1 = L^-1 a1 for B.
  projectModes(inverseDeviation, onesProjection);
  const onesSolved = Float64Array.from(onesProjection);
  solveLowerInPlace(capacitanceFactor, modeCount, onesSolved);
  const templatePrecision = compensatedSumOfSquares(inverseDeviation, size) - compensatedSumOfSquares(onesSolved, modeCount);
  const marginalizationTerm = Math.log(templatePrecision / (2 * Math.PI));

  const whiten = (residual: Float64Array): void => {
    for (let i = 0; i < size; i++) whitened[i] = residual[i] * inverseDeviation[i];
    projectModes(whitened, projection);
  };

  return {
    size,
    modeCount,
    logDeterminant,
    templatePrecision,
    chiSquare(residual) {
      whiten(residual);
      return compensatedSumOfSquares(whitened, size) - capacitanceQuadratic(projection);
    },
    evaluate(offsetFreeResidual, offset, out) {
      whiten(offsetFreeResidual);
      // B = 1^T C^-1 d = y1.y - (L^-1 a1).(L^-1 a). Its rounding only moves M*, where chi^2 is stationary.
      solved.set(projection);
      solveLowerInPlace(capacitanceFactor, modeCount, solved);
      const crossPrecision = compensatedDot(inverseDeviation, whitened, size) - compensatedDot(onesSolved, solved, modeCount);
      const bestOffset = crossPrecision / templatePrecision;
      const used = offset === 'marginalize' ? bestOffset : offset;
      // z = y - M y1 entry by entry; V^T z = a - M a1.
      const diagonalPart = compensatedSumOfShiftedSquares(whitened, inverseDeviation, used, size);
      for (let k = 0; k < modeCount; k++) projection[k] -= used * onesProjection[k];
      const chiSquare = diagonalPart - capacitanceQuadratic(projection);
      out.chiSquare = chiSquare;
      out.logDeterminant = logDeterminant;
      out.bestOffset = bestOffset;
      out.marginalizationTerm = offset === 'marginalize' ? marginalizationTerm : 0;
      const total = chiSquare + logDeterminant + size * LOG_TWO_PI + out.marginalizationTerm;
      if (Number.isFinite(total)) {
        out.logLikelihood = -0.5 * total;
        out.reason = null;
      } else {
        out.logLikelihood = -Infinity;
        out.reason = `chi-square is not finite (${chiSquare}); a residual or the offset is not a finite number`;
      }
      return out;
    },
  };
}
