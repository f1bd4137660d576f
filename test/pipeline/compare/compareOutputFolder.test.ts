import { existsSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { checkComparisonFolder } from '../../../src/pipeline/compare/compareOutputFolder.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// `candela compare` and its output folder: like `candela fit`, an existing non-empty folder is refused
// without --force (common practice: never overwrite results silently), and with --force the earlier
// comparison's files are removed so no stale figure stays. Two short fits of the Pantheon 2018 binned
// Hubble diagram (Scolnic et al. 2018, ../shared/data-real/pantheon2018) provide the runs.
const scratch = useScratchFolder('compare-output-folder');
let outcomes: FitOutcome[];

function codeOf(action: () => unknown): string {
  try {
    action();
  } catch (error) {
    return isCandelaError(error) ? error.issues[0].code : 'other';
  }
  return 'none';
}

beforeAll(async () => {
  const path = join(scratch, 'two.yaml');
  writeFileSync(path, pantheonBinnedConfig({
    seed: 5,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }\n  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 100, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'fits')}, figures: [triangle], png: false }`,
  }));
  outcomes = await runFit({ configPath: path });
}, 120_000);

describe('checkComparisonFolder', () => {
  it('accepts a missing or empty folder and refuses a non-empty one without force', () => {
    const runs = outcomes.map((o) => o.runDir);
    expect(codeOf(() => checkComparisonFolder(join(scratch, 'absent'), runs, false))).toBe('none');
    mkdirSync(join(scratch, 'empty'), { recursive: true });
    expect(codeOf(() => checkComparisonFolder(join(scratch, 'empty'), runs, false))).toBe('none');
    mkdirSync(join(scratch, 'used'), { recursive: true });
    writeFileSync(join(scratch, 'used', 'comparison.json'), '{}\n');
    expect(codeOf(() => checkComparisonFolder(join(scratch, 'used'), runs, false))).toBe('compare.folder_not_empty');
    expect(codeOf(() => checkComparisonFolder(join(scratch, 'used'), runs, true))).toBe('none');
  });

  it('never lets --force empty a folder that holds a compared run', () => {
    const runs = outcomes.map((o) => o.runDir);
    expect(codeOf(() => checkComparisonFolder(join(scratch, 'fits'), runs, true))).toBe('compare.folder_holds_run');
    expect(codeOf(() => checkComparisonFolder(runs[0], runs, true))).toBe('compare.folder_holds_run');
  });
});

describe('candela compare --force', () => {
  it('refuses an earlier comparison without --force (exit 2, nothing touched) and replaces it with --force, stale files gone', async () => {
    const runs = outcomes.map((o) => o.runDir);
    const out = join(scratch, 'comparison');
    expect((await runCommandLine(['compare', ...runs, '--out', out])).code).toBe(0);
    const first = readdirSync(out).sort();
    expect(first).toContain('comparison.json');
    writeFileSync(join(out, 'w_of_z_flat_w0wa.svg'), '<svg/>\n'); // a figure of a model no longer compared
    const refused = await runCommandLine(['compare', ...runs, '--out', out]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('the output folder already holds files');
    expect(refused.stderr).toContain('--force');
    expect(existsSync(join(out, 'w_of_z_flat_w0wa.svg'))).toBe(true);
    expect((await runCommandLine(['compare', ...runs, '--out', out, '--force'])).code).toBe(0);
    expect(existsSync(join(out, 'w_of_z_flat_w0wa.svg'))).toBe(false);
    expect(readdirSync(out).sort()).toEqual(first);
  }, 120_000);
});
