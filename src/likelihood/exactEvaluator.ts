import { createOffsetMarginal } from './marginalizeOffset.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { finishEvaluation, rejectEvaluation, type SupernovaEvaluation, type SupernovaEvaluator } from './supernovaEvaluation.js';
import type { SupernovaModel } from './supernovaModel.js';
import { createDenseWhitener, createDiagonalWhitener, type Whitener } from './whitener.js';
import { createModesWhitener } from './modesWhitener.js';
import { compensatedDot } from './compensatedSquares.js';

/**
 * The exact evaluation paths: distances at every supernova, the residual
 * whitened by the factor of C.
 *
 * - 'diagonal': C diagonal; O(N) per call, including ln det C = sum ln C_ii
 *   when C follows alpha, beta or sigma_int.
 * - 'low_rank': C = D + U U^T (diagonal plus K systematic modes); the
 *   Woodbury whitening operator (createModesWhitener) is rebuilt, O(N K^2),
 *   whenever the covariance inputs change, then O(N K) per call.
 * - 'general': dense C; Cholesky factorization (N^3/3 multiply-adds) whenever
 *   the covariance inputs (alpha, beta, sigma_int) change, then triangular
 *   solves (N^2/2) per call. A covariance that does not change is factorized
 *   once and reused.
 *
 * The factorization is cached under the covariance inputs, so identical
 * inputs never refactorize. Allocates its buffers here, nothing per call.
 * @param model the shared supernova model
 * @param kind 'diagonal' (requires structure 'diagonal'), 'low_rank' (requires structure 'low_rank') or 'general'
 */
export function createExactEvaluator(model: SupernovaModel, kind: 'diagonal' | 'low_rank' | 'general'): SupernovaEvaluator {
  const n = model.count;
  const covariance = model.covariance;
  const whitener = createWhitenerFor(model, kind);
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
    if (kind === 'general') covariance.fillDense(inputs, whitener.matrix);
    else covariance.fillVariances(inputs, whitener.matrix);
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
      if (kind === 'diagonal') return [`path: diagonal covariance, O(N) per call with N = ${n} (the covariance ${varies}; ln det C = sum of ln variances)`];
      if (kind === 'low_rank') {
        return [
          `path: diagonal plus ${covariance.modeCount} systematic modes (Woodbury identity, Woodbury 1950; no N x N matrix), N = ${n}: ` +
            `O(N K) per call, the whitening operator rebuilt in O(N K^2) whenever sigma_int, alpha or beta change (the covariance ${varies})`,
          `factorizations so far: ${factorizations}`,
        ];
      }
      return [
          `path: general dense covariance, N = ${n}: Cholesky factorization O(N^3/3) = ${((n ** 3) / 3).toExponential(2)} multiply-adds ` +
            `whenever alpha, beta or sigma_int change, then O(N^2/2) triangular solves per call (the covariance ${varies})`,
          `factorizations so far: ${factorizations}`,
        ];
    },
  };
}

/** The whitener of a covariance structure, shared with the compressed path. */
export function createWhitenerFor(model: SupernovaModel, kind: 'diagonal' | 'low_rank' | 'general'): Whitener {
  const n = model.count;
  if (kind === 'diagonal') return createDiagonalWhitener(n);
  if (kind === 'low_rank') {
    if (!model.covariance.modes) throw new Error('createExactEvaluator: the low_rank path needs systematic modes');
    return createModesWhitener(n, model.covariance.modes);
  }
  return createDenseWhitener(n);
}
