// A run whose posterior is cut by its prior: a mock run folder whose chains are
// independent draws from known distributions (a half-normal piled against the
// lower prior edge 0, and a Gaussian well inside its prior), analysed and
// written like a real run.
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { analyzeRun } from '../../../src/pipeline/report/analyzeRun.js';
import { buildRunOutputs } from '../../../src/pipeline/index.js';
import { writeChainsFile } from '../../../src/output/run/chainsFile.js';
import { readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { summaryDocument } from '../../../src/pipeline/report/summaryDocument.js';
import { summaryLatex, summaryMarkdown } from '../../../src/output/index.js';

const scratch = resolve('.candela-tmp/prior-edge-run');
/** sd of the half-normal sigma_int draws, mag. */
const SIGMA_SCALE = 0.04;
const ENSEMBLES = 4;
const WALKERS = 16;
const STEPS = 1000;
/** The frozen-covariance sentence the likelihood would record (checked to travel to summary.json and the report). */
const LIKELIHOOD_WARNING = 'dense covariance frozen at alpha = 0.14, beta = 3.1: ln det C is constant';

function writeMockRun(dir: string): void {
  mkdirSync(dir, { recursive: true });
  const random = createRandomStream('prior-edge-mock');
  const dimension = 2;
  const ensembles = Array.from({ length: ENSEMBLES }, () => {
    const positions = new Float64Array(STEPS * WALKERS * dimension);
    const logProb = new Float64Array(STEPS * WALKERS);
    const blobs = new Float64Array(STEPS * WALKERS * 2);
    for (let row = 0; row < STEPS * WALKERS; row++) {
      const omegaM = 0.3 + 0.02 * random.normal();
      const sigma = Math.abs(SIGMA_SCALE * random.normal());
      positions[row * 2] = omegaM;
      positions[row * 2 + 1] = sigma;
      const logLikelihood = -0.5 * (((omegaM - 0.3) / 0.02) ** 2 + (sigma / SIGMA_SCALE) ** 2);
      logProb[row] = logLikelihood;
      blobs[row * 2] = 0;
      blobs[row * 2 + 1] = logLikelihood;
    }
    return { steps: STEPS, walkers: WALKERS, dimension, positions, logProb, blobs, blobCount: 2 };
  });
  writeChainsFile(join(dir, 'chains.csv'), { parameters: ['omega_m', 'sigma_int'], derived: [] }, ensembles, 0);
  const record = {
    tool: { name: 'candela', version: 'test' },
    title: 'prior-edge mock',
    model: { label: 'flat_lcdm', dark_energy: 'lambda', curvature: 'flat', radiation: false },
    parameters: {
      sampled: [{ name: 'omega_m', prior: { kind: 'uniform', min: 0, max: 1 } }, { name: 'sigma_int', prior: { kind: 'uniform', min: 0, max: 0.5 } }],
      fixed: {}, derived: [],
    },
    data: { supernovae: 100, samples: [], redshift_range: [0.01, 1], cuts: [], warnings: [] },
    likelihood: { description: [], path: 'dense', warnings: [LIKELIHOOD_WARNING] },
    // chi-square 43 for 98 degrees of freedom: p = 1 - 2e-7, errors far too large.
    best_fit: { parameters: { omega_m: 0.3, sigma_int: 0.0001 }, chi_square: 43, n_data: 100, n_free: 2, degrees_of_freedom: 98, log_likelihood: -21.5, log_posterior: -21.5, abs_mag: null },
    run: { seed: '1', steps: STEPS, burn_in_steps: 0, walkers: WALKERS, ensembles: ENSEMBLES, evaluations: 1, wall_seconds: 1, worker_threads: 1, stop_reason: 'converged', target_ess: 100, max_rhat: 1.05 },
    inputs: [],
    configuration: { output: { figures: [], png: false }, reference_h0: 70 },
  };
  writeFileSync(join(dir, 'run.json'), JSON.stringify(record));
}

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  writeMockRun(scratch);
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('a posterior cut by its prior', () => {
  it('is quoted as a one-sided 95% upper limit at the half-normal 95% quantile, with a prior_edge warning', () => {
    const analysis = analyzeRun(readRunFolder(scratch));
    const sigma = analysis.summary.parameters.find((p) => p.name === 'sigma_int')!;
    // 95% quantile of a half-normal = sd x the normal's 97.5% quantile 1.959964 (standard normal table, e.g. Abramowitz & Stegun 1964, table 26.5).
    expect(sigma.oneSidedLimit?.side).toBe('upper');
    expect(sigma.oneSidedLimit!.value / SIGMA_SCALE).toBeCloseTo(1.959964, 1);
    const warning = analysis.warnings.find((w) => w.code === 'prior_edge');
    expect(warning).toMatchObject({ parameter: 'sigma_int', numbers: { edge: 0, prior_lower: 0 } });
    // The Gaussian well inside its prior keeps its two-sided numbers.
    expect(analysis.summary.parameters.find((p) => p.name === 'omega_m')!.oneSidedLimit).toBeUndefined();
    expect(analysis.warnings.filter((w) => w.parameter === 'omega_m')).toEqual([]);
  });

  it('writes the limit into summary.json, summary.md and table.tex instead of mean ± sd', () => {
    const run = readRunFolder(scratch);
    const analysis = analyzeRun(run);
    const document = summaryDocument(run, analysis);
    expect(document.parameters.sigma_int.one_sided_limit).toMatchObject({ side: 'upper', mass: 0.95 });
    expect(document.parameters.omega_m.one_sided_limit).toBeNull();
    const markdown = summaryMarkdown(analysis.summary);
    const row = markdown.split('\n').find((line) => line.includes('`sigma_int`'))!;
    expect(row).toMatch(/< 0\.0\d+ \(95% upper limit\)/);
    expect(row).not.toContain('±');
    expect(summaryLatex(analysis.summary)).toMatch(/\$< 0\.0\d+\\ \(\\mbox\{95\\% upper limit\}\)\$/);
  });

  it('flags a chi-square per degree of freedom far below 1 (p-value above 0.999)', () => {
    const analysis = analyzeRun(readRunFolder(scratch));
    const fit = analysis.warnings.find((w) => w.code === 'goodness_of_fit');
    expect(fit?.numbers.p_value).toBeGreaterThan(0.999);
    expect(fit?.message).toContain('errors too large');
  });

  it('carries every warning, the likelihood approximation included, into summary.json and the report', () => {
    buildRunOutputs([scratch], scratch);
    const summary = JSON.parse(readFileSync(join(scratch, 'summary.json'), 'utf8')) as { warnings: Array<{ code: string; message: string }> };
    const report = readFileSync(join(scratch, 'report.html'), 'utf8');
    const codes = summary.warnings.map((w) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['likelihood_approximation', 'prior_edge', 'goodness_of_fit']));
    const escape = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
    for (const warning of summary.warnings) expect(report, warning.code).toContain(escape(warning.message));
    expect(report).toContain('warnings below qualify the results');
  });
});
