import { RELIABLE_STEPS_PER_TAU } from '../../diagnostics/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { RunOnDisk } from '../run/runFiles.js';

/** Version tag of summary.json; the README documents this schema. */
export const SUMMARY_SCHEMA = 'candela-summary-1';

/**
 * summary.json: the numbers a paper quotes and a referee checks, as plain
 * JSON (the README documents every key). Built from the chains and run.json
 * only, so it is reproduced exactly by `candela report`.
 *
 * Nested-sampling runs differ in three places: `diagnostics` is empty and
 * `convergence` says the Markov-chain checks do not apply, giving the Kish
 * effective sample size and the stopping criterion instead; `evidence`
 * carries ln Z and its error from run.json; `sampler` names the method.
 * Ensemble runs keep the original layout (no `sampler` or `evidence` keys).
 *
 * Cost: O(parameters^2).
 * @param run the run folder read back.
 * @param analysis its analysis (analyzeRun).
 * @returns the JSON-ready document.
 * @throws nothing.
 * @example JSON.stringify(summaryDocument(run, analyzeRun(run)), null, 2)
 */
export function summaryDocument(run: RunOnDisk, analysis: RunAnalysis) {
  const { record } = run;
  const parameters = Object.fromEntries(analysis.summary.parameters.map((p) => [p.name, {
    mean: p.stats.mean, sd: p.stats.sd, median: p.stats.median, ci68: p.stats.ci68, ci95: p.stats.ci95, hdi68: p.stats.hdi68,
    map: p.stats.map ?? null, derived: Boolean(p.derived), samples: p.stats.count,
    // A marginal cut by its prior quotes this one-sided limit instead of mean ± sd (see the prior_edge warning).
    one_sided_limit: p.oneSidedLimit ? { side: p.oneSidedLimit.side, value: p.oneSidedLimit.value, mass: p.oneSidedLimit.mass } : null,
    ...(p.note ? { note: p.note } : {}),
  }]));
  const diagnostics = Object.fromEntries(Object.entries(analysis.diagnostics).map(([name, d]) => [name, {
    rhat: d.rhat, rhat_walkers: d.rhatWalkers ?? null, ess_bulk: d.essBulk, ess_tail: d.essTail, tau: d.tau, mcse_mean: d.mcseMean,
    chain_length_over_tau: d.tau ? analysis.steps / d.tau : null,
  }]));
  const names = analysis.summary.correlationNames ?? [];
  const matrix = names.map((_, i) => names.map((__, j) => analysis.summary.correlation?.[i * names.length + j] ?? null));
  const nested = analysis.method === 'nested';
  const convergence = nested
    ? {
      applies: false,
      note: 'nested sampling draws weighted samples, not Markov chains: R-hat, per-chain ESS and autocorrelation times do not apply',
      passed: analysis.converged,
      stop: record.sampler?.stop ?? null,
      max_unexplored_ln_z: record.sampler?.max_unexplored_ln_z ?? null,
      remaining_log_z: record.sampler?.remaining_log_z ?? null,
      effective_sample_size_kish: analysis.effectiveSampleSize,
      weighted_samples: analysis.keptSamples,
    }
    : {
      passed: analysis.converged,
      target_ess: record.run.target_ess,
      max_rhat: record.run.max_rhat,
      acceptance_mean: analysis.acceptanceMean,
      stuck_walkers: analysis.stuckWalkers,
      minimum_chain_length_over_tau: RELIABLE_STEPS_PER_TAU,
    };
  return {
    schema: SUMMARY_SCHEMA,
    ...(nested ? { sampler: { method: 'nested', live_points: record.sampler?.live_points ?? null, max_unexplored_ln_z: record.sampler?.max_unexplored_ln_z ?? null } } : {}),
    title: record.title,
    model: record.model,
    parameters,
    diagnostics,
    correlation: { names, matrix },
    fit: {
      chi_square: record.best_fit.chi_square,
      n_data: record.best_fit.n_data,
      n_free: record.best_fit.n_free,
      degrees_of_freedom: record.best_fit.degrees_of_freedom,
      chi_square_per_degree_of_freedom: analysis.goodness?.reducedChiSquare ?? null,
      p_value: analysis.goodness?.pValue ?? null,
      // Older run records (before per-term fits) hold the supernovae only.
      terms: record.best_fit.terms ?? [{ name: 'supernovae', chi_square: record.best_fit.chi_square, n_data: record.best_fit.n_data, n_free: record.best_fit.n_free, degrees_of_freedom: record.best_fit.degrees_of_freedom }],
      log_likelihood_max: record.best_fit.log_likelihood,
      log_posterior_max: record.best_fit.log_posterior,
      abs_mag_best_fit: record.best_fit.abs_mag,
      best_fit_parameters: record.best_fit.parameters,
    },
    convergence,
    ...(nested && record.evidence ? { evidence: { ...record.evidence } } : {}),
    run: {
      seed: record.run.seed,
      steps: record.run.steps,
      burn_in_steps: analysis.burnInSteps,
      walkers: record.run.walkers,
      ensembles: record.run.ensembles,
      samples_kept: analysis.keptSamples,
      evaluations: record.run.evaluations,
      wall_seconds: record.run.wall_seconds,
      worker_threads: record.run.worker_threads,
      stop_reason: record.run.stop_reason,
      version: record.tool.version,
      inputs: record.inputs,
      configuration: record.configuration,
    },
    likelihood: record.likelihood,
    data: record.data,
    // Every warning the terminal prints: code, parameter concerned, sentence and numbers.
    warnings: analysis.warnings.map((w) => ({ code: w.code, parameter: w.parameter, message: w.message, numbers: w.numbers })),
  };
}
