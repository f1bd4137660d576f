import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { prepareRunBlinding } from '../../../src/pipeline/blinding/prepareRunBlinding.js';
import { unsealBlindingKey } from '../../../src/output/index.js';
import { VALID_MAGNITUDES, configOf } from '../../config/configTextHelpers.js';

const scratch = resolve('.candela-tmp/prepare-run-blinding');
const blinded = configOf(`${VALID_MAGNITUDES}blinding: { parameters: [w0, omega_m, h0], offset_widths: { w0: 0.4 } }\n`).config;

beforeAll(() => mkdirSync(scratch, { recursive: true }));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('prepareRunBlinding', () => {
  it('does nothing without a blinding block', () => {
    expect(prepareRunBlinding(configOf(VALID_MAGNITUDES).config, 'flat_lcdm', ['omega_m'], scratch)).toEqual({ blinding: null, lines: [] });
  });

  it('blinds the listed parameters the model samples, in its order, seals the key, and says which are not blinded', () => {
    const dir = join(scratch, 'a');
    mkdirSync(dir);
    const { blinding, lines } = prepareRunBlinding(blinded, 'flat_wcdm', ['omega_m', 'w0', 'alpha'], dir);
    expect(blinding?.parameters).toEqual(['omega_m', 'w0']);
    expect(blinding?.widths).toEqual({ omega_m: 0.1, w0: 0.4 });
    expect(Math.abs(blinding!.offsets.w0)).toBeGreaterThanOrEqual(0.1);
    expect(Math.abs(blinding!.offsets.w0)).toBeLessThanOrEqual(0.4);
    expect(lines[0]).toBe('blinding: h0 is not sampled by model flat_wcdm: not blinded (a fixed value is in the configuration)');
    expect(lines.join('\n')).not.toContain(String(blinding!.offsets.w0));
    const key = unsealBlindingKey(readFileSync(join(dir, 'blinding.key'), 'utf8'), 'k');
    expect(key.offsets).toEqual(blinding!.offsets);
    // A resumed run keeps its key (the same offsets, whatever the salt).
    expect(prepareRunBlinding(blinded, 'flat_wcdm', ['omega_m', 'w0', 'alpha'], dir).blinding?.offsets).toEqual(blinding!.offsets);
  });

  it('draws other offsets for another salt, the same for the same salt', () => {
    const draw = (name: string, salt: string) => {
      const dir = join(scratch, name);
      mkdirSync(dir);
      return prepareRunBlinding(blinded, 'flat_wcdm', ['omega_m', 'w0'], dir, salt).blinding!.offsets;
    };
    expect(draw('s1', 'ab')).toEqual(draw('s2', 'ab'));
    expect(draw('s3', 'ab')).not.toEqual(draw('s4', 'cd'));
  });

  it('refuses the key of another run in the folder', () => {
    const dir = join(scratch, 'foreign');
    mkdirSync(dir);
    prepareRunBlinding(blinded, 'flat_wcdm', ['omega_m', 'w0'], dir);
    expect(() => prepareRunBlinding(blinded, 'flat_w0wa', ['omega_m', 'w0'], dir)).toThrow(/belongs to another run/);
  });

  it('blinds nothing, with a line saying so, when the model samples none of the listed parameters', () => {
    const { blinding, lines } = prepareRunBlinding(blinded, 'fixed', ['alpha'], scratch);
    expect(blinding).toBeNull();
    expect(lines.at(-1)).toBe('blinding: model fixed samples none of w0, omega_m, h0: its outputs are not blinded');
  });
});

describe('prepareRunBlinding with several models', () => {
  it('gives a parameter the same offset in every model of the configuration (the salt is shared, sealed beside their folders)', () => {
    const two = configOf(`${VALID_MAGNITUDES.replace('models:\n  - label: flat_lcdm\n    dark_energy: lambda\n', 'models:\n  - { label: flat_lcdm, dark_energy: lambda }\n  - { label: flat_wcdm, dark_energy: constant_w }\n')}blinding: { parameters: [w0, omega_m] }\n`).config;
    expect(two.models.map((model) => model.label)).toEqual(['flat_lcdm', 'flat_wcdm']);
    const base = join(scratch, 'two');
    for (const label of ['flat_lcdm', 'flat_wcdm']) mkdirSync(join(base, label), { recursive: true });
    const lcdm = prepareRunBlinding(two, 'flat_lcdm', ['omega_m'], join(base, 'flat_lcdm')).blinding!;
    const wcdm = prepareRunBlinding(two, 'flat_wcdm', ['omega_m', 'w0'], join(base, 'flat_wcdm')).blinding!;
    expect(wcdm.offsets.omega_m).toBe(lcdm.offsets.omega_m);
    expect(existsSync(join(base, 'blinding-salt.key'))).toBe(true);
    expect(Object.keys(wcdm.offsets)).toEqual(['omega_m', 'w0']);
    // A configuration with one model draws its own salt: another folder gets other offsets.
    const other = join(scratch, 'alone');
    mkdirSync(other);
    expect(prepareRunBlinding(blinded, 'flat_lcdm', ['omega_m'], other).blinding!.offsets.omega_m).not.toBe(lcdm.offsets.omega_m);
  });
});
