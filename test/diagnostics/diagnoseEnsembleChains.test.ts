import { describe, expect, it } from 'vitest';
import {
  diagnoseEnsembleChains,
  essBulk,
  essTail,
  integratedAutocorrelationTime,
  mcseMean,
  rankNormalizedSplitRhat,
} from '../../src/diagnostics/index.js';
import type { EnsembleTrace } from '../../src/diagnostics/index.js';
import { ar1Walkers } from './ar1Walkers.js';

/** Packs per-walker series into a step-major trace, values[step * walkers + walker]. */
function traceOf(series: Float64Array[]): EnsembleTrace {
  const walkers = series.length;
  const steps = series[0].length;
  const values = new Float64Array(steps * walkers);
  series.forEach((walkerSeries, walker) => walkerSeries.forEach((value, step) => (values[step * walkers + walker] = value)));
  return { steps, walkers, values };
}

function issuesOf(run: () => unknown): Array<{ code: string }> {
  try {
    run();
  } catch (error) {
    return (error as { issues: Array<{ code: string }> }).issues;
  }
  return [];
}

const BURN_IN = 40;

describe('diagnoseEnsembleChains', () => {
  const first = ar1Walkers(8, 2000, 0.8, 'ensemble/0');
  const second = ar1Walkers(12, 2000, 0.8, 'ensemble/1');
  // Burn-in steps far from the target: the result must not see them.
  for (const series of [...first, ...second]) for (let step = 0; step < BURN_IN; step++) series[step] += 50;
  const kept = [...first, ...second].map((series) => series.slice(BURN_IN));
  const result = diagnoseEnsembleChains([traceOf(first), traceOf(second)], BURN_IN);

  it('treats every walker of every ensemble as one chain after the burn-in (identity with the single functions)', () => {
    expect(result.keptSteps).toBe(1960);
    expect(result.chainCount).toBe(20);
    expect(result.tau).toBe(integratedAutocorrelationTime(kept).tauSteps);
    expect(result.autocorrelation?.walkersUsed).toBe(20);
    expect(result.rhatWalkers).toBe(rankNormalizedSplitRhat(kept));
    // Across ensembles: each ensemble's walkers pooled step by step into one chain (cut to the shorter ensemble's length).
    const pooled = [first, second].map((walkers) => {
      const out = new Float64Array(kept[0].length * walkers.length);
      for (let step = 0; step < kept[0].length; step++) walkers.forEach((series, w) => (out[step * walkers.length + w] = series[BURN_IN + step]));
      return out;
    });
    const length = Math.min(pooled[0].length, pooled[1].length);
    expect(result.rhat).toBe(rankNormalizedSplitRhat(pooled.map((chain) => chain.subarray(0, length))));
    expect(result.essBulk).toBe(essBulk(kept));
    expect(result.essTail).toBe(essTail(kept));
    expect(result.mcseMean).toBe(mcseMean(kept));
    expect(result.issues).toEqual([]);
  });

  it('reports converged AR(1) walkers as converged: R-hat < 1.01 (Vehtari et al. 2021 threshold), tau near (1 + phi)/(1 - phi) = 9', () => {
    // For converged chains of n draws, var(chain mean) = tau sigma^2 / n, so the definition
    // gives R-hat^2 = 1 + (tau - 1)/n on average: 1.004 for half-chains of 980 draws, tau = 9.
    expect(result.rhat!).toBeLessThan(1.01);
    // Tolerance: 4 Sokal (1997) standard errors, sqrt(2 (2 x 45 + 1) / 39200) x 9 = 0.61 each.
    expect(Math.abs(result.tau! - 9)).toBeLessThan(4 * 0.61);
  });

  it('flags an ensemble that sits elsewhere: R-hat well above 1.01', () => {
    const shifted = ar1Walkers(12, 600, 0.8, 'ensemble/shifted').map((series) => series.map((value) => value + 1.5));
    const mixed = diagnoseEnsembleChains([traceOf(ar1Walkers(12, 600, 0.8, 'ensemble/base')), traceOf(shifted)], 0);
    expect(mixed.rhat!).toBeGreaterThan(1.1);
    expect(mixed.rhatWalkers!).toBeGreaterThan(1.1);
  });

  it('returns nulls and one warning when the parameter never moves', () => {
    const frozen = diagnoseEnsembleChains([{ steps: 20, walkers: 3, values: new Float64Array(60).fill(0.3) }], 0);
    expect([frozen.tau, frozen.rhat, frozen.essBulk, frozen.essTail, frozen.mcseMean]).toEqual([null, null, null, null, null]);
    expect(frozen.issues).toHaveLength(1);
    expect(frozen.issues[0]).toMatchObject({ code: 'diagnostics.constant_draws', severity: 'warning', path: 'all' });
  });

  it('returns null with a warning for only the quantity that is undefined (tail ESS when the top 10% of draws tie)', () => {
    // 90% zeros, 10% ones: the 95% quantile is 1, so the indicator x <= q is constant.
    const series = Array.from({ length: 4 }, (_, walker) => Float64Array.from({ length: 100 }, (_, step) => ((step * 7 + walker * 3) % 10 === 0 ? 1 : 0)));
    const partial = diagnoseEnsembleChains([traceOf(series)], 0);
    expect(partial.essTail).toBeNull();
    expect(partial.essBulk).not.toBeNull();
    expect(partial.rhat).not.toBeNull();
    expect(partial.issues.map((issue) => issue.path)).toEqual(['essTail']);
  });

  it('throws for inconsistent shapes and a burn-in that leaves fewer than 6 steps', () => {
    expect(issuesOf(() => diagnoseEnsembleChains([], 0))[0].code).toBe('diagnostics.no_chains');
    expect(issuesOf(() => diagnoseEnsembleChains([{ steps: 10, walkers: 2, values: new Float64Array(19) }], 0))[0].code).toBe('diagnostics.trace_shape');
    const good = traceOf(first);
    expect(issuesOf(() => diagnoseEnsembleChains([good, { ...good, steps: 1999, values: good.values.subarray(0, 1999 * 8) }], 0))[0].code).toBe('diagnostics.trace_shape');
    expect(issuesOf(() => diagnoseEnsembleChains([good], 1995))[0].code).toBe('diagnostics.burn_in');
    expect(issuesOf(() => diagnoseEnsembleChains([good], -1))[0].code).toBe('diagnostics.burn_in');
  });
});
