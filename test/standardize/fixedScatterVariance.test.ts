import { describe, expect, it } from 'vitest';
import type { SupernovaTable } from '../../src/data/index.js';
import { fixedScatterVariance, LENSING_DISPERSION_PER_REDSHIFT } from '../../src/standardize/index.js';

const table = { count: 3, redshift: Float64Array.of(0.1, 0.5, 1.0), redshiftErr: Float64Array.of(0.001, 0, 0.002) } as unknown as SupernovaTable;

describe('fixedScatterVariance (Betoule et al. 2014 error model)', () => {
  it('lensing alone is (0.055 z)^2 (Jonsson et al. 2010)', () => {
    const out = fixedScatterVariance(table, { lensingPerRedshift: LENSING_DISPERSION_PER_REDSHIFT, peculiarVelocityKmPerS: 0, includeRedshiftErrors: false }, new Float64Array(3));
    // by hand: 0.0055^2 = 3.025e-5, 0.0275^2 = 7.5625e-4, 0.055^2 = 3.025e-3
    expect(out[0]).toBeCloseTo(3.025e-5, 16);
    expect(out[1]).toBeCloseTo(7.5625e-4, 16);
    expect(out[2]).toBeCloseTo(3.025e-3, 16);
  });

  it('peculiar velocity alone is ((5 / ln 10) sigma_v / (c z))^2', () => {
    const out = fixedScatterVariance(table, { lensingPerRedshift: 0, peculiarVelocityKmPerS: 300, includeRedshiftErrors: false }, new Float64Array(3));
    // by hand at z = 0.1: 5 / ln 10 = 2.1714724095; 300 / 299792.458 = 1.000692286e-3;
    // 2.1714724095 * 1.000692286e-3 / 0.1 = 0.0217297569; squared 4.72182e-4 mag^2
    expect(out[0]).toBeCloseTo(4.72182e-4, 8);
    expect(out[1]).toBeCloseTo(4.72182e-4 / 25, 9); // scales as 1 / z^2
  });

  it('adds the redshift errors ((5 / ln 10) sigma_z / z)^2 only when asked, in quadrature with the other terms', () => {
    const terms = { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 150, includeRedshiftErrors: true };
    const out = fixedScatterVariance(table, terms, new Float64Array(3));
    const without = fixedScatterVariance(table, { ...terms, includeRedshiftErrors: false }, new Float64Array(3));
    // by hand at z = 0.1: (2.1714724095 * 0.001 / 0.1)^2 = 4.71529e-4 mag^2
    expect(out[0] - without[0]).toBeCloseTo(4.71529e-4, 8);
    expect(out[1]).toBe(without[1]); // sigma_z = 0
  });
});
