import { RELIABLE_STEPS_PER_TAU } from '../../diagnostics/index.js';
import { MAXIMUM_TAU_GROWTH, type ConvergenceCheck, type StoppingRule } from '../fit/samplingLoop.js';

/**
 * Safety factor on the extrapolated step count: ESS grows only about linearly
 * with the kept steps, the burn-in grows with the chain, and an ESS estimated
 * from a few hundred draws scatters by 10-20% (measured: a 20% margin left one
 * Pantheon wCDM merge at ESS 742 of 800 after following the remedy).
 */
export const STEP_SUGGESTION_MARGIN = 1.5;
/** Suggested step counts are rounded up to a multiple of this. */
export const STEP_SUGGESTION_ROUNDING = 100;

/** One part as the verdict sees it. */
export interface PartProgress {
  dir: string;
  /** Steps the part holds. */
  steps: number;
  /** Steps it was asked to run to (null for parts written before the target was recorded). */
  stepsTarget: number | null;
  /** Why it stopped: max_steps (reached its count), wall_time, interrupted. */
  stopReason: string;
}

/** Whether a merged run meets the configuration's convergence targets, and what to do when it does not. */
export interface MergeVerdict {
  /** Every sampled parameter has bulk ESS >= target_ess and R-hat <= max_rhat over the merged ensembles, and the chains are 50 tau long. */
  targetsMet: boolean;
  /** One sentence per missed target and per part that stopped before its step count. */
  shortfalls: string[];
  /** Steps every part should be continued to (--resume) to meet the targets; null when they are met. */
  suggestedSteps: number | null;
}

const roundUp = (steps: number) => Math.ceil(steps / STEP_SUGGESTION_ROUNDING) * STEP_SUGGESTION_ROUNDING;

/**
 * Judges a merged run against the targets of its configuration. The merged
 * diagnostics (R-hat across every walker of every part's ensemble, bulk ESS
 * of the pooled kept draws) are the ones that count: a part's own R-hat
 * compares only its walkers, so parts that each look converged can still
 * disagree with one another (Vehtari, Gelman, Simpson, Carpenter & Buerkner
 * 2021 motivate R-hat as a between-chain comparison).
 *
 * The suggested step count extrapolates the bulk ESS linearly in the kept
 * (post-burn-in) steps, keeps the burn-in, adds 50% and rounds up to 100
 * steps, and to at least 1.5 x 50 tau; when R-hat fails or the ESS is undefined it asks for at least twice
 * the steps so far (R-hat has no dependable extrapolation; common practice).
 * Cost: O(parameters + parts).
 * @param check the convergence check of the merged chains.
 * @param rule target_ess and max_rhat of the configuration.
 * @param names sampled parameter names, in the order of check.diagnostics.
 * @param parts the parts merged, to name those that stopped early.
 * @returns the verdict.
 * @throws nothing.
 * @example judgeMergedRun({ step: 1000, burnInSteps: 200, minEssBulk: 1000, maxRhat: 1.002, ... }, { targetEss: 2000, maxRhat: 1.01 }, ['omega_m'], parts).suggestedSteps // 2200
 */
export function judgeMergedRun(check: ConvergenceCheck, rule: StoppingRule, names: readonly string[], parts: readonly PartProgress[]): MergeVerdict {
  const shortfalls: string[] = [];
  let essFactor = 1;
  let rhatFails = false;
  check.diagnostics.forEach((diagnostic, d) => {
    const name = names[d] ?? `parameter ${d}`;
    if (diagnostic.essBulk === null || !Number.isFinite(diagnostic.essBulk)) {
      shortfalls.push(`the bulk ESS of ${name} is undefined`);
      rhatFails = true;
    } else if (diagnostic.essBulk < rule.targetEss) {
      shortfalls.push(`the bulk ESS of ${name} is ${Math.floor(diagnostic.essBulk)}, below target_ess ${rule.targetEss}`);
      essFactor = Math.max(essFactor, rule.targetEss / Math.max(diagnostic.essBulk, 1));
    }
    if (diagnostic.rhat === null || !Number.isFinite(diagnostic.rhat)) {
      shortfalls.push(`the R-hat of ${name} is undefined`);
      rhatFails = true;
    } else if (diagnostic.rhat > rule.maxRhat) {
      shortfalls.push(`the R-hat of ${name} is ${diagnostic.rhat.toFixed(4)}, above max_rhat ${rule.maxRhat}`);
      rhatFails = true;
    }
  });
  if (check.diagnostics.length === 0) {
    shortfalls.push('the merged chains are too short for diagnostics');
    rhatFails = true;
  }
  // The third condition of the stopping rule (samplingLoop.checkConvergence): chains of at least 50 tau.
  const tauSteps = check.maxTau !== null ? RELIABLE_STEPS_PER_TAU * check.maxTau : null;
  if (tauSteps !== null && check.step < tauSteps) {
    shortfalls.push(`the chains are ${check.step} steps, shorter than ${RELIABLE_STEPS_PER_TAU} autocorrelation times (tau = ${(check.maxTau as number).toFixed(1)} steps)`);
  }
  // The fourth: tau no longer grows with the chain (measured by checkConvergence once the others hold).
  const tauGrowing = typeof check.tauGrowth === 'number' && check.tauGrowth > MAXIMUM_TAU_GROWTH;
  if (tauGrowing) {
    shortfalls.push(`tau still grows with the chain: ${(check.tauGrowth as number).toFixed(2)} times its value on the first half (at most ${MAXIMUM_TAU_GROWTH})`);
  }
  const targetsMet = shortfalls.length === 0;
  for (const part of parts) {
    if (part.stepsTarget !== null && part.steps < part.stepsTarget) {
      shortfalls.push(`the part ${part.dir} stopped (${part.stopReason}) at step ${part.steps} of ${part.stepsTarget}; the merge cut every part to its length`);
    }
  }
  if (targetsMet) return { targetsMet, shortfalls, suggestedSteps: null };
  const kept = check.step - check.burnInSteps;
  let suggested = check.burnInSteps + kept * essFactor * STEP_SUGGESTION_MARGIN;
  if (rhatFails) suggested = Math.max(suggested, 2 * check.step);
  if (tauSteps !== null) suggested = Math.max(suggested, tauSteps * STEP_SUGGESTION_MARGIN);
  if (tauGrowing) suggested = Math.max(suggested, 2 * check.step);
  return { targetsMet, shortfalls, suggestedSteps: roundUp(Math.max(suggested, check.step + 1)) };
}
