// The starter configuration and every configuration in configs/ are valid,
// point at files that exist, and survive a write/read round trip.
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  describeConfig, parseConfigText, parametersForModel, readConfigFile, resolvedConfigToJson, resolvedConfigToYaml, starterConfigText,
} from '../../src/config/index.js';
import type { CandelaConfig } from '../../src/config/index.js';
import { formatIssues } from '../../src/errors.js';

const CONFIG_FILES = readdirSync('configs').filter((name) => /^(pantheon2018-binned|pantheon2018-unbinned|des-sn5yr|jla|pantheonplus)\.yaml$/.test(name));

function load(path: string): CandelaConfig {
  const result = readConfigFile(path);
  if (!result.ok) throw new Error(formatIssues(result.issues));
  return result.value;
}

/**
 * Everything but `source` (positions and file name differ between the
 * original and the copy) and the written form of paths (the copy lives in
 * another folder; the resolved paths must agree).
 */
function content(config: CandelaConfig): unknown {
  const { source, ...rest } = config;
  void source;
  return JSON.parse(JSON.stringify(rest, (key, value) => (key === 'written' ? undefined : value)));
}

describe('configs/*.yaml', () => {
  it('includes the five public-data configurations', () => {
    expect(CONFIG_FILES.sort()).toEqual(['des-sn5yr.yaml', 'jla.yaml', 'pantheon2018-binned.yaml', 'pantheon2018-unbinned.yaml', 'pantheonplus.yaml']);
  });

  it.each(CONFIG_FILES)('%s parses without errors or warnings', (name) => {
    const result = readConfigFile(join('configs', name));
    expect(result.ok ? [] : formatIssues(result.issues)).toEqual([]);
    if (result.ok) expect(result.warnings).toEqual([]);
  });

  it.each(CONFIG_FILES)('%s points at data and covariance files that exist', (name) => {
    const config = load(join('configs', name));
    for (const set of config.supernovae) {
      expect(existsSync(set.table.file.resolved), set.table.file.resolved).toBe(true);
      for (const covariance of set.covariances) expect(existsSync(covariance.file.resolved), covariance.file.resolved).toBe(true);
    }
  });

  it.each(CONFIG_FILES)('%s reads back identically from its resolved YAML and JSON copies', (name) => {
    const path = join('configs', name);
    const config = load(path);
    const copyPath = join('out', 'copy', 'resolved.yaml');
    const yamlCopy = parseConfigText(resolvedConfigToYaml(config, { pathsRelativeTo: join('out', 'copy') }), copyPath);
    const jsonCopy = parseConfigText(resolvedConfigToJson(config, { pathsRelativeTo: join('out', 'copy') }), copyPath);
    for (const copy of [yamlCopy, jsonCopy]) {
      expect(copy.ok ? [] : formatIssues(copy.issues)).toEqual([]);
      if (copy.ok) expect(content(copy.value)).toEqual(content(config));
    }
  });

  it('maps the columns each release documents (SOURCE.md of each data folder)', () => {
    // Pantheon+: zHD is the Hubble-diagram redshift, CEPH_DIST = -9 marks non-calibrators (pantheonplus/SOURCE.md).
    const plus = load('configs/pantheonplus.yaml');
    expect(plus.supernovae[0].columns).toMatchObject({ z: 'zHD', z_helio: 'zHEL', magnitude: 'm_b_corr', calibrator_mu: 'CEPH_DIST' });
    expect(plus.supernovae[0].missingValues.calibrator_mu).toEqual([-9]);
    expect(parametersForModel(plus, 0).free.map((p) => p.name)).toEqual(['omega_m', 'h0']);
    // JLA re-release: rows start with an unnamed running index (jla-rahman2021/SOURCE.md).
    const jla = load('configs/jla.yaml');
    expect(jla.supernovae[0].table.indexColumn).toBe('yes');
    expect(jla.supernovae[0].kind).toBe('light_curves');
    // DES-SN5YR: comma separated, zHD for the model (des-sn5yr/SOURCE.md).
    const des = load('configs/des-sn5yr.yaml');
    expect(des.supernovae[0].table.delimiter).toBe('comma');
    expect(des.supernovae[0].columns.z).toBe('zHD');
  });
});

describe('starterConfigText', () => {
  it('is valid and warning-free when written to the repository root', () => {
    const result = parseConfigText(starterConfigText(), 'candela.yaml');
    expect(result.ok ? [] : formatIssues(result.issues)).toEqual([]);
    if (!result.ok) return;
    expect(result.warnings).toEqual([]);
    expect(existsSync(result.value.supernovae[0].table.file.resolved), result.value.supernovae[0].table.file.resolved).toBe(true);
    expect(describeConfig(result.value).length).toBeGreaterThan(5);
  });

  it('writes the data folder it is given', () => {
    const text = starterConfigText({ dataFolder: '../data-demo/' });
    expect(text).toContain('file: ../data-demo/kestrel-supernovae.csv');
    expect(starterConfigText({ dataFolder: '.' })).toContain('file: kestrel-supernovae.csv\n');
    const result = parseConfigText(text, 'configs/starter.yaml');
    expect(result.ok && existsSync(result.value.supernovae[0].table.file.resolved)).toBe(true);
  });

  it('explains itself in comments', () => {
    const comments = starterConfigText().split('\n').filter((line) => line.includes('#'));
    expect(comments.length).toBeGreaterThan(15);
  });
});
