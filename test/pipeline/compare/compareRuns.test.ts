import { appendFileSync, copyFileSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compareRuns, runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { rebuildRunModel } from '../../../src/pipeline/compare/compareRebuildModel.js';
import { readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { isCandelaError } from '../../../src/errors.js';
import { main } from '../../../src/cli/main.js';

// `candela compare` on two short ensemble runs (flat LambdaCDM and flat wCDM)
// of the Pantheon 2018 binned Hubble diagram (Scolnic et al. 2018, ApJ 859,
// 101; ../shared/data-real/pantheon2018/Binned_data, copied into the scratch
// folder so that one test can edit a copy). The chains are short: these tests
// check the wiring and the formulas, not converged posteriors.
const scratch = resolve('.candela-tmp/compare-runs');
const source = resolve('../shared/data-real/pantheon2018/Binned_data');
let outcomes: FitOutcome[];
let document: ReturnType<typeof compareRuns>['document'];
const outDir = join(scratch, 'comparison');

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  for (const file of ['lcparam_DS17f.txt', 'sys_DS17f.txt']) copyFileSync(join(source, file), join(scratch, file));
  const path = join(scratch, 'two-models.yaml');
  writeFileSync(path, `title: "compare test"
seed: 3
supernovae:
  - label: bins
    kind: magnitudes
    table: { file: lcparam_DS17f.txt, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
    covariances:
      - { file: sys_DS17f.txt, applies_to: magnitudes }
standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }
parameters:
  w0: { prior: uniform, min: -2.5, max: -0.3 }
sampler: { walkers: 8, ensembles: 2, max_steps: 200, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }
output: { dir: ${join(scratch, 'fits')}, figures: [triangle], png: true }
`);
  outcomes = await runFit({ configPath: path });
  document = compareRuns({ runDirs: outcomes.map((o) => o.runDir), outDir }).document;
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('compareRuns', () => {
  it('writes comparison.json, comparison.md and comparison.tex and the dark-energy figures as SVG and PNG', () => {
    for (const file of ['comparison.json', 'comparison.md', 'comparison.tex', 'posteriors_triangle.svg', 'posteriors_triangle.png', 'w_of_z_flat_wcdm.svg', 'w_of_z_flat_wcdm.png', 'distance_modulus_difference.svg', 'distance_modulus_difference.png']) {
      expect(existsSync(join(outDir, file)), file).toBe(true);
    }
    expect(JSON.parse(readFileSync(join(outDir, 'comparison.json'), 'utf8'))).toEqual(JSON.parse(JSON.stringify(document)));
    const markdown = readFileSync(join(outDir, 'comparison.md'), 'utf8');
    expect(markdown).toContain('flat_wcdm over flat_lcdm');
    expect(markdown).toContain('ignores the priors');
    expect(readFileSync(join(outDir, 'comparison.tex'), 'utf8')).toContain('\\begin{tabular}');
    // The w(z) figure marks w = -1; the distance figure has one band per model and the binned data.
    expect(readFileSync(join(outDir, 'w_of_z_flat_wcdm.svg'), 'utf8')).toContain('w = -1');
    const distance = readFileSync(join(outDir, 'distance_modulus_difference.svg'), 'utf8');
    expect(distance.match(/class="band band-68"/g)?.length).toBe(2);
    expect(distance).toContain('class="points"');
  });

  it('gives each model N, k, chi-square, AIC, BIC and a finite DIC built from the run files', () => {
    expect(document.base).toBe('flat_lcdm');
    const [lcdm, wcdm] = document.models;
    expect([lcdm.n_data, lcdm.k_free, wcdm.n_data, wcdm.k_free]).toEqual([40, 1, 40, 2]);
    for (const model of document.models) {
      const record = JSON.parse(readFileSync(join(model.run_dir, 'run.json'), 'utf8'));
      const minusTwoLogL = -2 * record.best_fit.log_likelihood;
      // AIC = -2 ln L_max + 2k (Akaike 1974); BIC = -2 ln L_max + k ln N (Schwarz 1978); tolerance: rounding, 1e-9.
      expect(model.aic).toBeCloseTo(minusTwoLogL + 2 * model.k_free, 9);
      expect(model.bic).toBeCloseTo(minusTwoLogL + model.k_free * Math.log(40), 9);
      expect(model.chi_square_best_fit).toBe(record.best_fit.chi_square);
      // DIC = 2 mean(D) - D(mean theta) with D = -2 ln L (Spiegelhalter et al. 2002), recomputed here from every step
      // after the burn-in (the run folder's chains as the summaries read them: chains.csv keeps only thinned steps by
      // default, the chain record every step) and the likelihood rebuilt from the run folder; tolerance 1e-9 relative.
      const chains = readRunFolder(model.run_dir).chains;
      const kept = Array.from({ length: chains.rows }, (_, r) => r).filter((r) => chains.burnIn[r] === 0);
      const meanDeviance = kept.reduce((sum, r) => sum - 2 * chains.columns.log_likelihood[r], 0) / kept.length;
      const rebuilt = rebuildRunModel(readRunFolder(model.run_dir));
      const mean = Float64Array.from(rebuilt.model.parameterNames, (name) => kept.reduce((sum, r) => sum + chains.columns[name][r], 0) / kept.length);
      const dic = 2 * meanDeviance + 2 * rebuilt.model.posterior.logLikelihood(mean);
      expect(Number.isFinite(model.dic)).toBe(true);
      expect(Math.abs((model.dic as number) - dic)).toBeLessThan(1e-9 * Math.abs(dic));
      expect(rebuilt.changedInputs).toEqual([]);
    }
    expect(wcdm.delta_aic).toBeCloseTo(wcdm.aic - lcdm.aic, 12);
  });

  it('detects flat_wcdm as flat_lcdm extended by w0 (fixed at -1) with a Savage-Dickey ratio and the delta chi-square caution', () => {
    expect(document.nested_pairs).toHaveLength(1);
    const pair = document.nested_pairs[0];
    expect(pair).toMatchObject({ base: 'flat_lcdm', extended: 'flat_wcdm', fixed_in_base: { w0: -1 }, extra_parameters: 1 });
    expect('log_bayes_factor_01' in pair.savage_dickey).toBe(true);
    if ('log_bayes_factor_01' in pair.savage_dickey) {
      // The prior density of w0 at -1 is 1 / (-0.3 - -2.5) (uniform prior; Dickey 1971 ratio denominator).
      expect(pair.savage_dickey.prior_density).toBeCloseTo(1 / 2.2, 12);
      expect(Number.isFinite(pair.savage_dickey.log_bayes_factor_01)).toBe(true);
    }
    // Ensemble runs carry no evidence: ln B against the base comes from the Savage-Dickey ratio (ln B = -ln B01).
    expect(document.models[1].bayes_factor_source).toBe('savage-dickey');
    expect(pair.evidence_log_bayes_factor_01).toBeNull();
    expect(document.notes.some((note) => /ignores the priors/.test(note))).toBe(true);
    expect(pair.p_value).toBeGreaterThan(0);
  });

  it('rejects a base label that no run has', () => {
    let code = 'none';
    try { compareRuns({ runDirs: outcomes.map((o) => o.runDir), baseLabel: 'flat_w0wa', outDir: join(scratch, 'bad') }); } catch (error) { code = isCandelaError(error) ? error.issues[0].code : 'other'; }
    expect(code).toBe('compare.unknown_model');
  });

  it('runs as `candela compare` and says when an input file changed since the fit', async () => {
    appendFileSync(join(scratch, 'lcparam_DS17f.txt'), '# edited after the fit\n');
    const cliOut = join(scratch, 'cli');
    const code = await main(['compare', ...outcomes.map((o) => o.runDir), '--base', 'flat_wcdm', '--out', cliOut]);
    expect(code).toBe(0);
    const written = JSON.parse(readFileSync(join(cliOut, 'comparison.json'), 'utf8'));
    expect(written.base).toBe('flat_wcdm');
    expect(written.changed_inputs.map((change: { path: string }) => change.path.endsWith('lcparam_DS17f.txt'))).toEqual([true, true]);
    expect(written.warnings.some((warning: string) => /changed since the fit/.test(warning))).toBe(true);
  });
});
