// End to end: a blinded fit hides the true values in every file it writes and on the terminal, keeps the
// diagnostics, stays blinded under `candela report`, and `unblindRun` then reproduces an unblinded fit of the
// same configuration and seed byte for byte. Data: the Pantheon 2018 binned Hubble diagram
// (../shared/data-real/pantheon2018, Scolnic et al. 2018), short chains (run control, not the posterior).
import { cpSync, existsSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync, mkdirSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildRunOutputs, runFit, terminalRunReport, unblindRun } from '../../../src/pipeline/index.js';
import { isCandelaError } from '../../../src/errors.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

const scratch = resolve('.candela-tmp/blinding-unblind');
const configPath = join(scratch, 'run.yaml');
const plainDir = join(scratch, 'plain');
const blindDir = join(scratch, 'blind');
const keptBlindDir = join(scratch, 'blind-copy');
const BLINDED = ['omega_m', 'w0'];

function configText(blinded: boolean): string {
  return pantheonBinnedConfig({
    title: 'blinding test', seed: 23,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 300, check_every: 100, checkpoint_every: 100, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'unused')}, figures: [triangle, hubble, residuals, trace, autocorrelation], png: true }`,
  }) + (blinded ? 'blinding: { parameters: [w0, omega_m, h0] }\n' : '');
}

/** Every file below a folder, relative paths, sorted. */
function filesOf(dir: string): string[] {
  const walk = (folder: string): string[] => readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    return statSync(path).isDirectory() ? walk(path) : [relative(dir, path)];
  });
  return walk(dir).sort();
}
const isBinary = (file: string) => /\.(bin|png|pdf)$/.test(file);
/** Text with the typographic minus sign made ASCII (tables print U+2212). */
const plainText = (text: string) => text.replaceAll('\u2212', '-');

let terminal = '';
const blindedTexts = new Map<string, string>();

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  writeFileSync(configPath, configText(false));
  await runFit({ configPath, outDir: plainDir });
  writeFileSync(configPath, configText(true)); // the same file: only the blinding block differs
  const lines: string[] = [];
  await runFit({ configPath, outDir: blindDir, onLine: (line) => lines.push(line), blindingSalt: '0a1b2c3d' });
  terminal = plainText([...lines, terminalRunReport(blindDir)].join('\n'));
  for (const file of filesOf(blindDir)) if (!isBinary(file)) blindedTexts.set(file, readFileSync(join(blindDir, file), 'utf8'));
  cpSync(blindDir, keptBlindDir, { recursive: true });
}, 120_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** The ways the outputs print a parameter's mean: full precision (JSON), "mean ± sd" (Markdown, HTML, terminal), LaTeX. */
function meanTexts(dir: string, name: string): string[] {
  const summary = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8')) as { parameters: Record<string, { mean: number }> };
  const row = plainText(readFileSync(join(dir, 'summary.md'), 'utf8')).split('\n').find((line) => line.includes(`\`${name}\``))!;
  const meanSd = row.split('|')[2].trim(); // e.g. "0.31 ± 0.08"
  const [mean, sd] = meanSd.split(' ± ');
  return [String(summary.parameters[name].mean), meanSd, `${mean} \\pm ${sd}`];
}

describe('a blinded fit', () => {
  it('writes the true mean of no blinded parameter into any file or onto the terminal', () => {
    const texts = [...blindedTexts.entries(), ['terminal', terminal] as const];
    for (const name of BLINDED) {
      const truth = meanTexts(plainDir, name);
      // Control: the unblinded run's outputs do print these texts, so their absence below means something.
      expect(plainText(readFileSync(join(plainDir, 'summary.md'), 'utf8'))).toContain(truth[1]);
      expect(readFileSync(join(plainDir, 'summary.json'), 'utf8')).toContain(truth[0]);
      expect(readFileSync(join(plainDir, 'table.tex'), 'utf8')).toContain(truth[2]);
      for (const [file, text] of texts) for (const shown of truth) expect(plainText(text).includes(shown), `${file} holds ${shown} (${name})`).toBe(false);
    }
    // Only the sampler state, the chain record and the PNG renderings are binary.
    expect(filesOf(blindDir).filter(isBinary).filter((file) => !file.endsWith('.png'))).toEqual(['chain-record.bin', 'checkpoint.bin']);
  });

  it('says BLINDED on every page: terminal, summary.md, summary.json, table.tex, report.html and each figure', () => {
    expect(terminal).toContain('== BLINDED: omega_m, w0 are shown as true value + a secret offset');
    expect(terminal).toContain('blinding: h0 is not sampled by model flat_wcdm: not blinded');
    expect(blindedTexts.get('summary.md')!.startsWith('> BLINDED: omega_m, w0')).toBe(true);
    expect(JSON.parse(blindedTexts.get('summary.json')!).blinding).toMatchObject({ state: 'blinded', parameters: BLINDED });
    expect(blindedTexts.get('table.tex')).toMatch(/^% BLINDED/);
    expect(blindedTexts.get('table.tex')).toContain('\\textbf{BLINDED}: omega\\_m, w0 shown as true value + a secret offset');
    expect(blindedTexts.get('report.html')).toContain('(BLINDED)');
    const figures = [...blindedTexts.keys()].filter((file) => file.endsWith('.svg'));
    expect(figures.length).toBeGreaterThanOrEqual(4);
    for (const file of figures) expect(blindedTexts.get(file), file).toContain('class="blinding-stamp"');
  });

  it('withholds what would show the truth: derived quantities, the model curve, mu_obs and mu_model', () => {
    expect(blindedTexts.get('chains.csv')!.split('\n', 1)[0]).toBe('ensemble,walker,step,omega_m,w0,log_prior,log_likelihood,log_posterior,burn_in');
    expect(existsSync(join(blindDir, 'hubble_model.csv'))).toBe(false);
    expect(existsSync(join(blindDir, 'figures', 'hubble.svg'))).toBe(false);
    expect(existsSync(join(blindDir, 'figures', 'residuals.svg'))).toBe(true);
    const diagram = blindedTexts.get('hubble_diagram.csv')!.split('\n');
    expect(diagram[0]).toBe('id,sample,z,mu_obs,sigma_mu,mu_model,residual,calibrator');
    expect(diagram[1].split(',')[3]).toBe('');
    expect(diagram[1].split(',')[5]).toBe('');
    // The residuals are those of the unblinded run (about the true best fit).
    expect(diagram[1].split(',')[6]).toBe(readFileSync(join(plainDir, 'hubble_diagram.csv'), 'utf8').split('\n')[1].split(',')[6]);
  });

  it('keeps widths and diagnostics: sd, R-hat, ESS and tau equal those of the unblinded run; means move by less than the widths', () => {
    const plain = JSON.parse(readFileSync(join(plainDir, 'summary.json'), 'utf8'));
    const blind = JSON.parse(blindedTexts.get('summary.json')!);
    const widths: Record<string, number> = { omega_m: 0.1, w0: 0.3 };
    for (const name of BLINDED) {
      // A shift leaves the variance unchanged (translation invariance); the rank-based diagnostics see the same order.
      expect(blind.parameters[name].sd).toBeCloseTo(plain.parameters[name].sd, 12);
      expect(blind.diagnostics[name].rhat).toBeCloseTo(plain.diagnostics[name].rhat, 12);
      expect(blind.diagnostics[name].ess_bulk).toBeCloseTo(plain.diagnostics[name].ess_bulk, 9);
      expect(blind.diagnostics[name].tau).toBeCloseTo(plain.diagnostics[name].tau, 9);
      const shift = Math.abs(blind.parameters[name].mean - plain.parameters[name].mean);
      expect(shift).toBeGreaterThanOrEqual(0.25 * widths[name] - 1e-12);
      expect(shift).toBeLessThanOrEqual(widths[name] + 1e-12);
    }
    expect(blind.fit.chi_square).toBe(plain.fit.chi_square);
  });

  it('stays blinded when `candela report` rebuilds its outputs', () => {
    buildRunOutputs([blindDir], blindDir);
    for (const file of ['summary.md', 'summary.json', 'table.tex', 'figures/triangle.svg']) {
      expect(readFileSync(join(blindDir, file), 'utf8') === blindedTexts.get(file), file).toBe(true);
    }
  });

  it('cannot be shown without its key', () => {
    rmSync(join(keptBlindDir, 'blinding.key'));
    const codes = (action: () => unknown): string[] => {
      try {
        action();
      } catch (error) {
        if (isCandelaError(error)) return error.issues.map((issue) => issue.code);
        throw error;
      }
      return [];
    };
    expect(codes(() => buildRunOutputs([keptBlindDir], keptBlindDir))).toEqual(['blinding.missing_key']);
    expect(codes(() => unblindRun(keptBlindDir))).toEqual(['blinding.missing_key']);
  });
});

describe('unblindRun', () => {
  it('rewrites the folder into the outputs of the unblinded fit, byte for byte, except the blinding record and the wall time', () => {
    const outcome = unblindRun(blindDir, new Date('2026-12-04T12:00:00Z'));
    expect(outcome.parameters).toEqual(BLINDED);
    const unblinded = JSON.parse(readFileSync(join(blindDir, 'run.json'), 'utf8'));
    expect(unblinded.blinding).toMatchObject({ state: 'unblinded', unblinded_at: '2026-12-04T12:00:00.000Z', parameters: BLINDED });
    expect(Object.keys(unblinded.blinding.offsets)).toEqual(BLINDED);
    // What differs between any two runs (wall time) and between the two configuration files (the blinding
    // block changes the file's SHA-256) is copied into the unblinded run's record, whose outputs are then
    // rebuilt by `candela report` (which reproduces a fit's outputs byte for byte, test/pipeline/fit/fitRun.test.ts).
    const plainRecord = JSON.parse(readFileSync(join(plainDir, 'run.json'), 'utf8'));
    plainRecord.run.wall_seconds = unblinded.run.wall_seconds;
    plainRecord.inputs = unblinded.inputs;
    writeFileSync(join(plainDir, 'run.json'), `${JSON.stringify(plainRecord, null, 2)}\n`);
    buildRunOutputs([plainDir], plainDir);
    const { blinding, ...withoutBlinding } = unblinded;
    expect(blinding.state).toBe('unblinded');
    expect(`${JSON.stringify(withoutBlinding, null, 2)}\n`).toBe(readFileSync(join(plainDir, 'run.json'), 'utf8'));
    expect(filesOf(blindDir)).toEqual(filesOf(plainDir));
    // checkpoint.bin stores the wall time of the session; everything else byte for byte.
    for (const file of filesOf(plainDir).filter((name) => name !== 'run.json' && name !== 'checkpoint.bin')) {
      expect(readFileSync(join(blindDir, file)).equals(readFileSync(join(plainDir, file))), file).toBe(true);
    }
  });

  it('refuses a run that is not blinded, or already unblinded, naming run.json', () => {
    for (const [dir, code] of [[plainDir, 'blinding.not_blinded'], [blindDir, 'blinding.already_unblinded']] as const) {
      try {
        unblindRun(dir);
        expect.unreachable('unblindRun should throw');
      } catch (error) {
        expect(isCandelaError(error) && error.issues[0].code).toBe(code);
        if (isCandelaError(error)) expect(error.issues[0].file).toBe(join(dir, 'run.json'));
      }
    }
  });
});
