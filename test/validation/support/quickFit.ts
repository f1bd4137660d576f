// Validation helper (not a test): a short ensemble-MCMC fit of a posterior, in process, with its
// autocorrelation times, burn-in and kept draws. Used by the recovery, calibration and real-data checks.
import { integratedAutocorrelationTime } from '../../../src/diagnostics/index.js';
import type { Posterior } from '../../../src/likelihood/index.js';
import type { RandomStream } from '../../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator, initializeWalkers, type LogProbabilityModel } from '../../../src/sampler/index.js';
import { checkConvergence } from '../../../src/pipeline/fit/samplingLoop.js';

/**
 * Burn-in in units of the largest autocorrelation time. The walkers start in a
 * ball of 0.1 curvature widths around the mode and need a few tau to fill the
 * posterior; the pipeline uses 2 tau, this helper 5 to stay clear of any
 * memory of the start (common practice: "a few tau", Goodman & Weare 2010).
 */
export const QUICK_BURN_IN_TAU_MULTIPLE = 5;
/** An extension asks for 20% more steps than the estimated shortfall, since tau is re-estimated (and may grow) on the longer chain. */
const EXTENSION_MARGIN = 1.2;

/** How to run one quick fit. */
export interface QuickFitOptions {
  /** Walkers per ensemble (>= 2 x dimension). */
  walkers: number;
  /** Independent ensembles (>= 1). */
  ensembles: number;
  /** Steps per walker, burn-in included. */
  steps: number;
  /** Seed of the walker start and of the moves. */
  seed: string;
  /** Nelder-Mead searches for the start (default 2). */
  optimizerStarts?: number;
  /** Evaluation budget per search (default 300 x dimension). */
  optimizerEvaluations?: number;
  /**
   * When set, the chain is extended (in one go, by the estimated shortfall plus 20%) while the kept part spans fewer
   * than this many autocorrelation times, up to `maxSteps`. The stopping rule looks only at the chain, never at a truth.
   */
  minKeptTau?: number;
  /** Largest number of steps when extending (default 3 x steps). */
  maxSteps?: number;
}

/** A finished quick fit: draws after burn-in and the numbers that say whether the chain was long enough. */
export interface QuickFit {
  /** Parameter names, in theta order. */
  names: readonly string[];
  /** Steps per walker run (after any extension). */
  steps: number;
  /** Steps discarded: min(5 max tau, steps / 2), tau measured on the second half of the chain. */
  burnInSteps: number;
  /** Walkers over all ensembles. */
  walkersTotal: number;
  /** Integrated autocorrelation time per parameter after the burn-in, in steps. */
  tauSteps: Float64Array;
  /** Per parameter: kept draws, step major (step, then walker of every ensemble). */
  draws: Float64Array[];
  /** Mean acceptance fraction over all walkers. */
  acceptance: number;
}

/** Per parameter, the walker series (all ensembles) from step `first` on. */
function walkerSeries(sampler: EnsembleSampler, dimension: number, first: number): Float64Array[][] {
  const series: Float64Array[][] = Array.from({ length: dimension }, () => []);
  for (let k = 0; k < sampler.options.ensembles; k++) {
    const chain = sampler.chain(k);
    for (let w = 0; w < chain.walkers; w++) {
      for (let d = 0; d < dimension; d++) {
        const values = new Float64Array(chain.steps - first);
        for (let s = first; s < chain.steps; s++) values[s - first] = chain.positions[(s * chain.walkers + w) * dimension + d];
        series[d].push(values);
      }
    }
  }
  return series;
}

/**
 * Samples a log-probability model with the affine-invariant ensemble sampler
 * (Goodman & Weare 2010) in process: walkers start around the mode found by
 * Nelder & Mead searches from `sampleStart` draws, run `steps` steps, and the
 * burn-in is 5 autocorrelation times (Sokal window, Goodman & Weare 2010
 * sec. 4) measured on the second half. Deterministic for a seed.
 *
 * Cost: about (walkers x ensembles x steps + optimizerStarts x optimizerEvaluations) model evaluations.
 * @param model the log posterior (natural log) of `dimension` parameters, in their own units.
 * @param names parameter names in theta order (copied into the result).
 * @param sampleStart writes one plausible start point (e.g. a prior draw) using only `rng`.
 * @param options walkers, ensembles, steps (burn-in included) and seed.
 * @throws whatever initializeWalkers, the sampler or the diagnostics throw (CandelaError).
 * @example const fit = await quickFit(posteriorModel(posterior), posterior.names, posterior.samplePrior, { walkers: 16, ensembles: 2, steps: 600, seed: 'a' });
 */
export async function quickFit(
  model: LogProbabilityModel, names: readonly string[], sampleStart: (rng: RandomStream, out: Float64Array) => void, options: QuickFitOptions,
): Promise<QuickFit> {
  const dimension = model.dimension;
  const sampler = await startSampler(model, sampleStart, options);
  await sampler.advance(options.steps);
  let measured = measureChain(sampler, dimension);
  const maxSteps = options.maxSteps ?? 3 * options.steps;
  while (options.minKeptTau !== undefined && sampler.stepCount < maxSteps && measured.keptSteps < options.minKeptTau * Math.max(...measured.tauSteps)) {
    const wanted = Math.ceil(EXTENSION_MARGIN * (options.minKeptTau * Math.max(...measured.tauSteps) - measured.keptSteps));
    await sampler.advance(Math.min(wanted, maxSteps - sampler.stepCount));
    measured = measureChain(sampler, dimension);
  }
  return finishedFit(sampler, names, measured.burnInSteps, measured.kept, measured.tauSteps);
}

/** Walkers placed around the posterior mode (Nelder-Mead searches from `sampleStart` draws) and a sampler started there. */
async function startSampler(
  model: LogProbabilityModel, sampleStart: (rng: RandomStream, out: Float64Array) => void,
  options: { walkers: number; ensembles: number; seed: string; optimizerStarts?: number; optimizerEvaluations?: number },
): Promise<EnsembleSampler> {
  const dimension = model.dimension;
  const evaluator = createInProcessEvaluator(model);
  const start = await initializeWalkers({
    walkers: options.walkers, ensembles: options.ensembles, seed: options.seed, sampleStart,
    optimizerStarts: options.optimizerStarts ?? 2, optimizerEvaluations: options.optimizerEvaluations ?? 300 * dimension,
  }, evaluator);
  return EnsembleSampler.start({ dimension, walkers: options.walkers, ensembles: options.ensembles, seed: options.seed }, evaluator, start.positions);
}

/** The fit's draws after `burnInSteps` (step major: step, then walker of every ensemble) and its mean acceptance. */
function finishedFit(sampler: EnsembleSampler, names: readonly string[], burnInSteps: number, kept: Float64Array[][], tauSteps: Float64Array): QuickFit {
  const keptSteps = sampler.stepCount - burnInSteps;
  const walkersTotal = sampler.options.walkers * sampler.options.ensembles;
  const draws = kept.map((series) => {
    const values = new Float64Array(keptSteps * walkersTotal);
    series.forEach((walker, w) => { for (let s = 0; s < keptSteps; s++) values[s * walkersTotal + w] = walker[s]; });
    return values;
  });
  let acceptance = 0;
  for (let k = 0; k < sampler.options.ensembles; k++) acceptance += sampler.acceptanceFractions(k).reduce((sum, value) => sum + value, 0);
  return { names, steps: sampler.stepCount, burnInSteps, walkersTotal, tauSteps, draws, acceptance: acceptance / walkersTotal };
}

/** Burn-in (5 tau measured on the second half, at most half the chain), then tau and walker series of the rest. */
function measureChain(sampler: EnsembleSampler, dimension: number) {
  const steps = sampler.stepCount;
  const half = Math.floor(steps / 2);
  const firstTau = walkerSeries(sampler, dimension, half).map((series) => integratedAutocorrelationTime(series).tauSteps);
  const burnInSteps = Math.min(Math.ceil(QUICK_BURN_IN_TAU_MULTIPLE * Math.max(...firstTau)), half);
  const kept = walkerSeries(sampler, dimension, burnInSteps);
  const tauSteps = Float64Array.from(kept, (series) => integratedAutocorrelationTime(series).tauSteps);
  return { burnInSteps, kept, tauSteps, keptSteps: steps - burnInSteps };
}

/** The sampler's view of a posterior: ln posterior, no blobs. */
export function posteriorModel(posterior: Posterior): LogProbabilityModel {
  return { dimension: posterior.dimension, blobCount: 0, evaluate: (theta) => posterior.logPosterior(theta) };
}

/** Kept steps per walker divided by the largest tau: how many autocorrelation times the kept chain spans. */
export function keptStepsOverTau(fit: QuickFit): number {
  return (fit.steps - fit.burnInSteps) / Math.max(...fit.tauSteps);
}

/**
 * `count` draws of parameter `index` that are close to independent: every
 * walker of every ensemble at steps taken backwards from the last one,
 * `strideSteps` apart. Walkers at one step are independent draws of a
 * converged ensemble (its stationary law is the product of the target over
 * walkers); steps one to two tau apart are nearly so.
 * @throws Error when the kept chain is too short for `count` draws at this stride.
 */
export function spacedDraws(fit: QuickFit, index: number, count: number, strideSteps: number): Float64Array {
  const keptSteps = fit.steps - fit.burnInSteps;
  const slices = Math.ceil(count / fit.walkersTotal);
  if ((slices - 1) * strideSteps >= keptSteps) throw new Error(`need ${slices} slices ${strideSteps} steps apart, but only ${keptSteps} steps were kept`);
  const out = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    const slice = Math.floor(j / fit.walkersTotal);
    const step = keptSteps - 1 - slice * strideSteps;
    out[j] = fit.draws[index][step * fit.walkersTotal + (j % fit.walkersTotal)];
  }
  return out;
}

/** How to run a fit that stops by candela's own rule (src/pipeline/fit/samplingLoop.ts). */
export interface RuleFitOptions {
  walkers: number;
  ensembles: number;
  /** Bulk ESS target and largest R-hat (across the ensembles) of the stopping rule. */
  targetEss: number;
  maxRhat: number;
  /** Steps between convergence checks, and the largest step count. */
  checkEvery: number;
  maxSteps: number;
  seed: string;
}

/**
 * Samples like quickFit, but stops the way `candela fit` does: every
 * `checkEvery` steps the pipeline's own checkConvergence (burn-in 2 tau,
 * R-hat across the ensembles, bulk ESS) decides, and the draws kept are those
 * after the burn-in it chose. Used to check that the stopping rule keeps the
 * posterior calibrated.
 */
export async function ruleFit(
  model: LogProbabilityModel, names: readonly string[], sampleStart: (rng: RandomStream, out: Float64Array) => void, options: RuleFitOptions,
): Promise<QuickFit & { converged: boolean }> {
  const dimension = model.dimension;
  const sampler = await startSampler(model, sampleStart, options);
  let check = checkConvergence(sampler, { targetEss: options.targetEss, maxRhat: options.maxRhat });
  while (!check.converged && sampler.stepCount < options.maxSteps) {
    await sampler.advance(Math.min(options.checkEvery, options.maxSteps - sampler.stepCount));
    check = checkConvergence(sampler, { targetEss: options.targetEss, maxRhat: options.maxRhat });
  }
  const kept = walkerSeries(sampler, dimension, check.burnInSteps);
  const tauSteps = Float64Array.from(kept, (series) => integratedAutocorrelationTime(series).tauSteps);
  return { ...finishedFit(sampler, names, check.burnInSteps, kept, tauSteps), converged: check.converged };
}
