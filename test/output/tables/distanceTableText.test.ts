import { describe, expect, it } from 'vitest';
import { distanceTableText } from '../../../src/output/index.js';
import { closedLambdaTable } from './distanceTableFixture.js';

describe('distanceTableText', () => {
  const table = closedLambdaTable();
  it('has one text line per redshift under a model summary', () => {
    const lines = distanceTableText(table).trimEnd().split('\n');
    expect(lines[0]).toBe('Curved universe, dark energy: cosmological constant, radiation from T_CMB = 2.7255 K, N_eff = 3.046');
    expect(lines.slice(-2).map((line) => Number(line.trim().split(/\s+/)[0]))).toEqual([0.5, 2]);
  });

  it('writes an infinite age as inf, never NaN', () => {
    const text = distanceTableText({ ...table, today: { ...table.today, ageGyr: null }, rows: [{ ...table.rows[0], ageGyr: null }] });
    expect(text).toContain('age today inf Gyr');
    expect(text).not.toContain('NaN');
  });
});
