import type { ModelFitRecord } from '../../compare/index.js';
import { compensatedSum } from '../../math/index.js';
import type { AnalyzedRun } from './compareInputs.js';
import type { RebuiltRunModel } from './compareRebuildModel.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';

/**
 * The rebuilt likelihood must reproduce the fit's ln L at the recorded best
 * fit to this many nats (plus the same relative amount): both are the same
 * double-precision computation, so only changed data or code moves it.
 */
export const LIKELIHOOD_REPRODUCTION_TOLERANCE = 1e-6;

/** One model's comparison inputs and what was learnt building them. */
export interface ComparedModel {
  record: ModelFitRecord;
  /** Posterior mean of the sampled parameters (DIC's theta-bar), by name. */
  posteriorMean: Record<string, number>;
  /** Kish effective count of the deviance draws' weights (nested runs), or the number of draws. */
  devianceDraws: number;
  /** Problems that make a number less trustworthy or absent, in words. */
  warnings: string[];
  /** Why the DIC is left out (in words), or null when it was computed. */
  dicMissing: string | null;
}

/**
 * Builds the compare layer's record of one model: chi-square and ln L at the
 * best fit (the highest-posterior sample, as run.json records it), N, k, the
 * deviance D = -2 ln L of every kept posterior draw (weighted for nested
 * runs), the deviance at the posterior mean (evaluated with the rebuilt
 * likelihood; Spiegelhalter et al. 2002), and ln Z with its error for nested
 * runs. Without a rebuilt model, or when the mean is unphysical, the DIC is
 * left out, `dicMissing` says why and a warning starting `DIC missing` repeats it. When run.json has no chi-square, -2 ln L
 * at the best fit stands in for it (same data, so differences are unchanged).
 *
 * Cost: O(kept draws x parameters) plus one likelihood evaluation (two with a rebuilt model).
 * @param analyzed the run folder and its analysis.
 * @param rebuilt the rebuilt model, or null when it could not be rebuilt.
 * @returns the record with the posterior mean and warnings.
 * @throws nothing.
 * @example comparedModel(analyzed, rebuildRunModel(analyzed.run)).record.devianceAtPosteriorMean
 */
export function comparedModel(analyzed: AnalyzedRun, rebuilt: RebuiltRunModel | null): ComparedModel {
  const { run, analysis } = analyzed;
  const { record } = run;
  const label = record.model.label;
  const warnings: string[] = [];
  const rows = analysis.keptRows;
  const weights = analysis.keptWeights;
  const logLikelihood = run.chains.columns.log_likelihood;
  const deviance = Float64Array.from(rows, (r) => -2 * logLikelihood[r]);
  const posteriorMean: Record<string, number> = {};
  const totalWeight = weights ? compensatedSum(weights) : rows.length;
  for (const name of analysis.sampled) {
    const column = run.chains.columns[name];
    const terms = Float64Array.from(rows, (r, k) => (weights ? weights[k] : 1) * column[r]);
    posteriorMean[name] = compensatedSum(terms) / totalWeight;
  }
  const chiSquare = record.best_fit.chi_square ?? -2 * record.best_fit.log_likelihood;
  if (record.best_fit.chi_square === null) warnings.push(`${label}: run.json has no chi-square at the best fit; -2 ln L is used instead`);
  const fit: ModelFitRecord = {
    label,
    chiSquareMinimum: chiSquare,
    dataCount: record.best_fit.n_data,
    freeParameterCount: record.best_fit.n_free,
    logLikelihoodMaximum: record.best_fit.log_likelihood,
  };
  if (record.evidence) {
    fit.logZ = record.evidence.log_z;
    fit.logZError = record.evidence.log_z_error;
  }
  const blinded = blindedParametersOf(record);
  if (!rebuilt || blinded.length > 0) {
    const reason = blinded.length > 0
      ? `withheld while the run is blinded (${blinded.join(', ')}): the DIC needs the likelihood at the true posterior mean`
      : 'the model could not be rebuilt from its run folder, and the DIC needs the likelihood at the posterior mean';
    warnings.push(`${label}: DIC missing: ${reason}`);
    return { record: fit, posteriorMean, devianceDraws: rows.length, warnings, dicMissing: reason };
  }
  const { posterior } = rebuilt.model;
  const theta = (values: Record<string, number>) => Float64Array.from(posterior.names, (name) => values[name]);
  const reproduced = posterior.logLikelihood(theta(record.best_fit.parameters));
  const recorded = record.best_fit.log_likelihood;
  if (!(Math.abs(reproduced - recorded) <= LIKELIHOOD_REPRODUCTION_TOLERANCE * (1 + Math.abs(recorded)))) {
    warnings.push(`${label}: the rebuilt likelihood gives ln L = ${reproduced} at the recorded best fit, the fit recorded ${recorded}; the DIC uses the rebuilt likelihood`);
  }
  const meanLogLikelihood = posterior.logLikelihood(theta(posteriorMean));
  if (!Number.isFinite(meanLogLikelihood)) {
    const reason = `the posterior mean is unphysical (${posterior.rejectionReason(theta(posteriorMean)) ?? 'ln L is -Infinity'})`;
    warnings.push(`${label}: DIC missing: ${reason}`);
    return { record: fit, posteriorMean, devianceDraws: rows.length, warnings, dicMissing: reason };
  }
  fit.devianceSamples = deviance;
  if (weights) fit.devianceWeights = weights;
  fit.devianceAtPosteriorMean = -2 * meanLogLikelihood;
  const draws = weights ? totalWeight ** 2 / compensatedSum(Float64Array.from(weights, (w) => w * w)) : rows.length;
  return { record: fit, posteriorMean, devianceDraws: draws, warnings, dicMissing: null };
}
