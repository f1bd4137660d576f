import { createOffsetMarginal } from './marginalizeOffset.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { finishEvaluation, rejectEvaluation, type SupernovaEvaluation, type SupernovaEvaluator } from './supernovaEvaluation.js';
import type { SupernovaModel } from './supernovaModel.js';
import { createDenseWhitener, createDiagonalWhitener } from './whitener.js';
import { compensatedDot } from './compensatedSquares.js';

/**
 * The exact evaluation paths: distances at every supernova, the residual
 * whitened by the factor of C.
 *
 * - 'diagonal': C diagonal; O(N) per call, including ln det C = sum ln C_ii
 *   when C follows alpha, beta or sigma_int.
 * - 'general': dense C; Cholesky factorization (N^3/3 multiply-adds) whenever
 *   the covariance inputs (alpha, beta, sigma_int) change, then triangular
 *   solves (N^2/2) per call. A covariance that does not change is factorized
 *   once and reused.
 *
 * The factorization is cached under the covariance inputs, so identical
 * inputs never refactorize. Allocates its buffers here, nothing per call.
 * @param model the shared supernova model
 * @param kind 'diagonal' (requires model.covariance.diagonal) or 'general'
 */
export function createExactEvaluator(model: SupernovaModel, kind: 'diagonal' | 'general'): SupernovaEvaluator {
  const n = model.count;
  const covariance = model.covariance;
  const whitener = kind === 'diagonal' ? createDiagonalWhitener(n) : createDenseWhitener(n);
  const inputs = new Float64Array(covariance.inputCount);
  const cachedInputs = new Float64Array(covariance.inputCount).fill(NaN);
  const residual = new Float64Array(n);
  const ones = new Float64Array(n);
  const marginal = createOffsetMarginal();
  let precision = NaN;
  let factorFailure: string | null = null;
  let factorizations = 0;
  const sampled = model.names.readsAbsMag;

  const prepareCovariance = (p: ParameterValues): string | null => {
    model.readCovarianceInputs(p, inputs);
    let same = true;
    for (let k = 0; k < inputs.length; k++) if (!(inputs[k] === cachedInputs[k])) same = false;
    if (same) return factorFailure;
    cachedInputs.set(inputs);
    if (kind === 'diagonal') covariance.fillVariances(inputs, whitener.matrix);
    else covariance.fillDense(inputs, whitener.matrix);
    factorizations++;
    factorFailure = whitener.factorize();
    if (factorFailure) return factorFailure;
    ones.fill(1);
    whitener.whitenInPlace(ones);
    precision = compensatedDot(ones, ones, n);
    return null;
  };

  return {
    path: kind,
    evaluate(p, out: SupernovaEvaluation) {
      const unphysical = model.offsetFreeResidual(p, residual);
      if (unphysical) return rejectEvaluation(out, unphysical);
      const failure = prepareCovariance(p);
      if (failure) return rejectEvaluation(out, failure);
      whitener.whitenInPlace(residual);
      finishEvaluation(residual, ones, precision, whitener.logDeterminant, n, sampled ? p.abs_mag : null, marginal, out);
    },
    describe() {
      const varies = model.covarianceVaries ? 'follows alpha, beta or sigma_int' : 'is fixed';
      return kind === 'diagonal'
        ? [`path: diagonal covariance, O(N) per call with N = ${n} (the covariance ${varies}; ln det C = sum of ln variances)`]
        : [
          `path: general dense covariance, N = ${n}: Cholesky factorization O(N^3/3) = ${((n ** 3) / 3).toExponential(2)} multiply-adds ` +
            `whenever alpha, beta or sigma_int change, then O(N^2/2) triangular solves per call (the covariance ${varies})`,
          `factorizations so far: ${factorizations}`,
        ];
    },
  };
}
