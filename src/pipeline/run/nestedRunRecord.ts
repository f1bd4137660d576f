import type { CandelaConfig } from '../../config/index.js';
import { nestedRunJson, type NestedRunJsonSections } from '../../output/index.js';
import type { NestedResult } from '../../sampler/index.js';
import type { BuiltModel } from './buildModel.js';
import type { LoadedSupernovae } from './loadSupernovae.js';
import { commonRunSections, type RunRecord } from './runRecord.js';

/** What run.json adds for a nested-sampling run (snake_case, as written; the layout lives in output/run/nestedRunJson). */
export type NestedRunFacts = NestedRunJsonSections;

/** run.json of a nested-sampling run. */
export type NestedRunRecord = RunRecord & NestedRunFacts;

/** The sample with the highest log posterior, found by the caller among the weighted samples. */
export interface NestedBestSample {
  theta: Float64Array;
  logPosterior: number;
  logLikelihood: number;
}

/**
 * Assembles run.json for a nested-sampling run: the sections every run
 * record has (commonRunSections), then the nested-sampling `run`, `sampler`
 * and `evidence` sections of the output layer's nestedRunJson, mapped from
 * the configuration and the nested result.
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
  return {
    ...commonRunSections({ ...input, best: { theta: best.theta, logProb: best.logPosterior, logLikelihood: best.logLikelihood } }),
    ...nestedRunJson({
      seed: String(config.seed),
      storedSamples: result.logLikelihoods.length,
      likelihoodCalls: result.likelihoodCalls,
      wallSeconds: input.wallSeconds,
      evidenceSettled: result.stopReason === 'evidence_settled',
      targetEss: config.sampler.targetEss,
      maxRhat: config.sampler.maxRhat,
      livePoints: config.sampler.nested.livePoints,
      maxUnexploredLnZ: config.sampler.nested.maxUnexploredLnZ,
      maxIterations: config.sampler.nested.maxIterations,
      enlargement: input.enlargement,
      remainingLogZ: result.remainingLogZ,
      effectiveSampleSize: result.effectiveSampleSize,
      logZ: result.logZ,
      logZError: result.logZError,
      informationNats: result.information,
      iterations: result.iterations,
    }),
  };
}
