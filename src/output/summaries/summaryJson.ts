import type { GoodnessOfFit } from './goodnessOfFit.js';
import type { RunSummary } from './runSummary.js';
import type { RunWarning } from './runWarning.js';

/** Version tag of summary.json; the README documents this schema. */
export const SUMMARY_SCHEMA = 'candela-summary-1';

/** Markov-chain diagnostics of one parameter, as summary.json quotes them (the diagnostics layer's per-parameter result has these fields). */
export interface SummaryJsonDiagnostics {
  rhat: number | null;
  rhatWalkers?: number | null;
  essBulk: number | null;
  essTail: number | null;
  /** Integrated autocorrelation time, steps. */
  tau: number | null;
  /** Monte Carlo standard error of the mean, in the parameter's units. */
  mcseMean: number | null;
}

/** The best fit as run.json stores it (snake_case, copied as written). */
export interface SummaryJsonBestFit {
  parameters: Record<string, number>;
  chi_square: number | null;
  /** Per likelihood term; absent in records written before per-term fits. */
  terms?: ReadonlyArray<{ name: string; chi_square: number | null; n_data: number; n_free: number; degrees_of_freedom: number }>;
  n_data: number;
  n_free: number;
  degrees_of_freedom: number;
  log_likelihood: number;
  log_posterior: number;
  abs_mag: number | null;
}

/** What a nested-sampling run adds: its settings and stop as run.json stores them (null where the record lacks one). */
export interface SummaryJsonNestedFacts {
  livePoints: number | null;
  /** Bound on the ln Z the live points could still add, nats. */
  maxUnexploredLnZ: number | null;
  /** Which criterion stopped the run (`max_unexplored_ln_z` or `max_iterations`). */
  stop: string | null;
  /** Remaining-evidence estimate when the run stopped, nats. */
  remainingLogZ: number | null;
  /** Kish (1965) effective sample size of the kept weights. */
  effectiveSampleSize: number | null;
  /** ln Z, its error and the run's evidence facts (copied as written), or null when the record has none. */
  evidence: Record<string, number> | null;
}

/** Everything summary.json holds, as plain facts: the posterior summary, the diagnostics and the run's record sections. */
export interface SummaryJsonInput {
  title: string;
  /** The model section of run.json (label, dark energy, curvature, radiation), copied as written. */
  model: unknown;
  summary: RunSummary;
  /** Markov-chain diagnostics by parameter name; empty for nested runs. */
  diagnostics: Readonly<Record<string, SummaryJsonDiagnostics>>;
  /** Steps per walker in the chains (the chain length the autocorrelation times are compared with). */
  steps: number;
  /** Ensemble runs: every stopping target met; nested runs: the remaining-evidence criterion met. */
  converged: boolean;
  /** Nested-sampling facts, or null for an ensemble run. */
  nested: SummaryJsonNestedFacts | null;
  /** Ensemble convergence targets and checks (unused for nested runs). */
  targetEss: number;
  maxRhat: number;
  acceptanceMean: number | null;
  stuckWalkers: number;
  /** Chain length, in autocorrelation times, below which tau is unreliable. */
  minimumChainLengthOverTau: number;
  bestFit: SummaryJsonBestFit;
  goodness: GoodnessOfFit | null;
  burnInSteps: number;
  keptSamples: number;
  /** The run section's facts as run.json stores them (snake_case), with the tool version, inputs and configuration. */
  run: {
    seed: string; steps: number; walkers: number; ensembles: number; evaluations: number; wall_seconds: number;
    worker_threads: number; stop_reason: string; version: string; inputs: unknown; configuration: unknown;
  };
  /** The likelihood and data sections of run.json, copied as written. */
  likelihood: unknown;
  data: unknown;
  warnings: readonly RunWarning[];
}

/**
 * summary.json: the numbers a paper quotes and a referee checks, as plain
 * JSON (the README documents every key), keys in the file's order.
 *
 * Nested-sampling runs differ in three places: `diagnostics` is empty and
 * `convergence` says the Markov-chain checks do not apply, giving the Kish
 * effective sample size and the stopping criterion instead; `evidence`
 * carries ln Z and its error; `sampler` names the method. Ensemble runs keep
 * the original layout (no `sampler` or `evidence` keys).
 *
 * Cost: O(parameters^2) (the correlation matrix).
 * @param input the run's facts.
 * @returns the JSON-ready document (its text: summaryJsonText).
 * @throws nothing.
 * @example summaryJsonDocument(input).schema // 'candela-summary-1'
 */
export function summaryJsonDocument(input: SummaryJsonInput) {
  const { summary, bestFit, nested } = input;
  const parameters = Object.fromEntries(summary.parameters.map((p) => [p.name, {
    mean: p.stats.mean, sd: p.stats.sd, median: p.stats.median, ci68: p.stats.ci68, ci95: p.stats.ci95, hdi68: p.stats.hdi68,
    map: p.stats.map ?? null, derived: Boolean(p.derived), samples: p.stats.count,
    // A marginal cut by its prior quotes this one-sided limit instead of mean ± sd (see the prior_edge warning).
    one_sided_limit: p.oneSidedLimit ? { side: p.oneSidedLimit.side, value: p.oneSidedLimit.value, mass: p.oneSidedLimit.mass } : null,
    ...(p.note ? { note: p.note } : {}),
  }]));
  const diagnostics = Object.fromEntries(Object.entries(input.diagnostics).map(([name, d]) => [name, {
    rhat: d.rhat, rhat_walkers: d.rhatWalkers ?? null, ess_bulk: d.essBulk, ess_tail: d.essTail, tau: d.tau, mcse_mean: d.mcseMean,
    chain_length_over_tau: d.tau ? input.steps / d.tau : null,
  }]));
  const names = summary.correlationNames ?? [];
  const matrix = names.map((_, i) => names.map((__, j) => summary.correlation?.[i * names.length + j] ?? null));
  const convergence = nested
    ? {
      applies: false,
      note: 'nested sampling draws weighted samples, not Markov chains: R-hat, per-chain ESS and autocorrelation times do not apply',
      passed: input.converged,
      stop: nested.stop,
      max_unexplored_ln_z: nested.maxUnexploredLnZ,
      remaining_log_z: nested.remainingLogZ,
      effective_sample_size_kish: nested.effectiveSampleSize,
      weighted_samples: input.keptSamples,
    }
    : {
      passed: input.converged,
      target_ess: input.targetEss,
      max_rhat: input.maxRhat,
      acceptance_mean: input.acceptanceMean,
      stuck_walkers: input.stuckWalkers,
      minimum_chain_length_over_tau: input.minimumChainLengthOverTau,
    };
  const { run } = input;
  return {
    schema: SUMMARY_SCHEMA,
    ...(nested ? { sampler: { method: 'nested', live_points: nested.livePoints, max_unexplored_ln_z: nested.maxUnexploredLnZ } } : {}),
    title: input.title,
    model: input.model,
    parameters,
    diagnostics,
    correlation: { names, matrix },
    fit: {
      chi_square: bestFit.chi_square,
      n_data: bestFit.n_data,
      n_free: bestFit.n_free,
      degrees_of_freedom: bestFit.degrees_of_freedom,
      chi_square_per_degree_of_freedom: input.goodness?.reducedChiSquare ?? null,
      p_value: input.goodness?.pValue ?? null,
      // Older run records (before per-term fits) hold the supernovae only.
      terms: bestFit.terms ?? [{ name: 'supernovae', chi_square: bestFit.chi_square, n_data: bestFit.n_data, n_free: bestFit.n_free, degrees_of_freedom: bestFit.degrees_of_freedom }],
      log_likelihood_max: bestFit.log_likelihood,
      log_posterior_max: bestFit.log_posterior,
      abs_mag_best_fit: bestFit.abs_mag,
      best_fit_parameters: bestFit.parameters,
    },
    convergence,
    ...(nested?.evidence ? { evidence: { ...nested.evidence } } : {}),
    run: {
      seed: run.seed,
      steps: run.steps,
      burn_in_steps: input.burnInSteps,
      walkers: run.walkers,
      ensembles: run.ensembles,
      samples_kept: input.keptSamples,
      evaluations: run.evaluations,
      wall_seconds: run.wall_seconds,
      worker_threads: run.worker_threads,
      stop_reason: run.stop_reason,
      version: run.version,
      inputs: run.inputs,
      configuration: run.configuration,
    },
    likelihood: input.likelihood,
    data: input.data,
    // Every warning the terminal prints: code, parameter concerned, sentence and numbers.
    warnings: input.warnings.map((w) => ({ code: w.code, parameter: w.parameter, message: w.message, numbers: w.numbers })),
  };
}

/** summary.json as a document (the return type of summaryJsonDocument). */
export type SummaryJson = ReturnType<typeof summaryJsonDocument>;

/**
 * summary.json's text: the document (summaryJsonDocument, with any blinding
 * block the caller added after its keys) as JSON indented by two spaces,
 * ending in a line break; keys keep the document's order.
 * @param document the summary document, JSON-ready (finite numbers or null).
 * @returns the file's text.
 * @throws nothing (a document with a cycle throws TypeError from JSON.stringify).
 * @example summaryJsonText({ schema: 'candela-summary-1' }) // => '{\n  "schema": "candela-summary-1"\n}\n'
 */
export function summaryJsonText(document: Partial<SummaryJson> & object): string {
  return `${JSON.stringify(document, null, 2)}\n`;
}
