import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCommandLine } from '../../support/runCommandLine.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

// `candela fit --model LABEL` fits one model of a configuration, into the folder and with the chains
// it has in a full run. Data: Pantheon 2018 binned (../shared/data-real/pantheon2018, Scolnic et al. 2018).
const scratch = resolve('.candela-tmp/fit-model-option');

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

function config(out: string): string {
  const path = join(scratch, `${out}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    seed: 5,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }\n  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 150, check_every: 50, target_ess: 100000000, workers: 1 }',
    output: `{ dir: ${join(scratch, out)}, figures: [], png: false }`,
  }));
  return path;
}

describe('candela fit --model', () => {
  it('fits one model of the configuration with the chains of a full run, byte for byte, and leaves the others alone', async () => {
    const full = await runCommandLine(['fit', config('full'), '--quiet']);
    expect(full.code, full.stderr).toBe(0);
    const one = await runCommandLine(['fit', config('one'), '--model', 'flat_wcdm', '--quiet']);
    expect(one.code, one.stderr).toBe(0);
    expect(existsSync(join(scratch, 'one', 'flat_lcdm'))).toBe(false);
    const chains = (dir: string) => readFileSync(join(scratch, dir, 'flat_wcdm', 'chains.csv'));
    expect(chains('one').equals(chains('full'))).toBe(true);
    // The resolved copy of the configuration holds paths relative to the run folder, so it validates from there (regression).
    const again = await runCommandLine(['check', join(scratch, 'full', 'flat_wcdm', 'config.resolved.yaml')]);
    expect(again.code, again.stderr).toBe(0);
  });

  it('exits 2 for a label the configuration does not have, naming --model and the closest label', async () => {
    const { code, stderr } = await runCommandLine(['fit', config('typo'), '--model', 'flat_wcmd', '--quiet']);
    expect(code).toBe(2);
    expect(stderr).toContain('--model');
    expect(stderr).toContain('flat_wcdm');
    expect(existsSync(join(scratch, 'typo'))).toBe(false);
  });
});
