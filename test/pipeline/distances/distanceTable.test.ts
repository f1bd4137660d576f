import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { computeDistanceTable, formatDistanceTableCsv, formatDistanceTableJson, formatDistanceTableText, readRedshiftFile } from '../../../src/pipeline/index.js';
import type { DistanceTableOptions } from '../../../src/pipeline/index.js';
import { loadReferenceRows } from '../../cosmology/referenceDistances.js';

const BASE: DistanceTableOptions = { darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 0.9, h0KmPerSPerMpc: 70, radiation: true, redshifts: [0.1, 1, 10] };

function issuesOf(action: () => unknown): { code: string; path?: string; fix?: string }[] {
  try { action(); } catch (error) { if (isCandelaError(error)) return error.issues; throw error; }
  throw new Error('expected a CandelaError');
}

describe('computeDistanceTable', () => {
  it('tabulates a closed LambdaCDM model with radiation like astropy 5.2.1 (LambdaCDM(Om0=0.3, Ode0=0.9, Tcmb0=2.7255))', () => {
    const table = computeDistanceTable(BASE);
    // Source: ../shared/reference/distances.csv, case LCDM_closed_Om0.3_OL0.9_rad; relative 1e-9 (reference ~1e-12 / ~1e-10 for times).
    const reference = loadReferenceRows().filter((row) => row.case === 'LCDM_closed_Om0.3_OL0.9_rad');
    expect(Math.abs(table.model.omegaCurvature - reference[0].Ok0)).toBeLessThan(1e-14);
    expect(Math.abs((table.today.ageGyr as number) / reference[0].age_today_Gyr - 1)).toBeLessThan(1e-9);
    for (const row of table.rows) {
      const expected = reference.find((r) => r.z === row.z)!;
      expect(Math.abs(row.luminosityDistanceMpc / expected.luminosity_distance_Mpc - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.distanceModulusMag - expected.distmod_mag)).toBeLessThan(1e-8);
      expect(Math.abs(row.lookbackTimeGyr / expected.lookback_time_Gyr - 1)).toBeLessThan(1e-9);
      expect(Math.abs((row.ageGyr as number) / expected.age_Gyr - 1)).toBeLessThan(1e-9);
    }
  });

  it('lists every bad option at once, each with its field and a fix', () => {
    const issues = issuesOf(() => computeDistanceTable({ ...BASE, omegaDarkEnergy: undefined, redshifts: [0.5, -1, Number.NaN], w0: -0.8 }));
    expect(issues.map((issue) => issue.code).sort()).toEqual(['distances.bad_redshift', 'distances.bad_redshift', 'distances.missing_omega_de', 'distances.w_without_law']);
    expect(issues.every((issue) => issue.path && issue.fix)).toBe(true);
    expect(issuesOf(() => computeDistanceTable({ ...BASE, redshifts: [] }))[0].code).toBe('distances.no_redshifts');
    expect(issuesOf(() => computeDistanceTable({ ...BASE, omegaDarkEnergy: 2.5, omegaMatter: 0.1 }))[0].code).toBe('distances.unphysical_model');
  });

  it('writes an infinite age (de Sitter) as null in JSON and as an empty CSV cell, never NaN', () => {
    const table = computeDistanceTable({ ...BASE, omegaMatter: 0, omegaDarkEnergy: 1, radiation: false, redshifts: [1] });
    expect(table.today.ageGyr).toBeNull();
    expect(JSON.parse(formatDistanceTableJson(table)).rows[0].age_gyr).toBeNull();
    expect(JSON.parse(formatDistanceTableJson(table)).today.age_gyr).toBeNull();
    expect(formatDistanceTableCsv(table).split('\n')[1].split(',')[8]).toBe('');
    expect(formatDistanceTableText(table)).not.toContain('NaN');
  });
});

describe('formatDistanceTableText / Csv / Json', () => {
  const table = computeDistanceTable({ ...BASE, redshifts: [0.5, 2] });
  it('has one text line per redshift under a model summary, and CSV values that read back exactly', () => {
    const lines = formatDistanceTableText(table).trimEnd().split('\n');
    expect(lines[0]).toBe('Curved universe, dark energy: cosmological constant, radiation from T_CMB = 2.7255 K, N_eff = 3.046');
    expect(lines.slice(-2).map((line) => Number(line.trim().split(/\s+/)[0]))).toEqual([0.5, 2]);
    const csv = formatDistanceTableCsv(table).trimEnd().split('\n');
    expect(csv).toHaveLength(3);
    expect(Number(csv[2].split(',')[4])).toBe(table.rows[1].luminosityDistanceMpc);
    expect(JSON.parse(formatDistanceTableJson(table)).rows[1].luminosity_distance_mpc).toBe(table.rows[1].luminosityDistanceMpc);
  });

  it('writes every JSON key in snake_case, as every other JSON file of a run', () => {
    const keys: string[] = [];
    const collect = (value: unknown): void => {
      if (Array.isArray(value)) value.forEach(collect);
      else if (value !== null && typeof value === 'object') for (const [key, inner] of Object.entries(value)) { keys.push(key); collect(inner); }
    };
    const document = JSON.parse(formatDistanceTableJson(table));
    collect(document);
    expect(keys.filter((key) => !/^[a-z0-9]+(_[a-z0-9]+)*$/.test(key))).toEqual([]);
    expect(Object.keys(document.rows[0])).toEqual(['z', 'expansion_rate', 'comoving_distance_mpc', 'transverse_comoving_distance_mpc',
      'luminosity_distance_mpc', 'angular_diameter_distance_mpc', 'distance_modulus_mag', 'lookback_time_gyr', 'age_gyr', 'deceleration_parameter']);
    expect(document.model).toMatchObject({ dark_energy: 'lambda', omega_k: table.model.omegaCurvature, h0: table.model.h0KmPerSPerMpc });
  });
});

describe('readRedshiftFile', () => {
  const directory = mkdtempSync(join(tmpdir(), 'candela-z-'));
  const write = (name: string, text: string): string => { const file = join(directory, name); writeFileSync(file, text); return file; };

  it('reads one redshift per line, skipping blanks and # comments', () => {
    expect(readRedshiftFile(write('list.txt', '# redshifts\n0.1\n\n0.5\n2\n'))).toEqual([0.1, 0.5, 2]);
  });

  it('reads a named column of a CSV table, or the column named z', () => {
    const file = write('table.csv', 'name,zcmb,z\nsn1,0.11,0.1\nsn2,0.52,0.5\n');
    expect(readRedshiftFile(file)).toEqual([0.1, 0.5]);
    expect(readRedshiftFile(file, 'zcmb')).toEqual([0.11, 0.52]);
  });

  it('reports the line of a bad cell, an unknown column and a missing file', () => {
    const bad = issuesOf(() => readRedshiftFile(write('bad.txt', '0.1\nabc\n')));
    expect(bad[0]).toMatchObject({ code: 'distances.bad_redshift', line: 2 });
    expect(issuesOf(() => readRedshiftFile(write('cols.csv', 'a,b\n1,2\n')))[0].code).toBe('distances.no_redshift_column');
    expect(issuesOf(() => readRedshiftFile(join(directory, 'missing.txt')))[0].code).toBe('distances.file_unreadable');
  });
});
