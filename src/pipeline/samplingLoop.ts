import { acceptanceSummary, chooseBurnIn, diagnoseEnsembleChains, integratedAutocorrelationTime, type ParameterDiagnostics } from '../diagnostics/index.js';
import type { EnsembleSampler } from '../sampler/index.js';

/** Why sampling ended. */
export type StopReason = 'converged' | 'max_steps' | 'wall_time' | 'interrupted';

/** Convergence state at one check. */
export interface ConvergenceCheck {
  step: number;
  burnInSteps: number;
  /** Per sampled parameter, in theta order, computed on the kept steps thinned by `thin` (their tau is in thinned steps). */
  diagnostics: ParameterDiagnostics[];
  /** Thinning used for the diagnostics. */
  thin: number;
  maxTau: number | null;
  minEssBulk: number | null;
  maxRhat: number | null;
  meanAcceptance: number;
  stuckWalkers: number;
  converged: boolean;
}

/** Targets of the stopping rule. */
export interface StoppingRule {
  targetEss: number;
  maxRhat: number;
}

/** Thinning of the chains for the convergence checks while sampling: keep one step per tau/5. */
const CHECK_THINNING_PER_TAU = 5;

/** Fewest thinned steps per walker worth diagnosing; below it the checks use every step. */
const MINIMUM_THINNED_STEPS = 20;

/** Steps needed before the first diagnostics are attempted (the diagnostics need a few draws per split chain). */
const MINIMUM_STEPS_FOR_CHECK = 40;

/**
 * Diagnoses the chains so far: chooses the burn-in from the autocorrelation
 * times (chooseBurnIn: 2 x max tau, capped at half the chain), then R-hat,
 * bulk and tail ESS per parameter on what follows it. Converged when every
 * sampled parameter has bulk ESS >= target and R-hat <= maximum.
 */
export function checkConvergence(sampler: EnsembleSampler, rule: StoppingRule): ConvergenceCheck {
  const steps = sampler.stepCount;
  const { ensembles, walkers, dimension } = sampler.options;
  const acceptance = new Float64Array(ensembles * walkers);
  for (let k = 0; k < ensembles; k++) acceptance.set(sampler.acceptanceFractions(k), k * walkers);
  const accept = acceptanceSummary(acceptance);
  const empty: ConvergenceCheck = {
    step: steps, burnInSteps: 0, diagnostics: [], thin: 1, maxTau: null, minEssBulk: null, maxRhat: null,
    meanAcceptance: accept.mean, stuckWalkers: accept.stuckWalkers.length, converged: false,
  };
  if (steps < MINIMUM_STEPS_FOR_CHECK) return empty;
  const traces = Array.from({ length: dimension }, (_, d) => Array.from({ length: ensembles }, (_, k) => {
    const chain = sampler.chain(k);
    const values = new Float64Array(steps * walkers);
    for (let i = 0; i < steps * walkers; i++) values[i] = chain.positions[i * dimension + d];
    return { steps, walkers, values };
  }));
  // The burn-in comes from the autocorrelation times of the whole chain (FFT only: cheap); the rank-based
  // diagnostics, the costly part, then run once on what follows it.
  const taus = traces.map((trace) => {
    const series: Float64Array[] = [];
    for (const { values } of trace) {
      for (let w = 0; w < walkers; w++) {
        const walker = new Float64Array(steps);
        for (let s = 0; s < steps; s++) walker[s] = values[s * walkers + w];
        series.push(walker);
      }
    }
    try {
      return integratedAutocorrelationTime(series).tauSteps;
    } catch {
      return Number.NaN;
    }
  });
  const burnInSteps = taus.every((tau) => Number.isFinite(tau) && tau > 0) ? chooseBurnIn(taus, steps) : Math.floor(steps / 2);
  // While sampling, the rank-based diagnostics run on the kept steps thinned by a fifth of the shortest
  // autocorrelation time: draws that close together carry almost no extra information, so the ESS and
  // R-hat of the thinned chains estimate those of the full ones (Geyer 1992 on thinning) at a fraction of
  // the cost. The final summary (analyzeRun) uses every draw.
  const minTau = Math.min(...taus.filter((tau) => Number.isFinite(tau) && tau > 0));
  let thin = Number.isFinite(minTau) ? Math.max(1, Math.floor(minTau / CHECK_THINNING_PER_TAU)) : 1;
  if (Math.floor((steps - burnInSteps) / thin) < MINIMUM_THINNED_STEPS) thin = 1;
  const keptSteps = Math.floor((steps - burnInSteps) / thin);
  const diagnostics = traces.map((trace) => diagnoseEnsembleChains(trace.map(({ values }) => {
    const thinned = new Float64Array(keptSteps * walkers);
    for (let j = 0; j < keptSteps; j++) thinned.set(values.subarray((burnInSteps + j * thin) * walkers, (burnInSteps + j * thin + 1) * walkers), j * walkers);
    return { steps: keptSteps, walkers, values: thinned };
  }), 0));
  const values = (pick: (d: ParameterDiagnostics) => number | null) => diagnostics.map(pick);
  const essList = values((d) => d.essBulk);
  const rhatList = values((d) => d.rhat);
  const complete = (list: Array<number | null>): list is number[] => list.every((v) => v !== null && Number.isFinite(v));
  const minEssBulk = complete(essList) ? Math.min(...essList) : null;
  const maxRhat = complete(rhatList) ? Math.max(...rhatList) : null;
  // tau of the whole chain in steps (the diagnostics above saw thinned chains, whose tau is in thinned steps).
  const maxTau = taus.every((tau) => Number.isFinite(tau)) ? Math.max(...taus) : null;
  const converged = minEssBulk !== null && maxRhat !== null && minEssBulk >= rule.targetEss && maxRhat <= rule.maxRhat;
  return { ...empty, burnInSteps, diagnostics, thin, maxTau, minEssBulk, maxRhat, converged };
}
