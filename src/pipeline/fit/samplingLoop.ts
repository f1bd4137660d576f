import { acceptanceSummary, type ParameterDiagnostics } from '../../diagnostics/index.js';
import { diagnoseTraces } from '../../diagnostics/index.js';
import type { EnsembleSampler } from '../../sampler/index.js';

/** Why sampling ended. */
export type StopReason = 'converged' | 'max_steps' | 'wall_time' | 'interrupted' | 'merged';

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
  const { tauSteps: taus, burnInSteps, thin, diagnostics } = diagnoseTraces(traces);
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
