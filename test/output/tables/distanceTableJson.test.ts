import { describe, expect, it } from 'vitest';
import { distanceTableJson } from '../../../src/output/index.js';
import { closedLambdaTable } from './distanceTableFixture.js';

describe('distanceTableJson', () => {
  const table = closedLambdaTable();
  it('keeps full double precision', () => {
    expect(JSON.parse(distanceTableJson(table)).rows[1].luminosity_distance_mpc).toBe(table.rows[1].luminosityDistanceMpc);
  });

  it('writes every JSON key in snake_case, as every other JSON file of a run', () => {
    const keys: string[] = [];
    const collect = (value: unknown): void => {
      if (Array.isArray(value)) value.forEach(collect);
      else if (value !== null && typeof value === 'object') for (const [key, inner] of Object.entries(value)) { keys.push(key); collect(inner); }
    };
    const document = JSON.parse(distanceTableJson(table));
    collect(document);
    expect(keys.filter((key) => !/^[a-z0-9]+(_[a-z0-9]+)*$/.test(key))).toEqual([]);
    expect(Object.keys(document.rows[0])).toEqual(['z', 'expansion_rate', 'comoving_distance_mpc', 'transverse_comoving_distance_mpc',
      'luminosity_distance_mpc', 'angular_diameter_distance_mpc', 'distance_modulus_mag', 'lookback_time_gyr', 'age_gyr', 'deceleration_parameter']);
    expect(document.model).toMatchObject({ dark_energy: 'lambda', omega_k: table.model.omegaCurvature, h0: table.model.h0KmPerSPerMpc });
  });

  it('writes an infinite age as null', () => {
    const document = JSON.parse(distanceTableJson({ ...table, today: { ...table.today, ageGyr: null }, rows: [{ ...table.rows[0], ageGyr: null }] }));
    expect(document.today.age_gyr).toBeNull();
    expect(document.rows[0].age_gyr).toBeNull();
  });
});
