import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { computeDistanceTable, formatDistanceTableCsv, formatDistanceTableJson, formatDistanceTableText } from '../../../src/pipeline/index.js';
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
