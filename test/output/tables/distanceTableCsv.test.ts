import { describe, expect, it } from 'vitest';
import { distanceTableCsv } from '../../../src/output/index.js';
import { closedLambdaTable } from './distanceTableFixture.js';

describe('distanceTableCsv', () => {
  const table = closedLambdaTable();
  it('writes a header with units in the names and values that read back exactly', () => {
    const csv = distanceTableCsv(table).trimEnd().split('\n');
    expect(csv).toHaveLength(3);
    expect(csv[0]).toBe('z,H_over_H0,D_C_Mpc,D_M_Mpc,D_L_Mpc,D_A_Mpc,mu_mag,t_lookback_Gyr,t_age_Gyr,q');
    expect(Number(csv[2].split(',')[4])).toBe(table.rows[1].luminosityDistanceMpc);
  });

  it('writes an infinite age as an empty cell (RFC 4180), never NaN', () => {
    const csv = distanceTableCsv({ ...table, rows: [{ ...table.rows[0], ageGyr: null }] });
    expect(csv.split('\n')[1].split(',')[8]).toBe('');
    expect(csv).not.toContain('NaN');
  });
});
