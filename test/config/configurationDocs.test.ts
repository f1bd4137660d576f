// docs/configuration.md documents every key and the defaults of src/config/defaults.ts.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRIORS, configToPlainObject, describePrior } from '../../src/config/index.js';
import { configOf } from './configTextHelpers.js';

const DOCS = readFileSync('docs/configuration.md', 'utf8');

/** A configuration touching every optional section, so its plain form has every key. */
const FULL = `seed: 1
supernovae:
  - kind: light_curves
    table: { file: t.txt }
    columns: { id: n, z: z, m_b: m, m_b_err: dm, x1: s, x1_err: ds, color: c, color_err: dc, host_log_mass: h }
    covariances:
      - { file: c.txt, applies_to: light_curve_parameters }
    cuts: { redshift: [0.01, 2], max_abs_x1: 3, max_abs_color: 0.3, keep_samples: [1] }
standardization:
  host_mass_step: { shape: logistic }
  alpha_beta_covariance: frozen
  frozen_at: { alpha: 0.14, beta: 3.1 }
`.replace('host_log_mass: h }', 'host_log_mass: h, sample: set }');

/** Every key of a plain configuration object, except data-valued maps (column fields, parameter names). */
function keysOf(value: unknown, parent = ''): string[] {
  if (Array.isArray(value)) return value.flatMap((item) => keysOf(item, parent));
  if (value === null || typeof value !== 'object') return [];
  if (['columns', 'missing_values', 'max_errors', 'parameters'].includes(parent)) return [];
  return Object.entries(value).flatMap(([key, child]) => [key, ...keysOf(child, key)]);
}

/** The default cells of every documentation row for a key. */
function defaultCells(key: string): string[] {
  return DOCS.split('\n').filter((line) => line.startsWith(`| \`${key}\` |`)).map((line) => line.split('|')[2].trim());
}

function formatted(value: unknown): string {
  return Array.isArray(value) ? `[${value.join(', ')}]` : String(value);
}

describe('docs/configuration.md', () => {
  const plain = configToPlainObject(configOf(FULL).config);

  it('mentions every configuration key', () => {
    const missing = [...new Set(keysOf(plain))].filter((key) => !DOCS.includes(`\`${key}\``));
    expect(missing).toEqual([]);
  });

  it('states the default of every setting of the sampler, standardization, output, table and covariance tables', () => {
    const defaults = configToPlainObject(configOf('seed: 1\nsupernovae:\n  - kind: magnitudes\n    table: { file: t }\n' +
      '    columns: { id: n, z: z, magnitude: m, magnitude_err: e }\n    covariances: [{ file: c }]\n').config);
    const sections = defaults as Record<string, Record<string, unknown>>;
    const set = (sections.supernovae as unknown as Array<Record<string, Record<string, unknown>>>)[0];
    const standardization = sections.standardization;
    const checked: Array<[string, unknown]> = [
      ...Object.entries(sections.sampler).filter(([key]) => key !== 'nested'),
      ['method', standardization.method], ['alpha_beta_covariance', standardization.alpha_beta_covariance], ['offset', standardization.offset],
      ...Object.entries(standardization.host_mass_step as object), ...Object.entries(standardization.scatter as object),
      // smoothing and chains are blocks, their defaults stated in the text below the table.
      ...Object.entries(sections.output).filter(([key]) => key !== 'smoothing' && key !== 'chains' && key !== 'dir'),
      ...Object.entries(set.table).filter(([key]) => key !== 'file'),
      // name defaults to the file's stem, stated in words in the docs.
      ...Object.entries((set.covariances as unknown as Array<Record<string, unknown>>)[0]).filter(([key]) => key !== 'file' && key !== 'name'),
      ['keep_calibrators', set.cuts.keep_calibrators], ['max_redshift_mismatch', set.max_redshift_mismatch],
      ['reference_h0', defaults.reference_h0], ['derived', defaults.derived],
    ];
    const wrong = checked.filter(([key, value]) => !defaultCells(key).includes(formatted(value)))
      .map(([key, value]) => `${key}: code ${formatted(value)}, docs ${defaultCells(key).join(' / ') || 'no row'}`);
    expect(wrong).toEqual([]);
  });

  it('states every default prior', () => {
    const wrong = Object.entries(DEFAULT_PRIORS)
      .filter(([name, prior]) => !defaultCells(name).some((cell) => cell.startsWith(describePrior(prior))))
      .map(([name]) => name);
    expect(wrong).toEqual([]);
  });
});
