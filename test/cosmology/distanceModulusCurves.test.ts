import { describe, expect, it } from 'vitest';
import { distanceModulusBand, distanceModulusCurve, distanceModulusCurves, type CosmologyFamily } from '../../src/cosmology/index.js';
import { loadReferenceRows } from './referenceDistances.js';

/*
 * Expected distance moduli: ../shared/reference/distances.csv (astropy 5.2.1,
 * see ../shared/reference/README.md), case w0waCDM_flat_w0-0.9_wa0.3_rad
 * (Flatw0waCDM, H0 = 70, Om0 = 0.3, T_CMB = 2.7255 K, N_eff = 3.046) and
 * LCDM_flat_Om0.3_norad. createCosmology.reference.test.ts holds candela's
 * distance modulus to 1e-9 mag of these rows; the same bound applies here.
 */
const DISTMOD_ABSOLUTE_MAG = 1e-9;
const rows = loadReferenceRows();
const cplRows = rows.filter((row) => row.case === 'w0waCDM_flat_w0-0.9_wa0.3_rad' && row.z <= 10);
const lcdmRows = rows.filter((row) => row.case === 'LCDM_flat_Om0.3_norad' && row.z <= 10);
const cpl: CosmologyFamily = { darkEnergy: 'cpl', flat: true, cmbTemperatureK: 2.7255, effectiveNeutrinoSpecies: 3.046 };
const lcdm: CosmologyFamily = { darkEnergy: 'lambda', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 };
const redshiftOf = (selected: typeof rows) => Float64Array.from(selected, (row) => row.z);

describe('distanceModulusCurve', () => {
  it('is the astropy distance modulus plus the shift, at the options\' H0 whatever h0 the values hold', () => {
    const z = redshiftOf(cplRows);
    const out = new Float64Array(z.length);
    const ok = distanceModulusCurve(cpl, { values: { omega_m: 0.3, w0: -0.9, wa: 0.3, h0: 50 }, shiftMag: 0.25 }, z, { h0KmPerSPerMpc: 70, maxRedshift: 10 }, out);
    expect(ok).toBe(true);
    cplRows.forEach((row, i) => expect(Math.abs(out[i] - (row.distmod_mag + 0.25)), `z = ${row.z}`).toBeLessThan(DISTMOD_ABSOLUTE_MAG));
  });

  it('scales with H0 as D_L proportional to c/H0 (Hogg 1999, eq. 21): half the H0 adds 5 log10 2 mag', () => {
    const z = redshiftOf(lcdmRows);
    const out = new Float64Array(z.length);
    expect(distanceModulusCurve(lcdm, { values: { omega_m: 0.3 }, shiftMag: 0 }, z, { h0KmPerSPerMpc: 35, maxRedshift: 10 }, out)).toBe(true);
    lcdmRows.forEach((row, i) => expect(Math.abs(out[i] - (row.distmod_mag + 5 * Math.log10(2))), `z = ${row.z}`).toBeLessThan(DISTMOD_ABSOLUTE_MAG));
  });

  it('returns false and leaves `out` untouched for unphysical parameters (negative matter density)', () => {
    const out = new Float64Array(3).fill(7);
    expect(distanceModulusCurve(lcdm, { values: { omega_m: -0.2 }, shiftMag: 0 }, Float64Array.of(0.1, 0.5, 1), { h0KmPerSPerMpc: 70, maxRedshift: 1 }, out)).toBe(false);
    expect(Array.from(out)).toEqual([7, 7, 7]);
  });
});

describe('distanceModulusCurves', () => {
  it('keeps the order of the physical records and leaves the unphysical ones out', () => {
    const z = redshiftOf(lcdmRows);
    const curves = distanceModulusCurves(lcdm, [
      { values: { omega_m: 0.3 }, shiftMag: 1 },
      { values: { omega_m: -0.2 }, shiftMag: 0 },
      { values: { omega_m: 0.3 }, shiftMag: -1 },
    ], z, { h0KmPerSPerMpc: 70, maxRedshift: 10 });
    expect(curves).toHaveLength(2);
    lcdmRows.forEach((row, i) => {
      expect(Math.abs(curves[0][i] - (row.distmod_mag + 1))).toBeLessThan(DISTMOD_ABSOLUTE_MAG);
      expect(Math.abs(curves[1][i] - (row.distmod_mag - 1))).toBeLessThan(DISTMOD_ABSOLUTE_MAG);
    });
  });
});

describe('distanceModulusBand', () => {
  it('gives the type-7 median and 68% band (Hyndman & Fan 1996, definition 7) of the shifted curves', () => {
    const z = redshiftOf(lcdmRows);
    // Three physical curves shifted by -0.1, 0 and +0.1 mag around the astropy curve, and one unphysical record left out.
    // Type 7 with S = 3: position h = 1 + 2p, so p = 0.158655 reads x(1) + 0.31731 (x(2) - x(1)) = -0.1 + 0.031731 mag,
    // p = 0.841345 reads x(2) + 0.68269 (x(3) - x(2)) = +0.068269 mag, and the median is x(2).
    const band = distanceModulusBand(lcdm, [
      { values: { omega_m: 0.3 }, shiftMag: 0.1 },
      { values: { omega_m: -0.2 }, shiftMag: 0 },
      { values: { omega_m: 0.3 }, shiftMag: -0.1 },
      { values: { omega_m: 0.3 }, shiftMag: 0 },
    ], z, { h0KmPerSPerMpc: 70, maxRedshift: 10 });
    expect(band.curves).toBe(3);
    lcdmRows.forEach((row, i) => {
      expect(Math.abs(band.medianMag[i] - row.distmod_mag), `median z = ${row.z}`).toBeLessThan(DISTMOD_ABSOLUTE_MAG);
      expect(Math.abs(band.low68Mag[i] - (row.distmod_mag - 0.1 + 0.031731)), `low68 z = ${row.z}`).toBeLessThan(DISTMOD_ABSOLUTE_MAG);
      expect(Math.abs(band.high68Mag[i] - (row.distmod_mag + 0.068269)), `high68 z = ${row.z}`).toBeLessThan(DISTMOD_ABSOLUTE_MAG);
    });
  });
});
