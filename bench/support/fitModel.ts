/**
 * The posterior of the sampler and fit benchmarks: flat w0waCDM with
 * Omega_m, w0 and wa free (uniform priors [0, 1], [-3, 1], [-5, 5]), on a
 * seeded synthetic sample with a dense covariance D + U U^T, alpha, beta and
 * the mass step fixed (so C is constant) and the offset marginalized: the
 * compressed path. Also the worker-thread factory: every worker rebuilds the
 * same model from the same seed (createBenchFitModel), so chains do not
 * depend on the number of workers.
 */
import { createPosterior, type Posterior, type Prior, type SupernovaTerm } from '../../src/likelihood/index.js';
import type { LogProbabilityModel } from '../../src/sampler/index.js';
import { benchTerm, FIXED_NUISANCE } from './benchTerm.js';
import { benchSurvey, denseModeCovariance, modeCountFor } from './syntheticSurvey.js';

/** What a worker needs to rebuild the model (plain data). */
export interface FitModelInit {
  count: number;
  seed: string;
}

/** The free parameters and their priors, in theta order. */
export const FIT_FREE: Array<{ name: string; prior: Prior }> = [
  { name: 'omega_m', prior: { kind: 'uniform', min: 0, max: 1 } },
  { name: 'w0', prior: { kind: 'uniform', min: -3, max: 1 } },
  { name: 'wa', prior: { kind: 'uniform', min: -5, max: 5 } },
];

/** Blobs stored per sample, as the pipeline does: log prior, log likelihood. */
const BLOB_COUNT = 2;

/** The built posterior, its supernova term and the sampler's view of it. */
export interface FitModel {
  posterior: Posterior;
  term: SupernovaTerm;
  logProbability: LogProbabilityModel;
}

/** Builds the model (data, dense covariance, the compressed term: one N x N Cholesky). */
export function buildFitModel(init: FitModelInit): FitModel {
  const survey = benchSurvey(init.count, modeCountFor(init.count), init.seed);
  const term = benchTerm(survey, { path: 'compressed', covariances: [denseModeCovariance(survey)], alphaBeta: 'fixed' });
  const posterior = createPosterior({ free: FIT_FREE, fixed: { ...FIXED_NUISANCE }, terms: [term] });
  const parts = { logPrior: 0, logLikelihood: 0 };
  const logProbability: LogProbabilityModel = {
    dimension: posterior.dimension,
    blobCount: BLOB_COUNT,
    evaluate(theta, blobs, offset) {
      const value = posterior.evaluate(theta, parts);
      blobs[offset] = Number.isFinite(value) ? parts.logPrior : 0;
      blobs[offset + 1] = Number.isFinite(value) ? parts.logLikelihood : 0;
      return value;
    },
  };
  return { posterior, term, logProbability };
}

/** Worker-thread factory (see createWorkerPoolEvaluator). */
export function createBenchFitModel(init: FitModelInit): LogProbabilityModel {
  return buildFitModel(init).logProbability;
}

/** URL of this module as the workers load it (the compiled JavaScript; the benchmarks run from dist/). */
export function fitModelUrl(): string {
  return import.meta.url.replace(/\/bench\/support\/([^/]+)\.ts$/, '/dist/bench/support/$1.js');
}
