import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { configToPlainObject, type CandelaConfig } from '../../config/index.js';
import { VERSION } from './version.js';
import type { BuiltModel } from './buildModel.js';
import { probeInputFiles } from './loadProbes.js';
import type { LoadedSupernovae } from './loadSupernovae.js';
import { arrayExtent } from '../../math/index.js';
import type { ConvergenceCheck, StopReason } from '../fit/samplingLoop.js';

/**
 * run.json: the facts of one run that the chains alone do not hold. Together
 * with chains.csv and the Hubble-diagram files it is everything
 * `candela report` needs to rebuild the outputs.
 */
export interface RunRecord {
  tool: { name: 'candela'; version: string };
  title: string;
  model: { label: string; dark_energy: string; curvature: string; radiation: boolean };
  parameters: {
    sampled: Array<{ name: string; prior: Record<string, unknown> }>;
    fixed: Record<string, number>;
    derived: string[];
  };
  data: {
    supernovae: number;
    samples: Array<{ sample: string; count: number }>;
    redshift_range: [number, number];
    cuts: Array<{ label: string; initial: number; final: number; steps: Array<{ cut: string; removed: number; remaining: number }> }>;
    warnings: string[];
  };
  /** How the likelihood is evaluated, and the approximations it warns about (frozen covariance, degeneracies). */
  likelihood: { description: string[]; path: string; warnings?: string[] };
  best_fit: {
    parameters: Record<string, number>; chi_square: number | null;
    /** Per likelihood term: chi-square at the best fit, data points, free parameters it reads, and degrees of freedom (data - those parameters). */
    terms?: TermFit[];
    n_data: number; n_free: number; degrees_of_freedom: number; log_likelihood: number; log_posterior: number; abs_mag: number | null };
  run: {
    seed: string;
    steps: number;
    burn_in_steps: number;
    walkers: number;
    ensembles: number;
    evaluations: number;
    wall_seconds: number;
    worker_threads: number;
    stop_reason: StopReason;
    target_ess: number;
    max_rhat: number;
  };
  inputs: Array<{ path: string; sha256: string }>;
  configuration: unknown;
}

/** One likelihood term at the best fit. */
export interface TermFit {
  name: string;
  chi_square: number | null;
  n_data: number;
  /** Free parameters the term reads. */
  n_free: number;
  degrees_of_freedom: number;
}

/**
 * Each term's chi-square at the best fit, its data count and degrees of
 * freedom (its data points minus the free parameters it reads; a parameter
 * read by several terms counts in each, so the terms' degrees of freedom do
 * not add up to the total's).
 */
export function termFits(model: BuiltModel, values: Readonly<Record<string, number>>): TermFit[] {
  const free = new Set(model.parameterNames);
  return model.terms.map((term) => {
    const chi = term.bestFitExtras?.(values).chi_square;
    const reads = term.requires.filter((name) => free.has(name)).length;
    return { name: term.name, chi_square: chi !== undefined && Number.isFinite(chi) ? chi : null, n_data: term.dataCount, n_free: reads, degrees_of_freedom: term.dataCount - reads };
  });
}

/** SHA-256 of a file's bytes, hex. */
export function fileSha256(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/** The best sample of a run: its parameters, log posterior and log likelihood. */
export interface BestSample {
  theta: Float64Array;
  logProb: number;
  logLikelihood: number;
}

/**
 * The parts of run.json shared by every sampler: tool, model, parameters,
 * data and cut report, likelihood description, best fit, input checksums and
 * the resolved configuration.
 */
export function commonRunSections(input: { config: CandelaConfig; modelIndex: number; model: BuiltModel; data: LoadedSupernovae; best: BestSample }): Omit<RunRecord, 'run'> {
  const { config, model, data, best } = input;
  const spec = config.models[input.modelIndex];
  const values = model.posterior.values(best.theta);
  const extras = model.supernovae?.bestFitExtras?.(values) ?? {};
  const terms = termFits(model, values);
  const totalChiSquare = terms.every((term) => term.chi_square !== null) ? terms.reduce((sum, term) => sum + (term.chi_square as number), 0) : null;
  const bestParameters: Record<string, number> = {};
  model.parameterNames.forEach((name, d) => { bestParameters[name] = best.theta[d]; });
  const counts = new Map<string, number>();
  for (const sample of data.table.samples) counts.set(sample, (counts.get(sample) ?? 0) + 1);
  const seen = new Set<string>();
  const inputFiles = [config.source.file, ...data.inputFiles, ...probeInputFiles(config)].filter((file) => !seen.has(file.resolved) && seen.add(file.resolved));
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
    likelihood: { description: [...(model.supernovae?.describe() ?? []), ...model.probes.flatMap((probe) => probe.loaded.describe)], path: model.supernovae?.path ?? 'probes', warnings: [...(model.supernovae?.warnings ?? [])] },
    best_fit: {
      parameters: bestParameters,
      chi_square: totalChiSquare,
      terms,
      n_data: model.posterior.dataCount,
      n_free: model.parameterNames.length,
      degrees_of_freedom: model.posterior.dataCount - model.parameterNames.length,
      log_likelihood: best.logLikelihood,
      log_posterior: best.logProb,
      abs_mag: Number.isFinite(extras.abs_mag_best_fit) ? extras.abs_mag_best_fit : (values.abs_mag ?? null),
    },
    inputs: inputFiles.map((file) => ({ path: file.written, sha256: fileSha256(file.resolved) })),
    configuration: configToPlainObject(config),
  };
}

/** Assembles run.json for a finished (or interrupted) ensemble run; `best` is its best stored draw after the burn-in (bestStoredDraw). */
export function createRunRecord(input: {
  config: CandelaConfig; modelIndex: number; model: BuiltModel; data: LoadedSupernovae; check: ConvergenceCheck;
  stopReason: StopReason; wallSeconds: number; evaluations: number; steps: number; workers: number; best: BestSample;
}): RunRecord {
  const { config, check } = input;
  return {
    ...commonRunSections(input),
    run: {
      seed: String(config.seed), steps: input.steps, burn_in_steps: check.burnInSteps,
      walkers: config.sampler.walkers, ensembles: config.sampler.ensembles,
      evaluations: input.evaluations, wall_seconds: Math.round(input.wallSeconds * 1000) / 1000,
      worker_threads: input.workers, stop_reason: input.stopReason, target_ess: config.sampler.targetEss, max_rhat: config.sampler.maxRhat,
    },
  };
}
