import { configToPlainObject, type CandelaConfig } from '../config/index.js';
import type { NestedResult } from '../sampler/index.js';
import type { BuiltModel } from './buildModel.js';
import type { LoadedSupernovae } from './loadSupernovae.js';
import { arrayExtent } from './arrayExtent.js';
import { fileSha256, type RunRecord } from './runRecord.js';
import { VERSION } from './version.js';

/** What run.json adds for a nested-sampling run (snake_case, as written). */
export interface NestedRunFacts {
  sampler: {
    method: 'nested';
    live_points: number;
    dlogz: number;
    max_iterations: number;
    /** Volume enlargement of the bounding ellipsoids. */
    enlargement: number;
    /** `dlogz`: the remaining-evidence criterion was met; `max_iterations`: the iteration cap was reached first. */
    stop: 'dlogz' | 'max_iterations';
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
 * live points), no burn-in, `stop_reason` `converged` when the dlogz
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
  const { config, model, data, result, best } = input;
  const spec = config.models[input.modelIndex];
  const values = model.posterior.values(best.theta);
  const extras = model.supernovae.bestFitExtras?.(values) ?? {};
  const bestParameters: Record<string, number> = {};
  model.parameterNames.forEach((name, d) => { bestParameters[name] = best.theta[d]; });
  const counts = new Map<string, number>();
  for (const sample of data.table.samples) counts.set(sample, (counts.get(sample) ?? 0) + 1);
  const seen = new Set<string>();
  const inputFiles = [config.source.file, ...data.inputFiles].filter((file) => !seen.has(file.resolved) && seen.add(file.resolved));
  const rows = result.logLikelihoods.length;
  return {
    tool: { name: 'candela', version: VERSION },
    title: config.title,
    model: { label: spec.label, dark_energy: spec.darkEnergy, curvature: spec.curvature, radiation: spec.radiation },
    parameters: {
      sampled: model.priors.map((entry) => ({ name: entry.name, prior: { ...entry.prior } })),
      fixed: { ...model.fixed },
      derived: [...model.derivedNames],
    },
    data: {
      supernovae: data.table.count,
      samples: [...counts].map(([sample, count]) => ({ sample, count })),
      redshift_range: arrayExtent(data.table.redshift),
      cuts: data.cutReports.map(({ label, report }) => ({
        label, initial: report.initialCount, final: report.finalCount,
        steps: report.steps.map((step) => ({ cut: step.description, removed: step.removed, remaining: step.remaining })),
      })),
      warnings: data.warnings.map((w) => w.message),
    },
    likelihood: { description: model.supernovae.describe(), path: model.supernovae.path },
    best_fit: {
      parameters: bestParameters,
      chi_square: Number.isFinite(extras.chi_square) ? extras.chi_square : null,
      n_data: model.posterior.dataCount,
      n_free: model.parameterNames.length,
      degrees_of_freedom: model.posterior.dataCount - model.parameterNames.length,
      log_likelihood: best.logLikelihood,
      log_posterior: best.logPosterior,
      abs_mag: Number.isFinite(extras.abs_mag_best_fit) ? extras.abs_mag_best_fit : (values.abs_mag ?? null),
    },
    run: {
      seed: String(config.seed), steps: rows, burn_in_steps: 0, walkers: 1, ensembles: 1,
      evaluations: result.likelihoodCalls, wall_seconds: Math.round(input.wallSeconds * 1000) / 1000, worker_threads: 1,
      stop_reason: result.stopReason === 'dlogz' ? 'converged' : 'max_steps',
      target_ess: config.sampler.targetEss, max_rhat: config.sampler.maxRhat,
    },
    inputs: inputFiles.map((file) => ({ path: file.written, sha256: fileSha256(file.resolved) })),
    configuration: configToPlainObject(config),
    sampler: {
      method: 'nested',
      live_points: config.sampler.nested.livePoints,
      dlogz: config.sampler.nested.dlogz,
      max_iterations: config.sampler.nested.maxIterations,
      enlargement: input.enlargement,
      stop: result.stopReason === 'dlogz' ? 'dlogz' : 'max_iterations',
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
