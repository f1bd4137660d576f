import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { checkStandardizeBlinding } from '../../../src/pipeline/blinding/checkStandardizeBlinding.js';
import { standardizeTable } from '../../../src/pipeline/index.js';
import { VALID_MAGNITUDES, configOf } from '../../config/configTextHelpers.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

const scratch = resolve('.candela-tmp/standardize-blinding');
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
const blinded = configOf(`${VALID_MAGNITUDES}blinding: { parameters: [w0, omega_m] }\n`).config;

describe('checkStandardizeBlinding', () => {
  it('refuses to fit a blinded parameter, naming them and the --at fix', () => {
    expect(() => checkStandardizeBlinding(blinded, ['omega_m', 'w0', 'alpha'], ['w0'])).toThrow(/standardize would fit and print the true best fit of omega_m/);
    expect(() => checkStandardizeBlinding(blinded, ['omega_m', 'w0'], [])).toThrow(/--at w0=\.\.\. --at omega_m=\.\.\./);
  });

  it('lets it run when every blinded sampled parameter is given, or nothing is blinded', () => {
    expect(() => checkStandardizeBlinding(blinded, ['omega_m', 'w0', 'alpha'], ['omega_m', 'w0'])).not.toThrow();
    expect(() => checkStandardizeBlinding(configOf(VALID_MAGNITUDES).config, ['omega_m'], [])).not.toThrow();
  });

  it('stops candela standardize on a blinded configuration before anything is fitted (Pantheon 2018 binned, Scolnic et al. 2018)', async () => {
    mkdirSync(scratch, { recursive: true });
    const path = join(scratch, 'run.yaml');
    writeFileSync(path, `${pantheonBinnedConfig({ seed: 1, models: '  - { label: flat_wcdm, dark_energy: constant_w }', sampler: '{ walkers: 8 }', output: `{ dir: ${join(scratch, 'out')} }` })}blinding: {}\n`);
    await expect(standardizeTable(path, {})).rejects.toThrow(/blinded: standardize would fit and print the true best fit of w0, omega_m/);
    const given = await standardizeTable(path, { w0: -1, omega_m: 0.3 });
    expect(given.fitted).toEqual([]);
  });
});
