import { acceptanceSummary, diagnoseEnsembleChains, type ParameterDiagnostics } from '../diagnostics/index.js';
import {
  credibleContours, densityGrid2D, marginalDensity1D, sampleStatistics, summarizePosterior,
  type ContourSet2D, type HardBounds, type MarginalDensity1D, type ParameterSummary, type RunSummary,
} from '../output/index.js';
import { arrayExtent } from './arrayExtent.js';
import type { RunOnDisk } from './runFiles.js';

/** Sampled parameters that describe the expansion history (the default contour pairs). */
export const COSMOLOGICAL_PARAMETERS = ['omega_m', 'omega_de', 'w0', 'wa', 'h0'];
/** A chain should be at least this many autocorrelation times long (Goodman & Weare 2010 advise tens of tau; common practice). */
export const MINIMUM_CHAIN_LENGTH_IN_TAU = 50;

/** Everything computed from a run's chains alone. */
export interface RunAnalysis {
  sampled: string[];
  derived: string[];
  summary: RunSummary;
  diagnostics: Record<string, ParameterDiagnostics>;
  keptSamples: number;
  steps: number;
  burnInSteps: number;
  walkers: number;
  ensembles: number;
  acceptanceMean: number;
  stuckWalkers: number;
  marginals: MarginalDensity1D[];
  contours: ContourSet2D[];
  pairs: Array<[string, string]>;
  warnings: string[];
  converged: boolean;
}

/** Hard prior edges of a sampled parameter (for reflection at boundaries). */
export function priorBounds(run: RunOnDisk, name: string): HardBounds {
  const entry = run.record.parameters.sampled.find((p) => p.name === name);
  const prior = entry?.prior as { kind?: string; min?: number; max?: number } | undefined;
  if (!prior || prior.kind === 'gaussian') return {};
  return { lower: prior.min, upper: prior.max };
}

interface SmoothingSettings { kernel?: string; bandwidth?: string | number; factor?: number }

function smoothingOf(run: RunOnDisk): { bandwidthRule?: 'scott' | 'silverman'; bandwidth?: number; bandwidthFactor: number } {
  const configuration = run.record.configuration as { output?: { smoothing?: SmoothingSettings } };
  const smoothing = configuration.output?.smoothing ?? {};
  const factor = typeof smoothing.factor === 'number' ? smoothing.factor : 1;
  if (typeof smoothing.bandwidth === 'number') return { bandwidth: smoothing.bandwidth, bandwidthFactor: factor };
  return { bandwidthRule: smoothing.bandwidth === 'silverman' ? 'silverman' : 'scott', bandwidthFactor: factor };
}

function contourPairsOf(run: RunOnDisk, sampled: string[]): Array<[string, string]> {
  const configuration = run.record.configuration as { output?: { contour_pairs?: 'auto' | Array<[string, string]> } };
  const requested = configuration.output?.contour_pairs ?? 'auto';
  if (requested !== 'auto') return requested.filter(([x, y]) => sampled.includes(x) && sampled.includes(y));
  const cosmological = sampled.filter((name) => COSMOLOGICAL_PARAMETERS.includes(name));
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i < cosmological.length; i++) for (let j = i + 1; j < cosmological.length; j++) pairs.push([cosmological[i], cosmological[j]]);
  return pairs;
}

/**
 * Summaries, convergence diagnostics, smoothed marginals and credible
 * contours of a run, from its chains: the draws after the burn-in (the
 * `burn_in` column), every walker of every ensemble.
 */
export function analyzeRun(run: RunOnDisk): RunAnalysis {
  const { chains, record } = run;
  const sampled = record.parameters.sampled.map((p) => p.name);
  const derived = record.parameters.derived;
  const ensembles = arrayExtent(chains.ensemble)[1] + 1;
  const walkers = arrayExtent(chains.walker)[1] + 1;
  const steps = arrayExtent(chains.step)[1] + 1;
  let burnInSteps = 0;
  for (let r = 0; r < chains.rows; r++) if (chains.burnIn[r] === 1) burnInSteps = Math.max(burnInSteps, chains.step[r] + 1);
  const kept: number[] = [];
  for (let r = 0; r < chains.rows; r++) if (chains.burnIn[r] === 0) kept.push(r);
  const keptColumn = (name: string) => Float64Array.from(kept, (r) => chains.columns[name][r]);

  const diagnostics: Record<string, ParameterDiagnostics> = {};
  const warnings: string[] = [];
  for (const name of [...sampled, ...derived]) {
    const column = chains.columns[name];
    if (column.some((v) => !Number.isFinite(v))) continue;
    const traces = Array.from({ length: ensembles }, (_, k) => ({ steps, walkers, values: column.subarray(k * steps * walkers, (k + 1) * steps * walkers) }));
    diagnostics[name] = diagnoseEnsembleChains(traces, burnInSteps);
  }
  const acceptance = new Float64Array(ensembles * walkers);
  for (let k = 0; k < ensembles; k++) {
    for (let w = 0; w < walkers; w++) {
      let moves = 0;
      for (let s = 1; s < steps; s++) {
        const row = (k * steps + s) * walkers + w;
        if (chains.columns.log_posterior[row] !== chains.columns.log_posterior[row - walkers]) moves++;
      }
      acceptance[k * walkers + w] = steps > 1 ? moves / (steps - 1) : 0;
    }
  }
  const accept = acceptanceSummary(acceptance);
  if (accept.stuckWalkers.length) warnings.push(`${accept.stuckWalkers.length} walker(s) accepted far fewer proposals than the others (stuck): ${accept.stuckWalkers.slice(0, 10).join(', ')}`);

  const complete = [...sampled, ...derived].filter((name) => chains.columns[name].every(Number.isFinite) || kept.every((r) => Number.isFinite(chains.columns[name][r])));
  const summaryDiagnostics = Object.fromEntries(Object.entries(diagnostics).map(([name, d]) => [name, {
    ...(d.rhat !== null ? { rHat: d.rhat } : {}), ...(d.essBulk !== null ? { essBulk: d.essBulk } : {}), ...(d.essTail !== null ? { essTail: d.essTail } : {}),
  }]));
  const logPosterior = keptColumn('log_posterior');
  const summary = summarizePosterior(complete.map(keptColumn), complete, { logPosterior, diagnostics: summaryDiagnostics, derived, title: record.model.label });
  const incomplete = derived.filter((name) => !complete.includes(name));
  for (const name of incomplete) {
    const values = keptColumn(name).filter(Number.isFinite);
    const share = values.length / kept.length;
    warnings.push(`${name} is undefined for ${((1 - share) * 100).toFixed(1)}% of the samples (e.g. no acceleration epoch); its summary uses the rest`);
    if (values.length > 1) summary.parameters.push({ name, stats: sampleStatistics(values, { label: name }), derived: true } as ParameterSummary);
  }

  let converged = true;
  for (const name of sampled) {
    const d = diagnostics[name];
    if (!d || d.rhat === null || d.essBulk === null || d.rhat > record.run.max_rhat || d.essBulk < record.run.target_ess) converged = false;
    if (d?.tau && steps < MINIMUM_CHAIN_LENGTH_IN_TAU * d.tau) warnings.push(`the chain of ${name} is ${steps} steps, shorter than ${MINIMUM_CHAIN_LENGTH_IN_TAU} autocorrelation times (tau = ${d.tau.toFixed(1)} steps): the tau estimate and the diagnostics are less reliable`);
  }
  if (!converged) warnings.push(`the stopping targets (bulk ESS >= ${record.run.target_ess}, R-hat <= ${record.run.max_rhat}) are not met for every sampled parameter; the run stopped because of ${record.run.stop_reason}`);

  const smoothing = smoothingOf(run);
  const marginals = sampled.map((name) => marginalDensity1D(name, keptColumn(name), { bounds: priorBounds(run, name), ...smoothing }));
  const pairs = contourPairsOf(run, sampled);
  const contours = pairs.map(([x, y]) => credibleContours(densityGrid2D(x, keptColumn(x), y, keptColumn(y), {
    xBounds: priorBounds(run, x), yBounds: priorBounds(run, y), bandwidthRule: smoothing.bandwidthRule, bandwidthFactor: smoothing.bandwidthFactor,
    ...(smoothing.bandwidth !== undefined ? { bandwidthX: smoothing.bandwidth, bandwidthY: smoothing.bandwidth } : {}),
  })));
  return {
    sampled, derived, summary, diagnostics, keptSamples: kept.length, steps, burnInSteps, walkers, ensembles,
    acceptanceMean: accept.mean, stuckWalkers: accept.stuckWalkers.length, marginals, contours, pairs, warnings, converged,
  };
}
