import { readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compareRuns, runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { storedConfiguration } from '../../../src/pipeline/run/storedConfiguration.js';
import { isCandelaError } from '../../../src/errors.js';
import { writePantheonProject } from '../../support/pantheonProject.js';

// `candela compare` on a run fitted with systematic modes from a configuration
// given by a relative path, so that every stored path is relative to the folder
// the fit ran in. Data: the Pantheon 2018 binned Hubble diagram (Scolnic et
// al. 2018, ApJ 859, 101; ../shared/data-real/pantheon2018/Binned_data). The
// single mode, a 0.01 mag grey shift of every bin, is a wiring device, not a
// published systematic. Short chains: the test checks paths and the DIC's
// presence, not a converged posterior.
const scratch = resolve('.candela-tmp/compare-stored-paths');
let outcomes: FitOutcome[];

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  const path = writePantheonProject(scratch, 'modes.yaml', '    systematic_modes:\n      - { file: data/modes.txt }\n', `models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
sampler: { walkers: 8, ensembles: 2, max_steps: 200, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }
output: { dir: fits, figures: [triangle], png: false }
`);
  const rows = readFileSync(join(scratch, 'data', 'lcparam_DS17f.txt'), 'utf8').trim().split('\n').length - 1;
  writeFileSync(join(scratch, 'data', 'modes.txt'), `${Array.from({ length: rows }, () => '0.01').join('\n')}\n`);
  // The configuration path is relative to the working folder, so the fit stores relative paths.
  outcomes = await runFit({ configPath: relative(process.cwd(), path) });
}, 120_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('compareRuns on a run with systematic modes', () => {
  it('stores the modes path relative to the folder the fit ran in', () => {
    const record = JSON.parse(readFileSync(join(outcomes[0].runDir, 'run.json'), 'utf8'));
    expect(record.configuration.supernovae[0].systematic_modes[0].file).toBe(relative(process.cwd(), join(scratch, 'data', 'modes.txt')));
  });

  it('reads the stored configuration typed, every path resolved as the fit resolved it', () => {
    const run = readRunFolder(outcomes[0].runDir);
    const stored = storedConfiguration(run);
    if (!stored.ok) throw new Error(stored.issues.map((issue) => issue.message).join('; '));
    expect(resolve(stored.value.supernovae[0].systematicModes[0].file.resolved)).toBe(join(scratch, 'data', 'modes.txt'));
    expect(resolve(stored.value.supernovae[0].table.file.resolved)).toBe(join(scratch, 'data', 'lcparam_DS17f.txt'));
    expect(storedConfiguration(run)).toBe(stored);
  });

  it('resolves the modes path like the table path and computes the DIC', () => {
    const outcome = compareRuns({ runDirs: outcomes.map((o) => o.runDir), outDir: join(scratch, 'comparison') });
    expect(outcome.warnings.filter((warning) => /rebuilt|DIC/.test(warning))).toEqual([]);
    const [model] = outcome.document.models;
    expect(model.dic_missing).toBeNull();
    expect(Number.isFinite(model.dic)).toBe(true);
    expect(readFileSync(join(scratch, 'comparison', 'comparison.md'), 'utf8')).not.toContain('DIC missing');
  });

  it('suggests the closest model label for a misspelt --base', () => {
    try {
      compareRuns({ runDirs: outcomes.map((o) => o.runDir), baseLabel: 'flat_lcmd', outDir: join(scratch, 'misspelt') });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0]).toMatchObject({ code: 'compare.unknown_model', path: '--base', fix: 'did you mean --base flat_lcdm?' });
    }
  });

  it('says loudly, in comparison.json and at the top of comparison.md, when the DIC cannot be computed', () => {
    const modes = join(scratch, 'data', 'modes.txt');
    renameSync(modes, `${modes}.away`);
    try {
      const outcome = compareRuns({ runDirs: outcomes.map((o) => o.runDir), outDir: join(scratch, 'comparison-missing') });
      const [model] = outcome.document.models;
      expect(model.dic).toBeNull();
      expect(model.dic_missing).toContain('could not be rebuilt');
      expect(model.dic_missing).toContain('modes.txt');
      const json = JSON.parse(readFileSync(join(scratch, 'comparison-missing', 'comparison.json'), 'utf8'));
      expect(json.models[0].dic_missing).toBe(model.dic_missing);
      const markdown = readFileSync(join(scratch, 'comparison-missing', 'comparison.md'), 'utf8');
      expect(markdown.startsWith('> **Warning: DIC missing** for flat_lcdm:')).toBe(true);
      expect(markdown).toMatch(/\| flat_lcdm \|[^\n]*\| MISSING \|/);
      expect(outcome.warnings.some((warning) => warning.startsWith('flat_lcdm: DIC missing'))).toBe(true);
    } finally {
      renameSync(`${modes}.away`, modes);
    }
  });
});
