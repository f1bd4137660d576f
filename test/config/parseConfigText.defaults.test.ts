// A minimal configuration gets every default of src/config/defaults.ts, and
// paths resolve against the configuration file's folder.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_COVARIANCE, DEFAULT_CUTS, DEFAULT_MAX_REDSHIFT_MISMATCH, DEFAULT_OUTPUT, DEFAULT_PRIORS,
  DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC, DEFAULT_SAMPLER, DEFAULT_SEED, DEFAULT_STANDARDIZATION, DEFAULT_TABLE,
  DEFAULT_TITLE, parseConfigText, resolveConfigPath,
} from '../../src/config/index.js';
import { VALID_LIGHT_CURVES, configOf } from './configTextHelpers.js';

const MINIMAL = `supernovae:
  - kind: magnitudes
    table: { file: data/table.txt }
    columns: { id: name, z: zcmb, magnitude: mb, magnitude_err: dmb }
    covariances:
      - file: ../shared/sys.txt
`;

describe('parseConfigText: defaults', () => {
  const { config, warnings } = configOf(MINIMAL, 'studies/run.yaml');

  it('fills every section from defaults.ts', () => {
    expect(config.title).toBe(DEFAULT_TITLE);
    expect(config.seed).toBe(DEFAULT_SEED);
    expect(config.standardization).toEqual(DEFAULT_STANDARDIZATION);
    expect(config.sampler).toEqual(DEFAULT_SAMPLER);
    expect(config.referenceH0KmPerSPerMpc).toBe(DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC);
    expect(config.derived).toBe('auto');
    const { dir, ...output } = config.output;
    const { dir: defaultDir, ...defaultOutput } = DEFAULT_OUTPUT;
    expect(output).toEqual(defaultOutput);
    expect(dir).toEqual({ written: defaultDir, resolved: join('studies', defaultDir) });
  });

  it('fills a data set: label main, table options, cuts, covariance options, redshift mismatch', () => {
    const [set] = config.supernovae;
    expect(set.label).toBe('main');
    const { file, ...table } = set.table;
    expect(table).toEqual(DEFAULT_TABLE);
    expect(set.cuts).toEqual(DEFAULT_CUTS);
    expect(set.maxRedshiftMismatch).toBe(DEFAULT_MAX_REDSHIFT_MISMATCH);
    const { file: covarianceFile, name: covarianceName, ...covariance } = set.covariances[0];
    expect(covariance).toEqual(DEFAULT_COVARIANCE);
    expect(covarianceName).toBe('sys'); // named after its file's stem
    expect(file.written).toBe('data/table.txt');
    expect(covarianceFile.written).toBe('../shared/sys.txt');
  });

  it('fits flat LambdaCDM when no model is given', () => {
    expect(config.models).toEqual([{ label: 'flat_lambda', darkEnergy: 'lambda', curvature: 'flat', radiation: false, parameters: {} }]);
  });

  it('gives every used parameter its default prior, and no prior to unused ones', () => {
    // magnitudes + global scatter + marginalized offset: omega_m and sigma_int only.
    expect(config.parameters).toEqual({
      omega_m: { mode: 'prior', prior: DEFAULT_PRIORS.omega_m },
      sigma_int: { mode: 'prior', prior: DEFAULT_PRIORS.sigma_int },
    });
  });

  it('warns that no seed was given', () => {
    expect(warnings.map((w) => w.code)).toEqual(['config.no_seed']);
  });

  it('does not share default objects between configurations', () => {
    const other = configOf(MINIMAL, 'run.yaml').config;
    other.sampler.nested.livePoints = 3;
    other.supernovae[0].cuts.dropIds.push('x');
    expect(DEFAULT_SAMPLER.nested.livePoints).toBe(500);
    expect(DEFAULT_CUTS.dropIds).toEqual([]);
  });
});

describe('parseConfigText: paths', () => {
  it('resolves relative paths against the configuration folder and keeps what was written', () => {
    const { config } = configOf(MINIMAL, 'studies/run.yaml');
    expect(config.supernovae[0].table.file).toEqual({ written: 'data/table.txt', resolved: join('studies', 'data', 'table.txt') });
    expect(config.supernovae[0].covariances[0].file).toEqual({ written: '../shared/sys.txt', resolved: join('shared', 'sys.txt') });
  });

  it('keeps absolute paths as written', () => {
    expect(resolveConfigPath('studies/run.yaml', '/data/t.txt')).toEqual({ written: '/data/t.txt', resolved: '/data/t.txt' });
  });

  it('records where keys sit for later messages', () => {
    const { config } = configOf(MINIMAL, 'run.yaml');
    expect(config.source.positions['supernovae[0].columns.z']).toEqual({ line: 4, column: 26 });
  });
});

describe('parseConfigText: accepted shorthands', () => {
  it('takes a single data set or model written as a mapping, and index_column as a boolean', () => {
    const text = `seed: abc
supernovae:
  kind: light_curves
  table: { file: t.txt, index_column: true }
  columns: { id: n, z: z, m_b: m, m_b_err: dm, x1: s, x1_err: ds, color: c, color_err: dc, host_log_mass: h }
models: { dark_energy: cpl }
`;
    const { config } = configOf(text);
    expect(config.seed).toBe('abc');
    expect(config.supernovae[0].table.indexColumn).toBe('yes');
    expect(config.models.map((m) => m.label)).toEqual(['flat_cpl']);
  });

  it('reads identifiers written as numbers exactly as written', () => {
    const text = VALID_LIGHT_CURVES.replace('      host_log_mass: mass', '      host_log_mass: mass\n      sample: set') +
      'supernovae_extra: 0\n';
    expect(parseConfigText(text, 'r.yaml').ok).toBe(false); // unknown top-level key, sanity check of the base text
    const good = VALID_LIGHT_CURVES.replace('      host_log_mass: mass', '      host_log_mass: mass\n      sample: set\n    cuts:\n      drop_ids: [1246275, 03D1au]\n      keep_samples: [1, 2]');
    const { config } = configOf(good);
    expect(config.supernovae[0].cuts.dropIds).toEqual(['1246275', '03D1au']);
    expect(config.supernovae[0].cuts.keepSamples).toEqual(['1', '2']);
  });
});
