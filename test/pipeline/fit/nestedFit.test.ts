import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../../src/config/index.js';
import { buildRunOutputs, runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { buildModel } from '../../../src/pipeline/run/buildModel.js';
import { loadSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { readChainsFile } from '../../../src/output/run/chainsFile.js';

// Nested-sampling runs of `candela fit` (sampler.method: nested) on the
// Pantheon 2018 binned Hubble diagram (Scolnic et al. 2018, ApJ 859, 101;
// ../shared/data-real/pantheon2018/Binned_data): flat LambdaCDM with the
// offset marginalized analytically, so the posterior is one-dimensional in
// omega_m and the evidence can be checked by direct quadrature.
const scratch = resolve('.candela-tmp/nested-fit');
/** Live points of the test runs: ln Z error sqrt(H / N) ~ 0.13 nats for H ~ 3.3 nats (Skilling 2006). */
const LIVE_POINTS = 200;
/** Grid intervals of the Simpson quadrature over omega_m in [0, 1] (even; the posterior sd ~0.022 spans ~90 intervals). */
const QUADRATURE_INTERVALS = 4000;

function writeConfig(name: string, seed: number): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'nested test', seed,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
    parameters: '  omega_m: { prior: uniform, min: 0, max: 1 }',
    sampler: `{ method: nested, nested: { live_points: ${LIVE_POINTS}, max_unexplored_ln_z: 0.05 } }`,
    output: `{ dir: ${join(scratch, name)}, figures: [triangle, hubble, trace], png: false }`,
  }));
  return path;
}

/** ln of the integral of L(omega_m) x prior density (1 on [0, 1]) by composite Simpson's rule, with the maximum factored out. */
function quadratureEvidence(configPath: string): { logZ: number; mean: number; sd: number } {
  const config = loadConfigFile(configPath);
  const model = buildModel(config, 0, loadSupernovae(config));
  const h = 1 / QUADRATURE_INTERVALS;
  const logL = Float64Array.from({ length: QUADRATURE_INTERVALS + 1 }, (_, i) => model.posterior.logLikelihood(Float64Array.of(i * h)));
  const peak = Math.max(...logL);
  let mass = 0;
  let first = 0;
  let second = 0;
  for (let i = 0; i <= QUADRATURE_INTERVALS; i++) {
    const simpson = (i === 0 || i === QUADRATURE_INTERVALS ? 1 : i % 2 === 1 ? 4 : 2) * (h / 3);
    const value = simpson * Math.exp(logL[i] - peak);
    mass += value;
    first += value * i * h;
    second += value * (i * h) ** 2;
  }
  const mean = first / mass;
  return { logZ: peak + Math.log(mass), mean, sd: Math.sqrt(second / mass - mean * mean) };
}

let outcome: FitOutcome;
let configPath: string;

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  configPath = writeConfig('lcdm', 7);
  [outcome] = await runFit({ configPath });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('fitNestedModel', () => {
  it('reports ln Z within 3 sigma of direct Simpson quadrature of the likelihood over the uniform omega_m prior', () => {
    const record = JSON.parse(readFileSync(join(outcome.runDir, 'run.json'), 'utf8'));
    const quadrature = quadratureEvidence(configPath);
    // Reference: the same likelihood integrated on a 4001-point Simpson grid (independent of the sampler);
    // tolerance: 3 x the run's own sqrt(H / N) error (Skilling 2006).
    // Measured: ln Z = 75.194 +- 0.111 (seed 7, 200 live points) against 75.307 by quadrature, 1.0 sigma.
    expect(Math.abs(record.evidence.log_z - quadrature.logZ)).toBeLessThan(3 * record.evidence.log_z_error);
    expect(record.evidence.log_z_error).toBeGreaterThan(0);
  });

  it('summarizes the weighted samples: omega_m mean and sd match quadrature and the published Pantheon value', () => {
    const summary = JSON.parse(readFileSync(join(outcome.runDir, 'summary.json'), 'utf8'));
    const quadrature = quadratureEvidence(configPath);
    const omega = summary.parameters.omega_m;
    const ess = summary.convergence.effective_sample_size_kish;
    // Reference: quadrature posterior moments; tolerance 4 Monte Carlo errors sd / sqrt(Kish ESS) for the mean, 15% for the sd.
    expect(Math.abs(omega.mean - quadrature.mean)).toBeLessThan(4 * quadrature.sd / Math.sqrt(ess));
    expect(Math.abs(omega.sd / quadrature.sd - 1)).toBeLessThan(0.15);
    // Scolnic et al. (2018), flat LambdaCDM from the SNe alone: Omega_m = 0.298 +- 0.022 (from memory); tolerance 0.01 and 20%.
    expect(Math.abs(omega.mean - 0.298)).toBeLessThan(0.01);
    expect(Math.abs(omega.sd / 0.022 - 1)).toBeLessThan(0.2);
  });

  it('writes chains.csv with normalized weights, ensemble 0, walker 0 and the sample index as step', () => {
    const chains = readChainsFile(join(outcome.runDir, 'chains.csv'));
    expect(chains.header).toContain('weight');
    expect(chains.weights).not.toBeNull();
    const weights = chains.weights as Float64Array;
    // The weights are normalized posterior weights: they sum to 1 (tolerance: rounding of ~1e3 terms, 1e-12).
    expect(Math.abs(weights.reduce((sum, w) => sum + w, 0) - 1)).toBeLessThan(1e-12);
    expect(weights.every((w) => w >= 0)).toBe(true);
    expect(chains.ensemble.every((e) => e === 0) && chains.walker.every((w) => w === 0) && chains.burnIn.every((b) => b === 0)).toBe(true);
    expect(Array.from(chains.step)).toEqual(Array.from({ length: chains.rows }, (_, k) => k));
    // Blobs are computed per sample: log posterior = log prior + log likelihood (prior density 1 on [0, 1], so ln prior = 0).
    for (let r = 0; r < chains.rows; r += 97) {
      expect(chains.columns.log_prior[r]).toBe(0);
      expect(chains.columns.log_posterior[r]).toBe(chains.columns.log_likelihood[r]);
    }
  });

  it('records the sampler and the evidence in run.json and states in summary.json that chain diagnostics do not apply', () => {
    const record = JSON.parse(readFileSync(join(outcome.runDir, 'run.json'), 'utf8'));
    expect(record.sampler).toMatchObject({ method: 'nested', live_points: LIVE_POINTS, max_unexplored_ln_z: 0.05, stop: 'max_unexplored_ln_z' });
    for (const key of ['log_z', 'log_z_error', 'information_nats', 'iterations', 'likelihood_calls']) expect(Number.isFinite(record.evidence[key]), key).toBe(true);
    expect(record.evidence.likelihood_calls).toBeGreaterThan(record.evidence.iterations);
    const summary = JSON.parse(readFileSync(join(outcome.runDir, 'summary.json'), 'utf8'));
    expect(summary.diagnostics).toEqual({});
    expect(summary.convergence.applies).toBe(false);
    expect(summary.convergence.effective_sample_size_kish).toBeGreaterThan(100);
    expect(summary.evidence.log_z).toBe(record.evidence.log_z);
    const report = readFileSync(join(outcome.runDir, 'report.html'), 'utf8');
    expect(report).toContain('do not apply');
    expect(report).toContain('ln Z (evidence)');
    for (const file of ['summary.md', 'table.tex', 'figures/triangle.svg', 'figures/hubble.svg', 'marginals/omega_m.csv', 'hubble_diagram.csv', 'hubble_model.csv', 'config.resolved.yaml']) {
      expect(existsSync(join(outcome.runDir, file)), file).toBe(true);
    }
    // Traces belong to Markov chains: a nested run draws none even when asked.
    expect(existsSync(join(outcome.runDir, 'figures/trace.svg'))).toBe(false);
  });

  it('rebuilds every output of a nested run byte for byte with report', () => {
    const files = ['summary.json', 'summary.md', 'table.tex', 'report.html', 'figures/triangle.svg', 'figures/hubble.svg', 'marginals/omega_m.csv'];
    const before = files.map((file) => readFileSync(join(outcome.runDir, file)));
    const copy = join(scratch, 'rebuilt');
    buildRunOutputs([outcome.runDir], copy);
    files.forEach((file, k) => expect(readFileSync(join(copy, file)).equals(before[k]), file).toBe(true));
  });

  it('writes byte-identical chains for the same seed', async () => {
    const [again] = await runFit({ configPath: writeConfig('again', 7) });
    expect(readFileSync(join(again.runDir, 'chains.csv')).equals(readFileSync(join(outcome.runDir, 'chains.csv')))).toBe(true);
  });
});
