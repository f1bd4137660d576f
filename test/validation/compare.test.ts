import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { compareRuns, runFit } from '../../src/pipeline/index.js';
import { loadConfigFile } from '../../src/config/index.js';
import { buildModel } from '../../src/pipeline/run/buildModel.js';
import { pantheonBinnedConfig } from '../support/pantheonBinnedConfig.js';
import { loadSupernovae } from '../../src/pipeline/run/loadSupernovae.js';

// The Savage-Dickey density ratio (Dickey 1971; Trotta 2007, MNRAS 378, 72) equals the Bayes
// factor of nested models when the extended model's other priors match the base's: so on
// a mock survey drawn with w = -1, ln B01 of flat LambdaCDM over flat wCDM from the wCDM
// posterior density at w0 = -1 must agree with ln Z(LambdaCDM) - ln Z(wCDM) from two
// nested-sampling runs, within their combined uncertainty. (The mock is invented for the
// test; the identity, not the mock, is the reference.) The slow part (CANDELA_VALIDATE)
// repeats this over many mocks and checks the nested-sampling ln Z of the Pantheon 2018
// binned data (Scolnic et al. 2018) against quadrature over many seeds. Set
// CANDELA_VERBOSE=1 to print the measured numbers.
const scratch = resolve('.candela-tmp/compare-savage-dickey');

/** A hand-built magnitudes table: flat LambdaCDM (Omega_m 0.3, H0 70), M = -19.3, Gaussian errors. */
function writeMockTable(path: string, options: { count: number; sigmaMag: number; seed: string }): void {
  const random = createRandomStream(options.seed);
  const z = Float64Array.from({ length: options.count }, () => 0.02 + 1.08 * random.uniform()).sort();
  const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }, { maxRedshift: 1.2 });
  if (!outcome.ok) throw new Error(outcome.reason);
  const mu = outcome.cosmology.distanceModuliMag(z);
  const lines = ['# name zcmb zhel mb dmb'];
  z.forEach((redshift, i) => lines.push(`sn${i} ${redshift} ${redshift} ${mu[i] - 19.3 + options.sigmaMag * random.normal()} ${options.sigmaMag}`));
  writeFileSync(path, `${lines.join('\n')}\n`);
}

/** A two-model nested-sampling configuration for that table. */
function writeMockConfig(folder: string, options: { seed: number; livePoints: number }): string {
  const path = join(folder, 'mock.yaml');
  writeFileSync(path, `title: "Savage-Dickey check"
seed: ${options.seed}
supernovae:
  - label: mock
    kind: magnitudes
    table: { file: mock.txt, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }
parameters:
  omega_m: { prior: uniform, min: 0, max: 1 }
  w0: { prior: uniform, min: -2, max: 0 }
sampler: { method: nested, nested: { live_points: ${options.livePoints}, max_unexplored_ln_z: 0.05 } }
output: { dir: ${join(folder, 'fits')}, figures: [triangle], png: false }
`);
  return path;
}

/** ln B01 two ways and their difference in units of the combined error. */
async function savageDickeyAgainstEvidence(folder: string, options: { count: number; sigmaMag: number; seed: number; livePoints: number }) {
  mkdirSync(folder, { recursive: true });
  writeMockTable(join(folder, 'mock.txt'), { count: options.count, sigmaMag: options.sigmaMag, seed: `mock-${options.seed}` });
  const outcomes = await runFit({ configPath: writeMockConfig(folder, options), force: true });
  const { document } = compareRuns({ runDirs: outcomes.map((o) => o.runDir), outDir: join(folder, 'comparison') });
  const pair = document.nested_pairs[0];
  if (!('log_bayes_factor_01' in pair.savage_dickey) || !pair.evidence_log_bayes_factor_01) throw new Error('missing estimate');
  const savageDickey = pair.savage_dickey;
  const evidence = pair.evidence_log_bayes_factor_01;
  return { savageDickey: savageDickey.log_bayes_factor_01, savageDickeyError: savageDickey.error, evidence: evidence.value, evidenceError: evidence.error, pull: (savageDickey.log_bayes_factor_01 - evidence.value) / Math.hypot(savageDickey.error, evidence.error) };
}

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('compareRuns on nested-sampling runs of a w = -1 mock, fast subset', () => {
  it('gives a Savage-Dickey ln B01 that agrees with the evidence ratio within 3 combined sigma', async () => {
    const result = await savageDickeyAgainstEvidence(join(scratch, 'fast'), { count: 60, sigmaMag: 0.15, seed: 1, livePoints: 400 });
    if (process.env.CANDELA_VERBOSE) console.log(result);
    // Measured: Savage-Dickey 0.387 +- 0.052, evidences 0.405 +- 0.095 (pull -0.16).
    // Tolerance: 3 x hypot(bootstrap error of the density ratio, sqrt(H/N) errors of the two ln Z) (Skilling 2006).
    expect(Math.abs(result.pull)).toBeLessThan(3);
    // The data were drawn with w = -1, so the simpler model should not be disfavoured (Occam factor of the w0 prior).
    expect(result.evidence).toBeGreaterThan(0);
  });
});

/** Mean and sample standard deviation. */
function moments(values: number[]): { mean: number; spread: number } {
  const mean = values.reduce((sum, v) => sum + v, 0) / values.length;
  return { mean, spread: Math.sqrt(values.reduce((sum, v) => sum + (v - mean) ** 2, 0) / (values.length - 1)) };
}

describe.skipIf(!process.env.CANDELA_VALIDATE)('Savage-Dickey against evidences and ln Z against quadrature (CANDELA_VALIDATE)', () => {
  it('Savage-Dickey and evidence ln B01 agree over 12 mocks of 200 supernovae: pulls of mean 0 (within 3 / sqrt(12)) and spread below 1.5', async () => {
    const pulls: number[] = [];
    for (let seed = 1; seed <= 12; seed++) {
      const result = await savageDickeyAgainstEvidence(join(scratch, `mock-${seed}`), { count: 200, sigmaMag: 0.15, seed: 100 + seed, livePoints: 500 });
      if (process.env.CANDELA_VERBOSE) console.log(seed, result);
      pulls.push(result.pull);
      rmSync(join(scratch, `mock-${seed}`), { recursive: true, force: true });
    }
    const { mean, spread } = moments(pulls);
    if (process.env.CANDELA_VERBOSE) console.log('Savage-Dickey pulls', { mean, spread });
    expect(Math.abs(mean)).toBeLessThan(3 / Math.sqrt(pulls.length));
    expect(spread).toBeLessThan(1.5);
  }, 900_000);

  it('nested ln Z of the Pantheon 2018 binned flat LambdaCDM fit has pulls against quadrature of mean 0 (within 3 / sqrt(20)) and spread 0.5 to 1.5 over 20 seeds', async () => {
    const pulls: number[] = [];
    let quadrature = Number.NaN;
    for (let seed = 1; seed <= 20; seed++) {
      const folder = join(scratch, `pantheon-${seed}`);
      mkdirSync(folder, { recursive: true });
      const path = join(folder, 'pantheon.yaml');
      writeFileSync(path, pantheonBinnedConfig({
        seed,
        models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
        parameters: '  omega_m: { prior: uniform, min: 0, max: 1 }',
        sampler: '{ method: nested, nested: { live_points: 200, max_unexplored_ln_z: 0.05 } }',
        output: `{ dir: ${join(folder, 'fit')}, figures: [], png: false }`,
      }));
      if (Number.isNaN(quadrature)) {
        // Composite Simpson over omega_m in [0, 1] with 4000 intervals, prior density 1 (as in test/pipeline/fit/nestedFit.test.ts).
        const config = loadConfigFile(path);
        const model = buildModel(config, 0, loadSupernovae(config));
        const intervals = 4000;
        const logL = Array.from({ length: intervals + 1 }, (_, i) => model.posterior.logLikelihood(Float64Array.of(i / intervals)));
        const peak = Math.max(...logL);
        const mass = logL.reduce((sum, value, i) => sum + (i === 0 || i === intervals ? 1 : i % 2 === 1 ? 4 : 2) / (3 * intervals) * Math.exp(value - peak), 0);
        quadrature = peak + Math.log(mass);
      }
      const [outcome] = await runFit({ configPath: path });
      const evidence = (outcome.record as unknown as { evidence: { log_z: number; log_z_error: number } }).evidence;
      pulls.push((evidence.log_z - quadrature) / evidence.log_z_error);
      rmSync(folder, { recursive: true, force: true });
    }
    const { mean, spread } = moments(pulls);
    if (process.env.CANDELA_VERBOSE) console.log('ln Z pulls against quadrature', { quadrature, mean, spread, pulls });
    expect(Math.abs(mean)).toBeLessThan(3 / Math.sqrt(pulls.length));
    expect(spread).toBeGreaterThan(0.5);
    expect(spread).toBeLessThan(1.5);
  }, 900_000);
});
