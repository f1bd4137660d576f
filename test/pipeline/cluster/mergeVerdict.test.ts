import { describe, expect, it } from 'vitest';
import { judgeMergedRun } from '../../../src/pipeline/cluster/mergeVerdict.js';
import type { ConvergenceCheck } from '../../../src/pipeline/fit/samplingLoop.js';

// The targets are the fit's own stopping rule: every sampled parameter with bulk ESS >= target_ess and
// rank-normalized split-R-hat <= max_rhat (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021 recommend
// bulk ESS and R-hat per parameter, R-hat < 1.01). The step suggestion, ESS growing linearly with the
// kept steps and twice the steps when R-hat fails, is common practice; the numbers below follow from it
// by hand. The third condition, chains of at least 50 tau, follows Foreman-Mackey et al. (2013).

function check(step: number, burnInSteps: number, perParameter: Array<{ essBulk: number | null; rhat: number | null }>, maxTau: number | null = 20): ConvergenceCheck {
  return {
    step, burnInSteps, thin: 1, maxTau, meanAcceptance: 0.4, stuckWalkers: 0, converged: false,
    minEssBulk: null, maxRhat: null,
    diagnostics: perParameter.map((values) => ({ ...values })) as unknown as ConvergenceCheck['diagnostics'],
  };
}
const rule = { targetEss: 2000, maxRhat: 1.01 };
const names = ['omega_m', 'w0'];
const fullParts = [{ dir: 'p0', steps: 1000, stepsTarget: 1000, stopReason: 'max_steps' }, { dir: 'p1', steps: 1000, stepsTarget: 1000, stopReason: 'max_steps' }];

describe('judgeMergedRun', () => {
  it('passes a merged run whose every parameter meets both targets', () => {
    const verdict = judgeMergedRun(check(1000, 200, [{ essBulk: 2500, rhat: 1.004 }, { essBulk: 2001, rhat: 1.0099 }]), rule, names, fullParts);
    expect(verdict).toEqual({ targetsMet: true, shortfalls: [], suggestedSteps: null });
  });

  it('fails a merged run with a low ESS and extrapolates the steps linearly in the kept steps, plus 50%', () => {
    const verdict = judgeMergedRun(check(1000, 200, [{ essBulk: 1000, rhat: 1.002 }, { essBulk: 1600, rhat: 1.003 }]), rule, names, fullParts);
    expect(verdict.targetsMet).toBe(false);
    expect(verdict.shortfalls).toEqual(['the bulk ESS of omega_m is 1000, below target_ess 2000', 'the bulk ESS of w0 is 1600, below target_ess 2000']);
    // 200 + 800 x (2000 / 1000) x 1.5 = 2600, already a multiple of 100
    expect(verdict.suggestedSteps).toBe(2600);
  });

  it('fails a merged run whose R-hat is above max_rhat even when each ESS is met, and asks for at least twice the steps', () => {
    // The case the merged targets exist for: parts that each ran to their end, an R-hat across them above 1.01.
    const verdict = judgeMergedRun(check(2000, 46, [{ essBulk: 2100, rhat: 1.0125 }, { essBulk: 2050, rhat: 1.0128 }]), rule, names, fullParts);
    expect(verdict.targetsMet).toBe(false);
    expect(verdict.shortfalls).toEqual(['the R-hat of omega_m is 1.0125, above max_rhat 1.01', 'the R-hat of w0 is 1.0128, above max_rhat 1.01']);
    expect(verdict.suggestedSteps).toBe(4000);
  });

  it('treats undefined diagnostics as missed targets', () => {
    const verdict = judgeMergedRun(check(100, 50, [{ essBulk: null, rhat: null }], null), rule, ['omega_m'], []);
    expect(verdict.targetsMet).toBe(false);
    expect(verdict.shortfalls).toEqual(['the bulk ESS of omega_m is undefined', 'the R-hat of omega_m is undefined']);
    expect(verdict.suggestedSteps).toBe(200);
  });

  it('names a part that stopped before its step count, whether or not the targets are met', () => {
    const parts = [fullParts[0], { dir: 'p1', steps: 700, stepsTarget: 1000, stopReason: 'wall_time' }];
    const verdict = judgeMergedRun(check(700, 100, [{ essBulk: 2500, rhat: 1.001 }, { essBulk: 2500, rhat: 1.001 }], 10), rule, names, parts);
    expect(verdict.targetsMet).toBe(true);
    expect(verdict.shortfalls).toEqual(['the part p1 stopped (wall_time) at step 700 of 1000; the merge cut every part to its length']);
  });

  it('fails a merged run shorter than 50 autocorrelation times even when ESS and R-hat are met, and asks for 1.5 x 50 tau', () => {
    const verdict = judgeMergedRun(check(1000, 200, [{ essBulk: 2500, rhat: 1.004 }, { essBulk: 2100, rhat: 1.005 }], 30), rule, names, fullParts);
    expect(verdict.targetsMet).toBe(false);
    expect(verdict.shortfalls).toEqual(['the chains are 1000 steps, shorter than 50 autocorrelation times (tau = 30.0 steps)']);
    // max(200 + 800 x 1 x 1.5, 50 x 30 x 1.5) = 2250, rounded up to 2300
    expect(verdict.suggestedSteps).toBe(2300);
  });

  it('fails a merged run whose tau still grows with the chain, and asks for twice the steps', () => {
    const growing = { ...check(3000, 200, [{ essBulk: 2500, rhat: 1.004 }, { essBulk: 2100, rhat: 1.005 }], 40), tauGrowth: 1.6 };
    const verdict = judgeMergedRun(growing, rule, names, fullParts);
    expect(verdict.targetsMet).toBe(false);
    expect(verdict.shortfalls).toEqual(['tau still grows with the chain: 1.60 times its value on the first half (at most 1.3)']);
    expect(verdict.suggestedSteps).toBe(6000);
  });
});
