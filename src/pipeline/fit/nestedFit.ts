import { join } from 'node:path';
import type { CandelaConfig } from '../../config/index.js';
import type { Issue } from '../../errors.js';
import { deriveSeed } from '../../math/index.js';
import { DEFAULT_ELLIPSOID_ENLARGEMENT, type NestedResult } from '../../sampler/index.js';
import { runJsonText, writeFileAtomic } from '../../output/index.js';
import type { BuiltModel } from '../run/buildModel.js';
import { buildRunOutputs } from '../report/buildRunOutputs.js';
import { writeChainsFile, type EnsembleDraws } from '../../output/index.js';
import { writeHubbleFiles } from '../report/hubbleFiles.js';
import type { LoadedSupernovae } from '../run/loadSupernovae.js';
import { resampleRowsByWeight } from '../../math/index.js';
import { createNestedRunRecord, type NestedBestSample } from '../run/nestedRunRecord.js';
import { FitInterrupted, type FitOutcome, type FitRequest } from './runFit.js';
import { isRunInterrupted } from './interruptibleEvaluator.js';
import { runNestedInSlices } from './runNestedInSlices.js';
import { RUN_FILES } from '../../output/index.js';
import { writeResolvedConfig } from '../run/writeResolvedConfig.js';

/**
 * Equally weighted draws handed to the Hubble-diagram band (writeHubbleFiles
 * picks 200 of them): at least this many, more when the Kish effective sample
 * size is larger.
 */
const MINIMUM_HUBBLE_DRAWS = 1000;

/** Every nested sample with its log posterior and blobs [log prior, log likelihood, derived...], as one chain. */
function storedDraws(model: BuiltModel, result: NestedResult): EnsembleDraws {
  const dimension = model.posterior.dimension;
  const rows = result.logLikelihoods.length;
  const blobCount = model.logProbability.blobCount;
  const logProb = new Float64Array(rows);
  const blobs = new Float64Array(rows * blobCount);
  for (let row = 0; row < rows; row++) {
    const theta = result.samples.subarray(row * dimension, (row + 1) * dimension);
    logProb[row] = model.logProbability.evaluate(theta, blobs, row * blobCount);
    if (!Number.isFinite(logProb[row])) {
      // A zero-likelihood dead point: its prior is known, its derived values are not (empty cells).
      blobs.fill(Number.NaN, row * blobCount, (row + 1) * blobCount);
      blobs[row * blobCount] = model.posterior.logPrior(theta);
      blobs[row * blobCount + 1] = result.logLikelihoods[row];
    }
  }
  return { steps: rows, walkers: 1, dimension, positions: result.samples, logProb, blobs, blobCount };
}

function bestSample(draws: EnsembleDraws, weights: Float64Array): { row: number; sample: NestedBestSample } {
  let best = -1;
  for (let row = 0; row < draws.steps; row++) {
    if (weights[row] > 0 && Number.isFinite(draws.logProb[row]) && (best < 0 || draws.logProb[row] > draws.logProb[best])) best = row;
  }
  const { dimension, blobCount } = draws;
  return {
    row: best,
    sample: { theta: draws.positions.slice(best * dimension, (best + 1) * dimension), logPosterior: draws.logProb[best], logLikelihood: draws.blobs[best * blobCount + 1] },
  };
}

/** Equally weighted draws for the Hubble band: the best sample first (kept among the rows the seeded picks draw from, as the files were first written), then a systematic resample. */
function equallyWeighted(draws: EnsembleDraws, weights: Float64Array, bestRow: number, count: number, seed: string): EnsembleDraws {
  const picks = [bestRow, ...resampleRowsByWeight(weights, count, deriveSeed(seed, 'nested-hubble-draws'))];
  const { dimension, blobCount } = draws;
  const positions = new Float64Array(picks.length * dimension);
  const logProb = new Float64Array(picks.length);
  const blobs = new Float64Array(picks.length * blobCount);
  picks.forEach((row, k) => {
    positions.set(draws.positions.subarray(row * dimension, (row + 1) * dimension), k * dimension);
    logProb[k] = draws.logProb[row];
    blobs.set(draws.blobs.subarray(row * blobCount, (row + 1) * blobCount), k * blobCount);
  });
  return { steps: picks.length, walkers: 1, dimension, positions, logProb, blobs, blobCount };
}

/**
 * `candela fit` with `sampler.method: nested`: nested sampling (Skilling 2004,
 * 2006; see runNestedSampling) of one model's posterior through its prior
 * transform and log-likelihood, with `sampler.nested` live points, unexplored-ln Z bound and
 * iteration cap, seeded by the configuration's seed (same seed, same files).
 * Writes a run folder of the same shape as an ensemble run: chains.csv with a
 * `weight` column (normalized posterior weights; every dead point then the
 * final live points, ensemble 0, walker 0, step = sample index, no burn-in)
 * whose blobs are computed per sample; run.json with `sampler` and
 * `evidence`; the resolved configuration; the Hubble-diagram files from an
 * equally weighted resample; then every output (buildRunOutputs).
 *
 * Runs in the calling thread in slices of about EVENT_LOOP_SLICE_MS
 * (runNestedInSlices), so a signal (`request.signal`) stops it within about
 * a slice; there is no checkpoint, so an interrupted nested run writes
 * nothing and cannot be resumed (it rejects with FitInterrupted saying so),
 * and `--resume` does not apply to nested runs.
 * Cost: the nested run, about N (H + ln(1 / max_unexplored_ln_z)) iterations of a few
 * likelihood calls each, then one posterior evaluation per stored sample.
 * @param config the validated configuration.
 * @param index the model's index in config.models.
 * @param model the built model.
 * @param data the loaded supernovae.
 * @param runDir the prepared run folder.
 * @param request the fit request (`onLine` and `signal` are used).
 * @returns the run's outcome, as for an ensemble run.
 * @throws CandelaError from the nested sampler (bad options, a NaN likelihood, zero evidence, a stalled replacement) or from writing outputs;
 *   FitInterrupted when the signal came during the sampling (nothing written).
 * @example await fitNestedModel(config, 0, model, data, 'out/run', { configPath: 'run.yaml' })
 */
export async function fitNestedModel(config: CandelaConfig, index: number, model: BuiltModel, data: LoadedSupernovae, runDir: string, request: FitRequest): Promise<FitOutcome> {
  const started = Date.now();
  const settings = config.sampler.nested;
  const seed = String(config.seed);
  const say = request.onLine ?? (() => undefined);
  say(`model ${model.label}: ${model.parameterNames.length} free parameters (${model.parameterNames.join(', ')}); ${data.table.count} supernovae; nested sampling with ${settings.livePoints} live points, until at most ${settings.maxUnexploredLnZ} of ln Z is unexplored`);
  for (const line of [...(model.supernovae?.describe() ?? []), ...model.probes.flatMap((probe) => probe.loaded.describe)]) say(`  ${line}`);
  const posterior = model.posterior;
  let result: NestedResult;
  try {
    result = await runNestedInSlices(
      { dimension: posterior.dimension, priorTransform: posterior.priorTransform, logLikelihood: posterior.logLikelihood },
      { livePoints: settings.livePoints, maxUnexploredLnZ: settings.maxUnexploredLnZ, maxIterations: settings.maxIterations, seed, enlargement: DEFAULT_ELLIPSOID_ENLARGEMENT },
      request.signal,
    );
  } catch (error) {
    if (!isRunInterrupted(error)) throw error;
    // Nothing has been written to the run folder yet: no file can pass for a finished run.
    say(`model ${model.label}: nested sampling stopped on the signal after ${((Date.now() - started) / 1000).toFixed(1)} s`);
    throw new FitInterrupted(`interrupted during the nested sampling of ${model.label}: nested sampling keeps no checkpoint and cannot resume, so nothing of it was written to ${runDir}; run the same command again (without --resume) to start it over`, []);
  }
  const weights = Float64Array.from(result.logWeights, Math.exp);
  const draws = storedDraws(model, result);
  const best = bestSample(draws, weights);
  writeChainsFile(join(runDir, RUN_FILES.chains), { parameters: model.parameterNames, derived: model.derivedNames }, [draws], 0, weights);
  const wallSeconds = (Date.now() - started) / 1000;
  const record = createNestedRunRecord({ config, modelIndex: index, model, data, result, best: best.sample, enlargement: DEFAULT_ELLIPSOID_ENLARGEMENT, wallSeconds });
  writeFileAtomic(join(runDir, RUN_FILES.run), runJsonText(record));
  writeResolvedConfig(runDir, config);
  const hubbleDraws = Math.max(MINIMUM_HUBBLE_DRAWS, Math.round(result.effectiveSampleSize));
  writeHubbleFiles(runDir, model, [equallyWeighted(draws, weights, best.row, hubbleDraws, seed)], 0, best.sample.theta, seed);
  buildRunOutputs([runDir], runDir);
  say(`model ${model.label}: ln Z = ${result.logZ.toFixed(3)} +- ${result.logZError.toFixed(3)} after ${result.iterations} iterations (${result.likelihoodCalls} likelihood calls, ${result.stopReason === 'evidence_settled' ? 'unexplored ln Z below its bound' : 'iteration cap reached'}) in ${wallSeconds.toFixed(1)} s; outputs in ${runDir}`);
  const warnings: Issue[] = [...data.warnings, ...(model.supernovae?.warnings ?? []).map((message) => ({ code: 'likelihood.approximation', severity: 'warning' as const, message }))];
  if (result.stopReason === 'iterations') {
    warnings.push({
      code: 'run.nested_iteration_cap', severity: 'warning', message: `nested sampling stopped at the iteration cap with ${result.remainingLogZ.toFixed(3)} nats of evidence still unaccounted for`,
      expected: `unexplored ln Z at most max_unexplored_ln_z = ${settings.maxUnexploredLnZ}`, fix: 'raise sampler.nested.max_iterations',
    });
  }
  return { model: model.label, runDir, record, warnings };
}
