// `supernovae[].systematic_modes`: keys, defaults, problems and the round trip
// through the resolved copies. Expected lines come from the test's own YAML text (lineOf).
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_SYSTEMATIC_MODES, describeConfig, parseConfigText, resolvedConfigToJson, resolvedConfigToYaml,
} from '../../src/config/index.js';
import type { CandelaConfig } from '../../src/config/index.js';
import { formatIssues } from '../../src/errors.js';
import { VALID_LIGHT_CURVES, VALID_MAGNITUDES, configOf, errorsOf, expectLocated, lineOf, only } from './configTextHelpers.js';

/** VALID_MAGNITUDES with a systematic_modes block (indented as a data-set key) before `columns`. */
function withModes(block: string, base = VALID_MAGNITUDES): string {
  return base.replace(/\n( {4})columns:/, `\n    systematic_modes:\n${block}\n$1columns:`);
}

describe('supernovae[].systematic_modes', () => {
  it('reads files and scales, resolving paths against the configuration folder', () => {
    const text = withModes('      - file: modes/calibration.csv\n      - { file: dust.txt, scale: 2.5 }');
    const { config, warnings } = configOf(text, join('configs', 'run.yaml'));
    expect(warnings).toEqual([]);
    expect(config.supernovae[0].systematicModes).toEqual([
      { file: { written: 'modes/calibration.csv', resolved: join('configs', 'modes', 'calibration.csv') }, name: 'calibration', scale: DEFAULT_SYSTEMATIC_MODES.scale, perColumn: false },
      { file: { written: 'dust.txt', resolved: join('configs', 'dust.txt') }, name: 'dust', scale: 2.5, perColumn: false },
    ]);
    expect(DEFAULT_SYSTEMATIC_MODES.scale).toBe(1); // docs/configuration.md: scale default 1
  });

  it('is an empty list when absent', () => {
    expect(configOf(VALID_MAGNITUDES).config.supernovae[0].systematicModes).toEqual([]);
  });

  it('rejects an unknown key of an entry with the closest valid key', () => {
    const text = withModes('      - file: m.csv\n        scal: 2');
    const issue = only(errorsOf(text), 'config.unknown_key');
    expectLocated(issue, text, 'scal: 2', 'supernovae[0].systematic_modes[0].scal');
    expect(issue.fix).toBe('did you mean "scale"?');
  });

  it('suggests systematic_modes for a misspelt data-set key', () => {
    const text = VALID_MAGNITUDES.replace('    columns:', '    systematic_mode:\n      - file: m.csv\n    columns:');
    const issue = only(errorsOf(text), 'config.unknown_key');
    expectLocated(issue, text, 'systematic_mode:', 'supernovae[0].systematic_mode');
    expect(issue.fix).toBe('did you mean "systematic_modes"?');
  });

  it('requires file and a positive scale', () => {
    const text = withModes('      - scale: 2\n      - { file: m.csv, scale: 0 }\n      - { file: n.csv, scale: -1 }');
    const issues = errorsOf(text);
    const missing = only(issues, 'config.missing_key');
    expect(missing.path).toBe('supernovae[0].systematic_modes[0].file');
    expect(missing.line).toBe(lineOf(text, '- scale: 2'));
    const ranges = issues.filter((issue) => issue.code === 'config.out_of_range');
    expect(ranges.map((issue) => [issue.path, issue.line])).toEqual([
      ['supernovae[0].systematic_modes[1].scale', lineOf(text, 'scale: 0')],
      ['supernovae[0].systematic_modes[2].scale', lineOf(text, 'scale: -1')],
    ]);
  });

  it('accepts systematic modes with the hierarchical method (they act on m_b through the Woodbury identity)', () => {
    const base = VALID_LIGHT_CURVES.replace('models:', 'standardization:\n  method: hierarchical\nmodels:');
    const { config, warnings } = configOf(withModes('      - file: m.csv', base));
    expect(warnings).toEqual([]);
    expect(config.standardization.method).toBe('hierarchical');
    expect(config.supernovae[0].systematicModes).toHaveLength(1);
  });

  it('accepts systematic modes with the conventional method on light curves', () => {
    expect(configOf(withModes('      - file: m.csv', VALID_LIGHT_CURVES)).config.supernovae[0].systematicModes).toHaveLength(1);
  });

  it('reads back identically from the resolved YAML and JSON copies', () => {
    const text = withModes('      - file: modes/a.csv\n      - { file: b.csv, scale: 0.5 }');
    const { config } = configOf(text, join('configs', 'run.yaml'));
    const copyFolder = join('out', 'copy');
    const strip = (c: CandelaConfig): unknown => JSON.parse(JSON.stringify({ ...c, source: null }, (key, value) => (key === 'written' ? undefined : value)));
    for (const copyText of [resolvedConfigToYaml(config, { pathsRelativeTo: copyFolder }), resolvedConfigToJson(config, { pathsRelativeTo: copyFolder })]) {
      const copy = parseConfigText(copyText, join(copyFolder, 'resolved.yaml'));
      expect(copy.ok ? [] : formatIssues(copy.issues)).toEqual([]);
      if (copy.ok) {
        expect(strip(copy.value)).toEqual(strip(config));
        expect(copy.value.supernovae[0].systematicModes.map((m) => m.file.resolved)).toEqual([join('configs', 'modes', 'a.csv'), join('configs', 'b.csv')]);
      }
    }
  });

  it('is described with the mode files and a scale other than 1', () => {
    const { config } = configOf(withModes('      - file: a.csv\n      - { file: b.csv, scale: 2 }'));
    const line = describeConfig(config).find((entry) => entry.startsWith('data set "bins"'));
    expect(line).toContain('systematic modes a.csv (N x K) + b.csv (N x K, shifts x 2)');
    const without = describeConfig(configOf(VALID_MAGNITUDES).config).find((entry) => entry.startsWith('data set "bins"'));
    expect(without).not.toContain('systematic modes');
  });
});
