import { plainConfiguration } from '../../config/index.js';
import { acceptanceSummary, RELIABLE_STEPS_PER_TAU, type ParameterDiagnostics } from '../../diagnostics/index.js';
import { diagnoseTraces } from '../../diagnostics/index.js';
import { densityGrid2D, kishEffectiveCount, marginalDensity1D, type HardBounds, type MarginalDensity1D } from '../../math/index.js';
import {
  credibleContours, runWarning, sampleStatistics, summarizePosterior, type ContourSet2D, type ParameterSummary, type RunSummary, type RunWarning,
} from '../../output/index.js';
import { fixedParameterNotes } from '../../output/index.js';
import { goodnessOfFit, goodnessOfFitWarning, type GoodnessOfFit } from '../../output/index.js';
import { massStepConvention } from '../../output/index.js';
import { detectPriorEdges } from '../../output/index.js';
import { arrayExtent } from '../../math/index.js';
import { samplerMethodOf, type RunOnDisk } from '../run/runFiles.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';
import { blindingNotice } from '../../output/index.js';

/** Sampled parameters that describe the expansion history (the default contour pairs). */
export const COSMOLOGICAL_PARAMETERS = ['omega_m', 'omega_de', 'w0', 'wa', 'h0'];
/**
 * Nested-sampling rows whose weights together hold less than this posterior
 * mass are left out of summaries and densities: far below the Monte Carlo
 * error of any quantile (~1/sqrt(ESS)), while the early dead points they
 * are spread over the whole prior and would stretch every density grid
 * across it (common practice).
 */
export const NEGLIGIBLE_NESTED_MASS = 1e-6;
/** A weighted posterior with a Kish effective sample size below this gets a warning (a 95% interval from fewer draws is noisy; common practice). */
export const MINIMUM_KISH_SAMPLES = 400;

/** Everything computed from a run's chains alone. */
export interface RunAnalysis {
  /** Which sampler wrote the chains. */
  method: 'ensemble' | 'nested';
  sampled: string[];
  derived: string[];
  summary: RunSummary;
  /** Markov-chain diagnostics per name; empty for nested runs, to which they do not apply. */
  diagnostics: Record<string, ParameterDiagnostics>;
  /** Rows of chains.csv that the summaries use (after the burn-in; for nested runs, rows of non-negligible weight). */
  keptRows: Int32Array;
  /** Posterior weight of each kept row (nested runs), or null for equally weighted chains. */
  keptWeights: Float64Array | null;
  keptSamples: number;
  /**
   * The chains were read keeping every stepStride-th step (readRunFolder's memory budget; 1: every step). Summaries,
   * densities and figures use the kept steps; tau is in steps of the run; acceptance is over every step.
   */
  stepStride: number;
  /** Steps per walker the chains as read hold: ceil(steps / stepStride). */
  storedSteps: number;
  /** Kish (1965) effective sample size of the kept weights (nested runs), else null. */
  effectiveSampleSize: number | null;
  steps: number;
  burnInSteps: number;
  walkers: number;
  ensembles: number;
  /** Mean acceptance fraction of the walkers (ensemble runs), else null. */
  acceptanceMean: number | null;
  stuckWalkers: number;
  /** The stuck walkers, per ensemble (0-based walker indices within it); empty lists for nested runs. */
  stuckWalkersByEnsemble: number[][];
  marginals: MarginalDensity1D[];
  contours: ContourSet2D[];
  pairs: Array<[string, string]>;
  /**
   * Every warning of the run, in the order printed: the data's and the
   * likelihood's (from run.json), then those found in the chains (stuck
   * walkers, short chains, prior edges, goodness of fit, fixed-H0 quantities).
   */
  warnings: RunWarning[];
  /** Chi-square per degree of freedom at the best fit and its p-value (null without a chi-square). */
  goodness: GoodnessOfFit | null;
  /** Ensemble runs: every stopping target met. Nested runs: the remaining-evidence criterion was met. */
  converged: boolean;
}

/** Hard prior edges of a sampled parameter (for reflection at boundaries); none for a blinded parameter (docs/blinding.md). */
export function priorBounds(run: RunOnDisk, name: string): HardBounds {
  // A blinded parameter's values are shifted: its prior edges are neither reflected at nor reported (they would show the offset).
  if (blindedParametersOf(run.record).includes(name)) return {};
  const entry = run.record.parameters.sampled.find((p) => p.name === name);
  const prior = entry?.prior as { kind?: string; min?: number; max?: number } | undefined;
  if (!prior || prior.kind === 'gaussian') return {};
  return { lower: prior.min, upper: prior.max };
}

/** The kernel-width settings of a run (`output.smoothing`), as the marginals, the contours and the Savage-Dickey ratio use them. */
export function smoothingOf(run: RunOnDisk): { bandwidthRule?: 'scott' | 'silverman'; bandwidth?: number; bandwidthFactor: number } {
  const smoothing = plainConfiguration(run.record.configuration).output?.smoothing ?? {};
  const factor = typeof smoothing.factor === 'number' ? smoothing.factor : 1;
  if (typeof smoothing.bandwidth === 'number') return { bandwidth: smoothing.bandwidth, bandwidthFactor: factor };
  return { bandwidthRule: smoothing.bandwidth === 'silverman' ? 'silverman' : 'scott', bandwidthFactor: factor };
}

function contourPairsOf(run: RunOnDisk, sampled: string[]): Array<[string, string]> {
  const requested = plainConfiguration(run.record.configuration).output?.contour_pairs ?? 'auto';
  if (requested !== 'auto') return requested.filter(([x, y]) => sampled.includes(x) && sampled.includes(y));
  const cosmological = sampled.filter((name) => COSMOLOGICAL_PARAMETERS.includes(name));
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i < cosmological.length; i++) for (let j = i + 1; j < cosmological.length; j++) pairs.push([cosmological[i], cosmological[j]]);
  return pairs;
}

/**
 * Rows of chains.csv kept for the summaries: for equally weighted chains the
 * rows after the burn-in; for weighted (nested-sampling) rows every row of
 * positive weight except the lightest ones that together hold less than
 * {@link NEGLIGIBLE_NESTED_MASS} of the total weight.
 * Cost: O(rows log rows) for weighted rows, O(rows) otherwise.
 * @param run the run folder read back.
 * @returns the kept row indices, ascending.
 * @throws nothing.
 * @example keptRowsOf(readRunFolder('out/run')).length
 */
export function keptRowsOf(run: RunOnDisk): Int32Array {
  const { chains } = run;
  const weights = chains.weights;
  if (!weights) {
    const kept: number[] = [];
    for (let r = 0; r < chains.rows; r++) if (chains.burnIn[r] === 0) kept.push(r);
    return Int32Array.from(kept);
  }
  let total = 0;
  for (let r = 0; r < chains.rows; r++) total += weights[r] > 0 ? weights[r] : 0;
  const order = Array.from({ length: chains.rows }, (_, r) => r).filter((r) => weights[r] > 0).sort((a, b) => weights[a] - weights[b] || a - b);
  const dropped = new Uint8Array(chains.rows);
  let tail = 0;
  for (const r of order) {
    if (tail + weights[r] >= NEGLIGIBLE_NESTED_MASS * total) break;
    tail += weights[r];
    dropped[r] = 1;
  }
  const kept: number[] = [];
  for (let r = 0; r < chains.rows; r++) if (weights[r] > 0 && !dropped[r]) kept.push(r);
  return Int32Array.from(kept);
}

function ensembleDiagnostics(run: RunOnDisk, names: string[], layout: { ensembles: number; walkers: number; storedSteps: number; storedBurnInSteps: number; stride: number }) {
  const { chains } = run;
  const { ensembles, walkers, storedSteps: steps, storedBurnInSteps: burnInSteps, stride } = layout;
  const diagnostics: Record<string, ParameterDiagnostics> = {};
  // Same computation as the stopping rule (diagnoseTraces): burn-in from the file, thinning from the sampled parameters' tau.
  // On chains read every stride-th step, tau comes out in kept steps and is scaled back to steps of the run; R-hat and ESS
  // are computed on steps a fifth of tau apart anyway, so a stride below that changes them little (diagnoseTraces).
  const usable = names.filter((name) => chains.columns[name].every((v) => Number.isFinite(v)));
  const sampledCount = usable.filter((name) => run.record.parameters.sampled.some((p) => p.name === name)).length;
  const ordered = [...usable.slice(0, sampledCount), ...usable.slice(sampledCount)];
  if (ordered.length > 0 && steps - burnInSteps >= 6) {
    const traces = ordered.map((name) => Array.from({ length: ensembles }, (_, k) => ({ steps, walkers, values: chains.columns[name].subarray(k * steps * walkers, (k + 1) * steps * walkers) })));
    const diagnosis = diagnoseTraces(traces, { burnInSteps, burnInFrom: Math.max(1, sampledCount) });
    ordered.forEach((name, index) => {
      const entry = diagnosis.diagnostics[index];
      diagnostics[name] = stride === 1 ? entry : { ...entry, tau: entry.tau === null ? null : entry.tau * stride };
    });
  }
  let acceptance = chains.walkerAcceptance;
  if (!acceptance) {
    acceptance = new Float64Array(ensembles * walkers);
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
  }
  return { diagnostics, accept: acceptanceSummary(acceptance) };
}

/**
 * Summaries, convergence diagnostics, smoothed marginals and credible
 * contours of a run, from its chains. Ensemble runs: the draws after the
 * burn-in (the `burn_in` column), every walker of every ensemble, with R-hat,
 * ESS and autocorrelation times. Nested runs: the weighted samples (the
 * `weight` column, without the negligible tail, see {@link keptRowsOf}); the
 * Markov-chain diagnostics do not apply, the Kish effective sample size is
 * reported instead.
 *
 * Cost: O(rows x parameters) plus the density grids.
 * @param run a run folder read by readRunFolder.
 * @returns the analysis (see {@link RunAnalysis}).
 * @throws CandelaError from the summaries or density estimates (e.g. a parameter without spread).
 * @example analyzeRun(readRunFolder('out/run')).summary.parameters[0].stats.median
 */
export function analyzeRun(run: RunOnDisk): RunAnalysis {
  const { chains, record } = run;
  const method = samplerMethodOf(record);
  const sampled = record.parameters.sampled.map((p) => p.name);
  const derived = record.parameters.derived;
  const ensembles = arrayExtent(chains.ensemble)[1] + 1;
  const walkers = arrayExtent(chains.walker)[1] + 1;
  const stride = chains.stepStride ?? 1;
  // Chains read every stride-th step (readRunFolder's memory budget) hold fewer steps than the run: run.json counts them.
  const steps = stride > 1 ? record.run.steps : arrayExtent(chains.step)[1] + 1;
  let burnInSteps = 0;
  if (stride > 1) burnInSteps = record.run.burn_in_steps;
  else for (let r = 0; r < chains.rows; r++) if (chains.burnIn[r] === 1) burnInSteps = Math.max(burnInSteps, chains.step[r] + 1);
  const storedSteps = Math.ceil(steps / stride);
  const keptRows = keptRowsOf(run);
  const kept = Array.from(keptRows);
  const keptWeights = chains.weights ? Float64Array.from(kept, (r) => (chains.weights as Float64Array)[r]) : null;
  const weightOption = keptWeights ? { weights: keptWeights } : {};
  const keptColumn = (name: string) => Float64Array.from(kept, (r) => chains.columns[name][r]);

  const blinded = blindedParametersOf(record);
  const warnings: RunWarning[] = [
    // A blinded run says so first, wherever its warnings are shown (terminal, summary.json, report.html).
    ...(blinded.length ? [runWarning('blinded', null, blindingNotice(blinded))] : []),
    ...(record.data.warnings ?? []).map((message) => runWarning('data', null, message)),
    ...((record.likelihood as { warnings?: string[] }).warnings ?? []).map((message) => runWarning('likelihood_approximation', null, message)),
  ];
  if (stride > 1) {
    warnings.push(runWarning('chains_thinned_to_fit_memory', null, `the chains (${steps} steps x ${walkers} walkers x ${ensembles} ensemble(s)) are larger than the memory budget of the reader: the summaries, diagnostics and figures use every ${stride}th step (${storedSteps} steps per walker; the acceptance counts every step); raise output.chain_memory_mb or pass candela report --chain-memory MB to use more steps`, { step_stride: stride, stored_steps: storedSteps }));
  }
  let diagnostics: Record<string, ParameterDiagnostics> = {};
  let acceptanceMean: number | null = null;
  let stuckWalkers = 0;
  const stuckWalkersByEnsemble: number[][] = Array.from({ length: ensembles }, () => []);
  if (method === 'ensemble') {
    const result = ensembleDiagnostics(run, [...sampled, ...derived], { ensembles, walkers, storedSteps, storedBurnInSteps: Math.ceil(burnInSteps / stride), stride });
    diagnostics = result.diagnostics;
    acceptanceMean = result.accept.mean;
    stuckWalkers = result.accept.stuckWalkers.length;
    for (const flat of result.accept.stuckWalkers) stuckWalkersByEnsemble[Math.floor(flat / walkers)]?.push(flat % walkers);
    if (stuckWalkers) warnings.push(runWarning('stuck_walkers', null, `${stuckWalkers} walker(s) accepted far fewer proposals than the others (stuck): ${result.accept.stuckWalkers.slice(0, 10).join(', ')}`, { stuck_walkers: stuckWalkers }));
  }

  const complete = [...sampled, ...derived].filter((name) => chains.columns[name].every(Number.isFinite) || kept.every((r) => Number.isFinite(chains.columns[name][r])));
  const summaryDiagnostics = Object.fromEntries(Object.entries(diagnostics).map(([name, d]) => [name, {
    ...(d.rhat !== null ? { rHat: d.rhat } : {}), ...(d.essBulk !== null ? { essBulk: d.essBulk } : {}), ...(d.essTail !== null ? { essTail: d.essTail } : {}),
  }]));
  const logPosterior = keptColumn('log_posterior');
  const summary = summarizePosterior(complete.map(keptColumn), complete, { ...weightOption, logPosterior, diagnostics: summaryDiagnostics, derived, title: record.model.label });
  const incomplete = derived.filter((name) => !complete.includes(name));
  for (const name of incomplete) {
    const column = keptColumn(name);
    const usable = kept.map((_, k) => k).filter((k) => Number.isFinite(column[k]));
    const values = Float64Array.from(usable, (k) => column[k]);
    const usableWeights = keptWeights ? Float64Array.from(usable, (k) => keptWeights[k]) : null;
    const share = keptWeights ? usable.reduce((sum, k) => sum + keptWeights[k], 0) / keptWeights.reduce((sum, w) => sum + w, 0) : values.length / kept.length;
    warnings.push(runWarning('partly_undefined', name, `${name} is undefined for ${((1 - share) * 100).toFixed(1)}% of the ${keptWeights ? 'posterior mass' : 'samples'} (e.g. no acceleration epoch); its summary uses the rest`, { undefined_share: 1 - share }));
    if (values.length > 1) summary.parameters.push({ name, stats: sampleStatistics(values, { label: name, ...(usableWeights ? { weights: usableWeights } : {}) }), derived: true } as ParameterSummary);
  }

  let converged = true;
  let effectiveSampleSize: number | null = null;
  if (method === 'ensemble') {
    for (const name of sampled) {
      const d = diagnostics[name];
      if (!d || d.rhat === null || d.essBulk === null || d.rhat > record.run.max_rhat || d.essBulk < record.run.target_ess) converged = false;
      // The stopping rule's third condition (samplingLoop.checkConvergence): a chain of at least 50 tau.
      if (d?.tau && steps < RELIABLE_STEPS_PER_TAU * d.tau) converged = false;
      if (d?.tau && steps < RELIABLE_STEPS_PER_TAU * d.tau) warnings.push(runWarning('short_chain', name, `the chain of ${name} is ${steps} steps, shorter than ${RELIABLE_STEPS_PER_TAU} autocorrelation times (tau = ${d.tau.toFixed(1)} steps): the tau estimate and the diagnostics are less reliable`, { steps, tau: d.tau, minimum_steps_per_tau: RELIABLE_STEPS_PER_TAU }));
    }
    // ESS, R-hat and 50 tau met on the final chains, yet the sampling loop did not stop by its rule: its fourth
    // condition (tau no longer growing with the chain, samplingLoop.MAXIMUM_TAU_GROWTH) did not hold at the last check.
    const stoppedShort = ['max_steps', 'wall_time', 'interrupted'].includes(record.run.stop_reason);
    if (converged && stoppedShort) {
      converged = false;
      warnings.push(runWarning('not_converged', null, `bulk ESS, R-hat and the chain length meet their targets, but the run stopped because of ${record.run.stop_reason} before its stopping rule held: at the last check the autocorrelation time was still growing with the chain (the walkers were still finding new parts of the posterior); continue it with --resume and a larger max_steps`, { target_ess: record.run.target_ess, max_rhat: record.run.max_rhat }));
    } else if (!converged) warnings.push(runWarning('not_converged', null, `the stopping targets (bulk ESS >= ${record.run.target_ess}, R-hat <= ${record.run.max_rhat}, a chain of ${RELIABLE_STEPS_PER_TAU} tau) are not met for every sampled parameter; the run stopped because of ${record.run.stop_reason}`, { target_ess: record.run.target_ess, max_rhat: record.run.max_rhat }));
  } else {
    effectiveSampleSize = kishEffectiveCount(keptWeights ?? kept.length);
    converged = record.sampler?.stop === 'max_unexplored_ln_z';
    warnings.push(runWarning('chain_checks_not_applicable', null, `nested sampling: R-hat, ESS per chain and autocorrelation times are Markov-chain diagnostics and do not apply; the ${kept.length} weighted samples have a Kish effective sample size of ${effectiveSampleSize.toFixed(0)}`, { weighted_samples: kept.length, effective_sample_size_kish: effectiveSampleSize }));
    // Worded as the fit prints it (nestedFit), so the terminal line and summary.json carry one sentence.
    if (!converged) warnings.push(runWarning('evidence_incomplete', null, `nested sampling stopped at the iteration cap with ${(record.sampler?.remaining_log_z ?? Number.NaN).toFixed(3)} nats of evidence still unaccounted for`, { max_unexplored_ln_z: record.sampler?.max_unexplored_ln_z ?? Number.NaN, unexplored_ln_z: record.sampler?.remaining_log_z ?? Number.NaN }));
    if (effectiveSampleSize < MINIMUM_KISH_SAMPLES) warnings.push(runWarning('few_effective_samples', null, `the Kish effective sample size ${effectiveSampleSize.toFixed(0)} is below ${MINIMUM_KISH_SAMPLES}: credible intervals and contours are noisy; raise sampler.nested.live_points`, { effective_sample_size_kish: effectiveSampleSize, minimum: MINIMUM_KISH_SAMPLES }));
  }

  for (const name of sampled) {
    const row = summary.parameters.find((p) => p.name === name);
    if (!row) continue;
    const edge = detectPriorEdges({ summary: row, bounds: priorBounds(run, name), bestFit: record.best_fit.parameters[name], draws: keptColumn(name), weights: keptWeights });
    if (edge) warnings.push(edge);
  }
  const goodness = goodnessOfFit(record.best_fit.chi_square, record.best_fit.degrees_of_freedom);
  const fitWarning = goodness ? goodnessOfFitWarning(goodness) : null;
  if (fitWarning) warnings.push(fitWarning);
  for (const term of (record.best_fit.terms ?? []).length > 1 ? record.best_fit.terms ?? [] : []) {
    const termFit = goodnessOfFit(term.chi_square, term.degrees_of_freedom);
    const termWarning = termFit ? goodnessOfFitWarning(termFit) : null;
    if (termWarning) warnings.push({ ...termWarning, message: `${term.name}: ${termWarning.message}`, numbers: { ...termWarning.numbers } });
  }
  const configuration = plainConfiguration(record.configuration);
  const fixedNote = fixedParameterNotes(summary.parameters, {
    sampled, fixed: record.parameters.fixed, referenceH0KmPerSPerMpc: configuration.reference_h0 ?? Number.NaN, radiation: record.model.radiation,
  });
  if (fixedNote) warnings.push(fixedNote);
  massStepConvention(summary.parameters, configuration.standardization?.host_mass_step?.split_log_mass);

  const smoothing = smoothingOf(run);
  const marginals = sampled.map((name) => marginalDensity1D(name, keptColumn(name), { ...weightOption, bounds: priorBounds(run, name), ...smoothing }));
  const pairs = contourPairsOf(run, sampled);
  const contours = pairs.map(([x, y]) => credibleContours(densityGrid2D(x, keptColumn(x), y, keptColumn(y), {
    ...weightOption, xBounds: priorBounds(run, x), yBounds: priorBounds(run, y), bandwidthRule: smoothing.bandwidthRule, bandwidthFactor: smoothing.bandwidthFactor,
    ...(smoothing.bandwidth !== undefined ? { bandwidthX: smoothing.bandwidth, bandwidthY: smoothing.bandwidth } : {}),
  })));
  return {
    method, sampled, derived, summary, diagnostics, keptRows, keptWeights, keptSamples: kept.length, stepStride: stride, storedSteps, effectiveSampleSize, steps, burnInSteps, walkers, ensembles,
    acceptanceMean, stuckWalkers, stuckWalkersByEnsemble, marginals, contours, pairs, warnings, goodness, converged,
  };
}
