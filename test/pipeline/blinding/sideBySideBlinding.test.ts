// The models of a blinded configuration fitted side by side (the default of `candela fit` with two threads or
// more: one process per model, started at once) share one offset per parameter: both keys hold the same
// offset of omega_m. The built command (dist/, `npm run build` first) on the Pantheon 2018 binned Hubble
// diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018), short chains.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { unsealBlindingKey } from '../../../src/output/index.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

const scratch = resolve('.candela-tmp/blinding-side-by-side');
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('blinded models fitted side by side', () => {
  it('share the offset of a parameter they both sample', () => {
    mkdirSync(scratch, { recursive: true });
    const path = join(scratch, 'two.yaml');
    writeFileSync(path, `${pantheonBinnedConfig({
      seed: 4,
      models: '  - { label: flat_lcdm, dark_energy: lambda }\n  - { label: flat_wcdm, dark_energy: constant_w }',
      parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
      sampler: '{ walkers: 8, ensembles: 2, max_steps: 120, check_every: 60, target_ess: 1000000 }',
      output: `{ dir: ${join(scratch, 'out')}, figures: [triangle], png: false }`,
    })}blinding: { parameters: [omega_m, w0] }\n`);
    const result = spawnSync(process.execPath, [resolve('dist/src/cli/main.js'), 'fit', path, '--workers', '2', '--quiet'], { encoding: 'utf8', timeout: 120_000 });
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const key = (label: string) => unsealBlindingKey(readFileSync(join(scratch, 'out', label, 'blinding.key'), 'utf8'), label);
    expect(key('flat_lcdm').offsets.omega_m).toBe(key('flat_wcdm').offsets.omega_m);
    expect(Object.keys(key('flat_wcdm').offsets)).toEqual(['omega_m', 'w0']);
    expect(existsSync(join(scratch, 'out', 'blinding-salt.key'))).toBe(true);
  }, 150_000);
});
