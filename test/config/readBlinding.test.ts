// The blinding block: defaults, widths, and the errors that name key, line and fix.
import { describe, expect, it } from 'vitest';
import { DEFAULT_BLINDING_PARAMETERS, DEFAULT_BLINDING_WIDTHS, configToPlainObject, parseConfigText } from '../../src/config/index.js';
import { VALID_MAGNITUDES, configOf, errorsOf, expectLocated, only } from './configTextHelpers.js';

describe('readBlinding', () => {
  it('is off when the block is absent', () => {
    expect(configOf(VALID_MAGNITUDES).config.blinding).toBeNull();
  });

  it('blinds w0, wa, omega_m and h0 with their default widths when the block is empty', () => {
    const { blinding } = configOf(`${VALID_MAGNITUDES}blinding: {}\n`).config;
    expect(blinding?.parameters).toEqual([...DEFAULT_BLINDING_PARAMETERS]);
    expect(blinding?.offsetWidths).toEqual({ w0: 0.3, wa: 1, omega_m: 0.1, h0: 5 });
  });

  it('takes the listed parameters in order and a width per parameter, defaults for the others', () => {
    const { blinding } = configOf(`${VALID_MAGNITUDES}blinding:\n  parameters: [omega_m, alpha]\n  offset_widths: { alpha: 0.05 }\n`).config;
    expect(blinding).toEqual({ parameters: ['omega_m', 'alpha'], offsetWidths: { omega_m: DEFAULT_BLINDING_WIDTHS.omega_m, alpha: 0.05 } });
  });

  it('is written back into the stored copy and reads back the same', () => {
    const text = `${VALID_MAGNITUDES}blinding:\n  parameters: [w0]\n  offset_widths: { w0: 0.4 }\n`;
    const plain = configToPlainObject(configOf(text).config) as { blinding?: unknown };
    expect(plain.blinding).toEqual({ parameters: ['w0'], offset_widths: { w0: 0.4 } });
  });

  it('suggests the closest parameter for a misspelt name', () => {
    const text = `${VALID_MAGNITUDES}blinding:\n  parameters: [w0, omgea_m]\n`;
    const issue = only(errorsOf(text), 'config.unknown_key');
    expectLocated(issue, text, 'omgea_m', 'blinding.parameters[1]');
    expect(issue.fix).toBe('did you mean "omega_m"?');
  });

  it('refuses a derived quantity, a repeated name, an empty list and an unknown key', () => {
    const derived = `${VALID_MAGNITUDES}blinding:\n  parameters: [q0]\n`;
    expectLocated(only(errorsOf(derived), 'config.derived_parameter'), derived, 'q0', 'blinding.parameters[0]');
    const twice = `${VALID_MAGNITUDES}blinding:\n  parameters: [w0, w0]\n`;
    expect(only(errorsOf(twice), 'config.duplicate').path).toBe('blinding.parameters[1]');
    const empty = `${VALID_MAGNITUDES}blinding:\n  parameters: []\n`;
    expectLocated(only(errorsOf(empty), 'config.empty_list'), empty, 'parameters: []', 'blinding.parameters');
    const key = `${VALID_MAGNITUDES}blinding:\n  parametres: [w0]\n`;
    expect(only(errorsOf(key), 'config.unknown_key').fix).toBe('did you mean "parameters"?');
  });

  it('refuses a width that is not positive, a width for an unlisted parameter, and a parameter without a default width', () => {
    const negative = `${VALID_MAGNITUDES}blinding:\n  offset_widths: { w0: -0.3 }\n`;
    expectLocated(only(errorsOf(negative), 'config.out_of_range'), negative, 'offset_widths', 'blinding.offset_widths.w0');
    const unlisted = `${VALID_MAGNITUDES}blinding:\n  parameters: [w0]\n  offset_widths: { wa: 1 }\n`;
    expect(only(errorsOf(unlisted), 'config.unused_key').fix).toBe('add wa to blinding.parameters, or remove its width');
    const noWidth = `${VALID_MAGNITUDES}blinding:\n  parameters: [beta]\n`;
    const issue = only(errorsOf(noWidth), 'config.missing_key');
    expect(issue.path).toBe('blinding.offset_widths');
    expect(issue.fix).toContain('offset_widths: { beta: <width> }');
  });

  it('refuses a block that is not a mapping', () => {
    const result = parseConfigText(`${VALID_MAGNITUDES}blinding: yes\n`, 'run.yaml');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues.some((issue) => issue.path === 'blinding' && issue.code === 'config.wrong_type')).toBe(true);
  });
});
