import { rankNormalizedSplitRhat } from './rankNormalizedSplitRhat.js';
import { CandelaError, isCandelaError } from '../errors.js';
import type { Issue } from '../errors.js';
import { assertNotConstant, assertUsableChains, isConstant, MINIMUM_DRAWS_PER_CHAIN } from './checkChains.js';
import { effectiveSampleSizeOfChains } from './multiChainEffectiveSampleSize.js';
import { essTail } from './essTail.js';
import { foldAboutMedian } from './foldAboutMedian.js';
import { integratedAutocorrelationTime } from './integratedAutocorrelationTime.js';
import type { AutocorrelationTimeEstimate } from './integratedAutocorrelationTime.js';
import { mcseMean } from './mcseMean.js';
import { potentialScaleReductionOfChains } from './potentialScaleReduction.js';
import { rankNormalize } from './rankNormalize.js';
import { splitChains } from './splitChains.js';

/** One parameter of one ensemble run: `values[step * walkers + walker]` (step-major, as a sampler writes it). */
export interface EnsembleTrace {
  /** Steps recorded per walker. */
  steps: number;
  /** Walkers in the ensemble. */
  walkers: number;
  /** steps x walkers values of the parameter, in its own units. */
  values: Float64Array;
}

/** Convergence summary of one parameter over one or more ensembles. A quantity that is undefined is null, with a warning in `issues`. */
export interface ParameterDiagnostics {
  /** Steps per walker after the burn-in. */
  keptSteps: number;
  /** Walkers over all ensembles; each is one chain for R-hat and ESS. */
  chainCount: number;
  /** Integrated autocorrelation time in steps (walker-averaged autocorrelation, all ensembles pooled). */
  tau: number | null;
  /** The full autocorrelation-time estimate (window, reliability, constant walkers). */
  autocorrelation: AutocorrelationTimeEstimate | null;
  /**
   * Rank-normalized split-R-hat (max of bulk and folded) across the
   * independent ensembles: each ensemble's walkers, pooled step by step, are
   * one chain (split in halves, so one ensemble still shows a drift). This is
   * the statistic the stopping rule uses.
   */
  rhat: number | null;
  /**
   * The same statistic with every walker a chain: a diagnostic of stuck or
   * strayed walkers, reported beside `rhat`. Walkers of one ensemble are not
   * independent, and with many walkers it falls towards 1 only slowly.
   */
  rhatWalkers: number | null;
  /** Bulk ESS, in draws. */
  essBulk: number | null;
  /** Tail ESS, in draws. */
  essTail: number | null;
  /** Monte Carlo standard error of the mean, in the parameter's units. */
  mcseMean: number | null;
  /** Warnings (severity `warning`) for quantities that could not be computed. */
  issues: Issue[];
}

/**
 * Diagnoses one parameter from one or more ensemble runs after dropping the
 * first `burnInSteps` steps of every walker.
 * - tau: {@link integratedAutocorrelationTime} (Sokal 1997 window on the
 *   walker-averaged autocorrelation, Goodman & Weare 2010) over all walkers of
 *   all ensembles, which share one target and one step length.
 * - R-hat (Vehtari et al. 2021) across the independent ensembles, each
 *   ensemble's pooled walkers one chain; the per-walker R-hat beside it.
 * - bulk and tail ESS, MCSE (Vehtari et al. 2021): every walker of every
 *   ensemble is taken as one chain. Walkers of one ensemble are not independent
 *   (the stretch move uses the others' positions), so these ESS values are
 *   optimistic; R-hat across walkers still detects walkers or ensembles that sit
 *   in different places, and is most telling with two or more ensembles.
 * Bulk R-hat and bulk ESS share one rank normalization. Constant draws give
 * every field null and one warning (path `all`).
 *
 * Cost: O(S log S) for S = kept steps x all walkers.
 * @param ensembles traces of the same parameter, all with the same `steps`.
 * @param burnInSteps steps to discard from the start (integer, 0 <= burnInSteps <= steps - 6).
 * @throws CandelaError `diagnostics.no_chains`, `diagnostics.trace_shape` (values length is not
 *   steps x walkers, or ensembles differ in steps), `diagnostics.burn_in`, `diagnostics.non_finite_draw`.
 * @example diagnoseEnsembleChains([{ steps: 2000, walkers: 32, values }], 150).rhat // about 1.00
 */
export function diagnoseEnsembleChains(ensembles: readonly EnsembleTrace[], burnInSteps: number): ParameterDiagnostics {
  const chains = walkerChainsAfterBurnIn(ensembles, burnInSteps);
  assertUsableChains(chains, MINIMUM_DRAWS_PER_CHAIN, 'walkers');
  const issues: Issue[] = [];
  if (isConstant(chains)) {
    attempt(issues, 'all', () => assertNotConstant(chains, 'every convergence diagnostic'));
    return { keptSteps: chains[0].length, chainCount: chains.length, tau: null, autocorrelation: null, rhat: null, rhatWalkers: null, essBulk: null, essTail: null, mcseMean: null, issues };
  }
  const autocorrelation = attempt(issues, 'tau', () => integratedAutocorrelationTime(chains));
  const normalizedHalves = rankNormalize(splitChains(chains));
  const bulkRhat = attempt(issues, 'rhat', () => potentialScaleReductionOfChains(normalizedHalves, 'the bulk R-hat'));
  const tailRhat = attempt(issues, 'rhat', () => potentialScaleReductionOfChains(rankNormalize(splitChains(foldAboutMedian(chains))), 'the tail (folded) R-hat'));
  const pooled = ensembleChainsAfterBurnIn(ensembles, burnInSteps);
  const ensembleRhat = attempt(issues, 'rhat', () => rankNormalizedSplitRhat(pooled));
  return {
    keptSteps: chains[0].length,
    chainCount: chains.length,
    tau: autocorrelation?.tauSteps ?? null,
    autocorrelation,
    rhat: ensembleRhat,
    rhatWalkers: bulkRhat !== null && tailRhat !== null ? Math.max(bulkRhat, tailRhat) : null,
    essBulk: attempt(issues, 'essBulk', () => effectiveSampleSizeOfChains(normalizedHalves, 'the bulk ESS')),
    essTail: attempt(issues, 'essTail', () => essTail(chains)),
    mcseMean: attempt(issues, 'mcseMean', () => mcseMean(chains)),
    issues,
  };
}

/**
 * One chain per ensemble after the burn-in: its walkers' draws in step-major
 * order (step 1 of every walker, then step 2, ...), a view of the trace.
 * Pooling the walkers of one ensemble gives a chain whose within variance is
 * the posterior's and whose mean varies between independent ensembles only by
 * Monte Carlo error, so split-R-hat on these chains compares the ensembles.
 */
function ensembleChainsAfterBurnIn(ensembles: readonly EnsembleTrace[], burnInSteps: number): Float64Array[] {
  // Ensembles of unequal size (never in a candela run) are cut to the shortest pooled chain.
  const length = Math.min(...ensembles.map((trace) => (trace.steps - burnInSteps) * trace.walkers));
  return ensembles.map((trace) => trace.values.subarray(burnInSteps * trace.walkers, burnInSteps * trace.walkers + length));
}

/** Runs one computation; a CandelaError becomes warnings at `path` (the result field) and a null result; anything else is rethrown. */
function attempt<T>(issues: Issue[], path: string, compute: () => T): T | null {
  try {
    return compute();
  } catch (error) {
    if (!isCandelaError(error)) throw error;
    for (const issue of error.issues) issues.push({ ...issue, severity: 'warning', path });
    return null;
  }
}

/** Per-walker series (views) of all ensembles with the burn-in removed, after checking shapes. */
function walkerChainsAfterBurnIn(ensembles: readonly EnsembleTrace[], burnInSteps: number): Float64Array[] {
  if (ensembles.length === 0) {
    throw new CandelaError({ code: 'diagnostics.no_chains', message: 'no ensemble trace was given', expected: 'at least one ensemble', found: '0' });
  }
  const steps = ensembles[0].steps;
  const shapeIssues: Issue[] = [];
  ensembles.forEach((trace, index) => {
    if (!Number.isInteger(trace.walkers) || trace.walkers < 1 || trace.steps !== steps || trace.values.length !== trace.steps * trace.walkers) {
      shapeIssues.push({
        code: 'diagnostics.trace_shape',
        message: 'an ensemble trace has an inconsistent shape',
        path: `ensembles[${index}]`,
        expected: `${steps} steps (like ensembles[0]) and steps x walkers values`,
        found: `${trace.steps} steps, ${trace.walkers} walkers, ${trace.values.length} values`,
      });
    }
  });
  if (shapeIssues.length > 0) throw new CandelaError(shapeIssues);
  if (!Number.isInteger(burnInSteps) || burnInSteps < 0 || steps - burnInSteps < MINIMUM_DRAWS_PER_CHAIN) {
    throw new CandelaError({
      code: 'diagnostics.burn_in',
      message: 'the burn-in leaves too few steps',
      expected: `an integer between 0 and ${steps - MINIMUM_DRAWS_PER_CHAIN}`,
      found: String(burnInSteps),
      fix: 'shorten the burn-in or run more steps',
    });
  }
  const chains: Float64Array[] = [];
  for (const trace of ensembles) {
    for (let walker = 0; walker < trace.walkers; walker++) {
      const series = new Float64Array(steps - burnInSteps);
      for (let step = burnInSteps; step < steps; step++) series[step - burnInSteps] = trace.values[step * trace.walkers + walker];
      chains.push(series);
    }
  }
  return chains;
}
