import { HALF_LOG_TWO_PI } from '../math/index.js';
import type { LikelihoodTerm, ParameterValues } from './likelihoodTerm.js';
import { createDenseWhitener } from './whitener.js';

/** What createMeasurementTerm needs: the measured vector, its fixed covariance and the model's prediction. */
export interface MeasurementTermOptions {
  name: string;
  /** Parameter names the prediction reads. */
  requires: readonly string[];
  /** Measured values, n. */
  observed: Float64Array;
  /** Row-major n x n covariance of the measurements (symmetric positive definite; checked by the reader). */
  covariance: Float64Array;
  /** Writes the model's values at p into `out` (n); returns why p is unphysical, or null. Must not throw. */
  predict(p: ParameterValues, out: Float64Array): string | null;
}

/**
 * A likelihood term for a small vector of measurements with a fixed Gaussian
 * covariance (BAO distances, a compressed CMB prior, ...):
 *   ln L = -(1/2) [r^T C^-1 r + ln det C + n ln 2 pi],  r = observed - predicted,
 * with C factorized once by Cholesky (Golub & Van Loan, algorithm 4.2.1).
 * bestFitExtras gives chi_square. Never throws once built: an unphysical
 * point gives -Infinity and rejectionReason says why; a non-finite chi-square
 * counts as a rejection, so NaN never leaks.
 * Cost per call: the prediction plus n^2/2 multiply-adds; allocates nothing.
 * @throws RangeError when the covariance does not factorize (readers check it first).
 * @example createMeasurementTerm({ name: 'h0_ladder', requires: ['h0'], observed: Float64Array.of(73), covariance: Float64Array.of(1), predict: (p, out) => { out[0] = p.h0; return null; } }).bestFitExtras?.({ h0: 72 }) // { chi_square: 1 }
 */
export function createMeasurementTerm(options: MeasurementTermOptions): LikelihoodTerm {
  const count = options.observed.length;
  const whitener = createDenseWhitener(count);
  whitener.matrix.set(options.covariance.subarray(0, count * count));
  const failure = whitener.factorize();
  if (failure !== null) throw new RangeError(`${options.name}: ${failure}`);
  const normalization = 0.5 * whitener.logDeterminant + count * HALF_LOG_TWO_PI;
  const residual = new Float64Array(count);

  const chiSquareOrReason = (p: ParameterValues): number | string => {
    const reason = options.predict(p, residual);
    if (reason !== null) return reason;
    for (let i = 0; i < count; i++) residual[i] = options.observed[i] - residual[i];
    whitener.whitenInPlace(residual);
    let sum = 0;
    for (let i = 0; i < count; i++) sum += residual[i] * residual[i];
    return Number.isFinite(sum) ? sum : `the ${options.name} chi-square is not finite`;
  };

  return {
    name: options.name,
    requires: [...options.requires],
    dataCount: count,
    logLikelihood(p) {
      const chi = chiSquareOrReason(p);
      return typeof chi === 'number' ? -0.5 * chi - normalization : -Infinity;
    },
    rejectionReason(p) {
      const chi = chiSquareOrReason(p);
      return typeof chi === 'number' ? null : chi;
    },
    bestFitExtras(p): Record<string, number> {
      const chi = chiSquareOrReason(p);
      return typeof chi === 'number' ? { chi_square: chi } : {};
    },
  };
}
