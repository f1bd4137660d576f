import { describe, expect, it } from 'vitest';
import { runFactsForReport, type RunFactsForReportInput } from '../../../src/output/index.js';

// Wording of the run facts on the report page; the numbers are plain inputs (no reference needed: formatting only).
const base: RunFactsForReportInput = {
  seed: 'kestrel-7', steps: 4000, wallTimeSeconds: 61, version: '0.1.0', modelLabel: 'flat_w0wa',
  sampler: { method: 'ensemble', walkers: 32, ensembles: 4, stopReason: 'converged' },
  supernovae: 812, chiSquare: 803.456, degreesOfFreedom: 806,
  goodness: { reducedChiSquare: 0.99684, pValue: 0.5321987 },
  terms: [{ name: 'supernovae', chiSquare: 790.123, dataPoints: 812, degreesOfFreedom: 806 }],
  evaluations: 512000,
};

describe('runFactsForReport', () => {
  it('words an ensemble run: walkers and stop reason up front, then supernovae, chi-square, goodness and calls', () => {
    const facts = runFactsForReport(base);
    expect(facts).toMatchObject({ seed: 'kestrel-7', steps: 4000, walkers: 32, ensembles: 4, stopReason: 'converged', wallTimeSeconds: 61, version: '0.1.0', model: 'flat_w0wa' });
    expect(facts.extra).toEqual([
      { label: 'supernovae', value: '812' },
      { label: 'chi-square at best fit', value: '803.46 for 806 degrees of freedom' },
      { label: 'chi-square per degree of freedom', value: '0.997 (p-value 0.532)' },
      { label: 'likelihood evaluations', value: '512000' },
    ]);
  });

  it('adds one row per likelihood term only when there are two or more, before the calls', () => {
    const facts = runFactsForReport({ ...base, terms: [...base.terms, { name: 'bao', chiSquare: null, dataPoints: 13, degreesOfFreedom: 11 }] });
    expect(facts.extra?.slice(3).map((row) => `${row.label}: ${row.value}`)).toEqual([
      'chi-square of supernovae: 790.12 for 812 data points, 806 degrees of freedom',
      'chi-square of bao: n/a',
      'likelihood evaluations: 512000',
    ]);
  });

  it('says n/a for a run without chi-square and leaves out the goodness row when unknown', () => {
    const facts = runFactsForReport({ ...base, chiSquare: null, goodness: null });
    expect(facts.extra?.map((row) => row.label)).toEqual(['supernovae', 'chi-square at best fit', 'likelihood evaluations']);
    expect(facts.extra?.[1].value).toBe('n/a');
  });

  it('words a nested run: the stop criterion, that Markov-chain checks do not apply, ln Z, H and the Kish effective sample size', () => {
    const facts = runFactsForReport({
      ...base,
      sampler: { method: 'nested', livePoints: 500, stop: 'max_unexplored_ln_z', maxUnexploredLnZ: 0.1, evidence: { logZ: -412.34567, logZError: 0.1234, informationNats: 3.456 }, effectiveSampleSize: 774.4, weightedSamples: 1185 },
    });
    expect(facts.walkers).toBeUndefined();
    expect(facts.stopReason).toBe('nested sampling: unexplored ln Z below max_unexplored_ln_z = 0.1');
    expect(facts.extra?.map((row) => `${row.label}: ${row.value}`)).toEqual([
      'sampler: nested sampling, 500 live points (convergence checks for Markov chains do not apply)',
      'ln Z (evidence): -412.346 ± 0.123',
      'information H: 3.46 nats',
      'effective sample size (Kish): 774 of 1185 weighted samples',
      'supernovae: 812',
      'chi-square at best fit: 803.46 for 806 degrees of freedom',
      'chi-square per degree of freedom: 0.997 (p-value 0.532)',
      'likelihood evaluations: 512000',
    ]);
  });

  it('words a nested run stopped by the iteration cap and without evidence', () => {
    const facts = runFactsForReport({ ...base, sampler: { method: 'nested', livePoints: 50, stop: 'max_iterations', maxUnexploredLnZ: 0.1, evidence: null, effectiveSampleSize: 10, weightedSamples: 90 } });
    expect(facts.stopReason).toBe('nested sampling: iteration cap reached');
    expect(facts.extra?.slice(1, 3).map((row) => row.value)).toEqual(['n/a', 'n/a']);
  });
});
