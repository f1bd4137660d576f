import { describe, expect, it } from 'vitest';
import { smallestBulkEssInSummaryJson, summaryJsonDocument, type SampleStatistics, type SummaryJsonInput } from '../../../src/output/index.js';

// The reader must find what summaryJsonDocument writes (summary.json, schema candela-summary-1):
// the text below is the writer's own output. The numbers are made up for the layout.
const stats: SampleStatistics = { count: 1000, effectiveCount: 1000, mean: 0.3, sd: 0.02, median: 0.3, ci68: [0.28, 0.32], ci95: [0.26, 0.34], hdi68: [0.28, 0.32], min: 0.2, max: 0.4, map: 0.3 };
const input: SummaryJsonInput = {
  title: 'Kestrel layout test',
  model: { label: 'flat_w0wa', dark_energy: 'cpl', curvature: 'flat', radiation: false },
  summary: { sampleCount: 1000, parameters: [{ name: 'omega_m', stats }, { name: 'w0', stats }, { name: 'wa', stats }] },
  diagnostics: {
    omega_m: { rhat: 1.002, essBulk: 2500, essTail: 2100, tau: 40, mcseMean: 0.0004 },
    w0: { rhat: 1.003, essBulk: 1800.4, essTail: 1700, tau: 55, mcseMean: 0.002 },
    wa: { rhat: 1.01, essBulk: null, essTail: null, tau: null, mcseMean: null },
  },
  steps: 3000, converged: true, nested: null, targetEss: 2000, maxRhat: 1.01, acceptanceMean: 0.31, stuckWalkers: 0, minimumChainLengthOverTau: 50,
  bestFit: { parameters: { omega_m: 0.3 }, chi_square: 35.5, n_data: 40, n_free: 3, degrees_of_freedom: 37, log_likelihood: -17.75, log_posterior: -16.5, abs_mag: -19.3 },
  goodness: null, burnInSteps: 100, keptSamples: 185600,
  run: { seed: '7', steps: 3000, walkers: 16, ensembles: 4, evaluations: 192000, wall_seconds: 12.5, worker_threads: 2, stop_reason: 'converged', version: '0.1.0', inputs: [], configuration: {} },
  likelihood: { description: ['Gaussian'], path: 'dense' }, data: { supernovae: 40 }, warnings: [],
};
const text = `${JSON.stringify(summaryJsonDocument(input), null, 2)}\n`;

describe('smallestBulkEssInSummaryJson', () => {
  it('gives the smallest bulk ESS of the named parameters, as summaryJsonDocument wrote it', () => {
    expect(smallestBulkEssInSummaryJson(text, ['omega_m', 'w0'])).toBe(1800.4);
    expect(smallestBulkEssInSummaryJson(text, ['omega_m'])).toBe(2500);
  });

  it('skips parameters without a positive bulk ESS (null, missing, zero)', () => {
    expect(smallestBulkEssInSummaryJson(text, ['wa', 'omega_m', 'h0'])).toBe(2500);
    expect(smallestBulkEssInSummaryJson('{"diagnostics":{"omega_m":{"ess_bulk":0},"w0":{"ess_bulk":-3}}}', ['omega_m', 'w0'])).toBeNull();
  });

  it('gives null for text that is not JSON, JSON without diagnostics, or no parameter with one', () => {
    expect(smallestBulkEssInSummaryJson('{"diagnostics": ', ['omega_m'])).toBeNull();
    expect(smallestBulkEssInSummaryJson('null', ['omega_m'])).toBeNull();
    expect(smallestBulkEssInSummaryJson('{}', ['omega_m'])).toBeNull();
    expect(smallestBulkEssInSummaryJson(text, ['wa'])).toBeNull();
  });
});
