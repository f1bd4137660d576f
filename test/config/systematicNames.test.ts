// Names of `covariances` and `systematic_modes` entries (the rows of the systematic budget).
// Expected lines come from the test's own YAML text (lineOf via expectLocated).
import { describe, expect, it } from 'vitest';
import { resolvedConfigToYaml, parseConfigText } from '../../src/config/index.js';
import { VALID_MAGNITUDES, configOf, errorsOf, expectLocated, only } from './configTextHelpers.js';

/** VALID_MAGNITUDES with covariances and systematic_modes blocks before `columns`. */
function withEntries(covariances: string, modes: string): string {
  return VALID_MAGNITUDES.replace(/\n( {4})columns:/, `\n    covariances:\n${covariances}\n    systematic_modes:\n${modes}\n$1columns:`);
}

describe('systematic names', () => {
  it('name an entry after its file when no name is written, with _2 for a second file of the same stem', () => {
    const text = withEntries('      - file: sys/calibration.txt', '      - file: modes/calibration.csv\n      - file: modes/kestrel-drift.csv');
    const set = configOf(text).config.supernovae[0];
    expect(set.covariances.map((entry) => entry.name)).toEqual(['calibration']);
    expect(set.systematicModes.map((entry) => entry.name)).toEqual(['calibration_2', 'kestrel-drift']);
    expect(set.systematicModes.map((entry) => entry.perColumn)).toEqual([false, false]);
  });

  it('keep written names and read per_column', () => {
    const text = withEntries('      - { file: c.txt, name: zero_points }', '      - { file: m.csv, name: host-mass, per_column: true }');
    const set = configOf(text).config.supernovae[0];
    expect(set.covariances[0].name).toBe('zero_points');
    expect(set.systematicModes[0]).toMatchObject({ name: 'host-mass', perColumn: true });
  });

  it('refuse a name written twice, naming the first entry and a free name', () => {
    const text = withEntries('      - { file: c.txt, name: drift }', '      - { file: m.csv, name: drift }');
    const issue = only(errorsOf(text), 'config.duplicate_name');
    expectLocated(issue, text, 'm.csv, name: drift', 'supernovae[0].systematic_modes[0].name');
    expect(issue.message).toContain('supernovae[0].covariances[0]');
    expect(issue.fix).toBe('give this entry its own name, e.g. name: drift_2');
  });

  it('refuse a written name that takes a derived one, and say how to name the other entry', () => {
    const text = withEntries('      - file: data/drift.txt', '      - { file: m.csv, name: drift }');
    const issue = only(errorsOf(text), 'config.duplicate_name');
    expect(issue.message).toContain('(named after its file)');
    expect(issue.fix).toContain('or name supernovae[0].covariances[0] explicitly');
  });

  it('refuse a name with a dot or a space, suggesting a cleaned one', () => {
    const text = withEntries('      - { file: c.txt, name: "zero point.g" }', '      - file: m.csv');
    const issue = only(errorsOf(text), 'config.bad_name');
    expect(issue.fix).toBe('write e.g. name: zero_point_g');
  });

  it('survive the round trip through the resolved copy', () => {
    const text = withEntries('      - { file: c.txt, name: zero_points }', '      - { file: m.csv, per_column: true }');
    const first = configOf(text).config;
    const again = parseConfigText(resolvedConfigToYaml(first), 'run.yaml');
    expect(again.ok).toBe(true);
    if (!again.ok) return;
    expect(again.value.supernovae[0].covariances[0].name).toBe('zero_points');
    expect(again.value.supernovae[0].systematicModes[0]).toMatchObject({ name: 'm', perColumn: true });
  });
});
