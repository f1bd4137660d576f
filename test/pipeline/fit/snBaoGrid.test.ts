import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../../src/config/index.js';
import { buildModel } from '../../../src/pipeline/run/buildModel.js';
import { loadSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

// Pantheon 2018 binned (Scolnic et al. 2018) + DESI DR2 BAO (DESI Collaboration 2025), flat wCDM:
// candela's sampled posterior against a brute-force grid integration of the same posterior written here
// (flat priors on omega_m, w0, h_ruler; the offset marginalized analytically by the supernova term).
const scratch = resolve('.candela-tmp/sn-bao-grid');
const DESI = resolve('../shared/data-real/desi-dr2-bao');
const PRIORS = { omega_m: [0.15, 0.45], w0: [-1.6, -0.5], h_ruler: [94, 110] } as const;

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('supernovae + BAO in flat wCDM', () => {
  it('samples the posterior that a brute-force grid integration gives (means within 4 Monte Carlo errors + grid error, widths within 10%)', async () => {
    const config = join(scratch, 'sn-bao.yaml');
    writeFileSync(config, pantheonBinnedConfig({
      seed: 21,
      models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
      parameters: Object.entries(PRIORS).map(([name, [min, max]]) => `  ${name}: { prior: uniform, min: ${min}, max: ${max} }`).join('\n'),
      sampler: '{ walkers: 16, ensembles: 4, target_ess: 1500, max_steps: 20000, check_every: 500, workers: 1 }',
      output: `{ dir: ${join(scratch, 'run')}, figures: [], png: false }`,
    }).replace('models:', `probes:\n  bao: { table: ${DESI}/measurements.csv, covariance: ${DESI}/covariance.txt, ruler: free }\nmodels:`));
    const { code, stderr } = await runCommandLine(['fit', config, '--quiet']);
    expect(code, stderr).toBe(0);
    const summary = JSON.parse(readFileSync(join(scratch, 'run', 'summary.json'), 'utf8'));

    // The grid: the same posterior, evaluated point by point through the model candela built.
    const loaded = loadConfigFile(config);
    const model = buildModel(loaded, 0, loadSupernovae(loaded));
    const order = model.posterior.names;
    const steps = [56, 56, 40];
    const axes = order.map((name, d) => {
      const [low, high] = PRIORS[name as keyof typeof PRIORS];
      return Array.from({ length: steps[d] }, (_, i) => low + ((high - low) * (i + 0.5)) / steps[d]); // cell centres
    });
    const logs: number[] = [];
    const points: number[][] = [];
    const theta = new Float64Array(3);
    for (const a of axes[0]) for (const b of axes[1]) for (const c of axes[2]) {
      theta.set([a, b, c]);
      logs.push(model.posterior.logPosterior(theta));
      points.push([a, b, c]);
    }
    const top = Math.max(...logs);
    const weights = logs.map((value) => Math.exp(value - top));
    const total = weights.reduce((sum, w) => sum + w, 0);
    order.forEach((name, d) => {
      const mean = points.reduce((sum, point, k) => sum + weights[k] * point[d], 0) / total;
      const sd = Math.sqrt(points.reduce((sum, point, k) => sum + weights[k] * (point[d] - mean) ** 2, 0) / total);
      const sampled = summary.parameters[name];
      const cell = (PRIORS[name as keyof typeof PRIORS][1] - PRIORS[name as keyof typeof PRIORS][0]) / steps[d];
      // Midpoint-rule error of a smooth posterior's mean and sd: well below a cell width (common practice); Monte Carlo: mcse.
      expect(Math.abs(sampled.mean - mean), name).toBeLessThan(4 * summary.diagnostics[name].mcse_mean + 0.25 * cell);
      expect(Math.abs(sampled.sd / sd - 1), name).toBeLessThan(0.1);
    });
  });
});
