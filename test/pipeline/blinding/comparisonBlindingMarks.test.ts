// `candela compare` with blinded runs: the files say BLINDED, withhold what would be meaningless or show the
// truth (Savage-Dickey of a blinded extra parameter, DIC, dark-energy figures), keep chi-square, AIC and BIC,
// and print no true mean. Data: the Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018,
// Scolnic et al. 2018); short chains (wiring, not converged posteriors).
import { mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compareRuns, runFit } from '../../../src/pipeline/index.js';
import { comparisonBlindingMarks } from '../../../src/pipeline/blinding/comparisonBlindingMarks.js';
import { writeFinalModelsIndex } from '../../../src/pipeline/fit/finalModelsIndex.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

const scratch = resolve('.candela-tmp/blinding-compare');
const configPath = join(scratch, 'two.yaml');

function configText(blinded: boolean): string {
  return pantheonBinnedConfig({
    title: 'blinded compare', seed: 9,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }\n  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 240, check_every: 80, checkpoint_every: 80, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'unused')}, figures: [triangle], png: false }`,
  }) + (blinded ? 'blinding: { parameters: [w0, omega_m] }\n' : '');
}

type Comparison = ReturnType<typeof compareRuns>;
let plain: Comparison;
let blind: Comparison;

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  writeFileSync(configPath, configText(false));
  await runFit({ configPath, outDir: join(scratch, 'plain') });
  writeFileSync(configPath, configText(true));
  await runFit({ configPath, outDir: join(scratch, 'blind') }); // a random salt, shared by the two models
  const dirs = (folder: string) => ['flat_lcdm', 'flat_wcdm'].map((label) => join(scratch, folder, label));
  plain = compareRuns({ runDirs: dirs('plain'), outDir: join(scratch, 'plain-comparison') });
  blind = compareRuns({ runDirs: dirs('blind'), outDir: join(scratch, 'blind-comparison') });
}, 180_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('compareRuns with blinded runs', () => {
  it('says BLINDED at the top of comparison.md and .tex and in comparison.json', () => {
    const markdown = readFileSync(join(scratch, 'blind-comparison', 'comparison.md'), 'utf8');
    expect(markdown.startsWith('> BLINDED: flat_lcdm (omega_m); flat_wcdm (omega_m, w0) shown as true value + a secret offset')).toBe(true);
    expect(readFileSync(join(scratch, 'blind-comparison', 'comparison.tex'), 'utf8').startsWith('% BLINDED')).toBe(true);
    expect((blind.document as { blinding?: { runs: unknown } }).blinding?.runs).toEqual([
      { model: 'flat_lcdm', parameters: ['omega_m'] }, { model: 'flat_wcdm', parameters: ['omega_m', 'w0'] },
    ]);
    expect(JSON.stringify(plain.document)).not.toContain('BLINDED');
    expect(blind.warnings[0]).toMatch(/^BLINDED: flat_lcdm \(omega_m\); flat_wcdm \(omega_m, w0\)/);
    // The models index beside the two run folders (written by the fit) says so in its title.
    expect(readFileSync(join(scratch, 'blind', 'index.html'), 'utf8')).toContain('blinded compare (BLINDED)');
    expect(readFileSync(join(scratch, 'plain', 'index.html'), 'utf8')).not.toContain('BLINDED');
    // The models table too, as table.tex: a first comment line and a last row naming the blinded parameters.
    const modelsTex = readFileSync(join(scratch, 'blind', 'models.tex'), 'utf8');
    expect(modelsTex.startsWith('% BLINDED')).toBe(true);
    expect(modelsTex).toMatch(/\\textbf\{BLINDED\}: omega\\_m, w0 shown as true value \+ a secret offset/);
    expect(readFileSync(join(scratch, 'plain', 'models.tex'), 'utf8')).not.toContain('BLINDED');
    // The page written once after models fitted side by side carries the same marks.
    const again = join(scratch, 'blind-final');
    mkdirSync(again, { recursive: true });
    expect(writeFinalModelsIndex(['flat_lcdm', 'flat_wcdm'].map((label) => join(scratch, 'blind', label)), again)).toBe(2);
    expect(readFileSync(join(again, 'index.html'), 'utf8')).toContain('blinded compare (BLINDED)');
    expect(readFileSync(join(again, 'models.tex'), 'utf8').startsWith('% BLINDED')).toBe(true);
  });

  it('withholds the Savage-Dickey ratio, the DIC and the dark-energy figures, with the reason', () => {
    const text = JSON.stringify(blind.document);
    expect(text).toContain('withheld while flat_wcdm is blinded: the density of the shifted w0 at the nested value is not the Savage-Dickey ratio');
    expect(text).toContain('withheld while the run is blinded (omega_m, w0): the DIC needs the likelihood at the true posterior mean');
    expect(blind.warnings.some((warning) => warning.startsWith('figure not drawn: flat_lcdm, flat_wcdm are blinded'))).toBe(true);
    expect(readdirSync(join(scratch, 'blind-comparison')).sort()).toEqual(['comparison.json', 'comparison.md', 'comparison.tex']);
    // Control: the unblinded comparison does compute them.
    expect(JSON.stringify(plain.document)).toContain('log_bayes_factor_01');
  });

  it('keeps the numbers that do not depend on the offsets (chi-square, AIC, BIC) and prints no true mean', () => {
    const models = (document: Comparison['document']) => (document as unknown as { models: Array<Record<string, unknown>> }).models;
    for (const [k, model] of models(blind.document).entries()) {
      for (const key of ['chi_square', 'aic', 'bic']) expect(model[key], key).toBe(models(plain.document)[k][key]);
    }
    // One offset per parameter for every model of the configuration: omega_m moves by the same amount in both.
    const shift = (k: number) => (models(blind.document)[k].posterior_mean as Record<string, number>).omega_m - (models(plain.document)[k].posterior_mean as Record<string, number>).omega_m;
    expect(shift(0)).toBeCloseTo(shift(1), 12);
    expect(Math.abs(shift(0))).toBeGreaterThanOrEqual(0.025);
    const shown = ['comparison.md', 'comparison.tex', 'comparison.json'].map((file) => readFileSync(join(scratch, 'blind-comparison', file), 'utf8')).join('\n');
    for (const [k, model] of models(plain.document).entries()) {
      for (const [name, mean] of Object.entries(model.posterior_mean as Record<string, number>)) {
        const isBlinded = name === 'omega_m' || (name === 'w0' && k === 1);
        if (isBlinded) expect(shown.includes(String(mean)), `${name} of model ${k}`).toBe(false);
      }
    }
  });
});

describe('comparisonBlindingMarks', () => {
  it('changes nothing when no run is blinded', () => {
    const marks = comparisonBlindingMarks([{ model: { label: 'a' } }, { model: { label: 'b' }, blinding: { state: 'unblinded', parameters: ['w0'], offset_widths: {}, key_file: 'blinding.key', withheld: [], unblinded_at: 'then' } }]);
    expect(marks.notice).toBeNull();
    expect(marks.markdown('x')).toBe('x');
    expect(marks.latex('y')).toBe('y');
    const document = { a: 1 };
    expect(marks.document(document)).toBe(document);
  });
});
