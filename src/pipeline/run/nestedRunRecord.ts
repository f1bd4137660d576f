import type { CandelaConfig } from '../../config/index.js';
import type { NestedResult } from '../../sampler/index.js';
import type { BuiltModel } from './buildModel.js';
import type { LoadedSupernovae } from './loadSupernovae.js';
import { commonRunSections, type RunRecord } from './runRecord.js';

/** What run.json adds for a nested-sampling run (snake_case, as written). */
export interface NestedRunFacts {
  sampler: {
    method: 'nested';
    live_points: number;
    /** The configured bound on the ln Z the live points could still add, nats (`sampler.nested.max_unexplored_ln_z`). */
    max_unexplored_ln_z: number;
    max_iterations: number;
    /** Volume enlargement of the bounding ellipsoids. */
    enlargement: number;
    /** `max_unexplored_ln_z`: the unexplored ln Z fell below its bound; `max_iterations`: the iteration cap was reached first. */
    stop: 'max_unexplored_ln_z' | 'max_iterations';
    /** Remaining-evidence estimate ln(Z + L_max X) - ln Z when the run stopped, nats. */
    remaining_log_z: number;
    /** Kish (1965) effective sample size of the posterior weights. */
    effective_sample_size: number;
  };
  /** ln Z with its error sqrt(H / N), the information H (nats), iterations and likelihood calls (Skilling 2006). */
  evidence: { log_z: number; log_z_error: number; information_nats: number; iterations: number; likelihood_calls: number };
}

/** run.json of a nested-sampling run. */
export type NestedRunRecord = RunRecord & NestedRunFacts;

/** The sample with the highest log posterior, found by the caller among the weighted samples. */
export interface NestedBestSample {
  theta: Float64Array;
  logPosterior: number;
  logLikelihood: number;
}

/**
 * Assembles run.json for a nested-sampling run: the same facts as an
 * ensemble run's record, where the chain layout reads as one ensemble of one
 * walker whose `steps` are the stored samples (dead points, then the final
 * live points), no burn-in, `stop_reason` `converged` when the unexplored-ln Z
 * criterion was met and `max_steps` when the iteration cap stopped the run;
 * plus `sampler` (method, settings, stop, Kish effective sample size) and
 * `evidence` (ln Z, its error, the information, iterations, likelihood calls).
 *
 * Cost: one likelihood evaluation at the best sample plus hashing the input files.
 * @param input configuration and model index, the built model and data, the
 *   nested result, its best sample, the enlargement used and the wall time (s).
 * @returns the record, ready for JSON.stringify.
 * @throws Error when an input file can no longer be read for its checksum.
 * @example createNestedRunRecord({ config, modelIndex: 0, model, data, result, best, enlargement: 1.5, wallSeconds: 2.1 }).evidence.log_z
 */
export function createNestedRunRecord(input: {
  config: CandelaConfig; modelIndex: number; model: BuiltModel; data: LoadedSupernovae;
  result: NestedResult; best: NestedBestSample; enlargement: number; wallSeconds: number;
}): NestedRunRecord {
  const { config, result, best } = input;
  const rows = result.logLikelihoods.length;
  return {
    ...commonRunSections({ ...input, best: { theta: best.theta, logProb: best.logPosterior, logLikelihood: best.logLikelihood } }),
    run: {
      seed: String(config.seed), steps: rows, burn_in_steps: 0, walkers: 1, ensembles: 1,
      evaluations: result.likelihoodCalls, wall_seconds: Math.round(input.wallSeconds * 1000) / 1000, worker_threads: 1,
      stop_reason: result.stopReason === 'evidence_settled' ? 'converged' : 'max_steps',
      target_ess: config.sampler.targetEss, max_rhat: config.sampler.maxRhat,
    },
    sampler: {
      method: 'nested',
      live_points: config.sampler.nested.livePoints,
      max_unexplored_ln_z: config.sampler.nested.maxUnexploredLnZ,
      max_iterations: config.sampler.nested.maxIterations,
      enlargement: input.enlargement,
      stop: result.stopReason === 'evidence_settled' ? 'max_unexplored_ln_z' : 'max_iterations',
      remaining_log_z: result.remainingLogZ,
      effective_sample_size: result.effectiveSampleSize,
    },
    evidence: {
      log_z: result.logZ,
      log_z_error: result.logZError,
      information_nats: result.information,
      iterations: result.iterations,
      likelihood_calls: result.likelihoodCalls,
    },
  };
}
