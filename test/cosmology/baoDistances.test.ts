import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { BAO_DISTANCE_KINDS, baoDistanceRatios, baoDistances, createCosmology } from '../../src/cosmology/index.js';
import type { BaoDistanceKind, Cosmology, CosmologyParameters } from '../../src/cosmology/index.js';
import { choleskyInPlace, choleskySolveInPlace } from '../../src/math/index.js';
import { loadReferenceRows, parametersForRow, relativeDifference } from './referenceDistances.js';

/** Speed of light, km/s (exact, SI definition). */
const C_KM_PER_S = 299792.458;
/** The core's distances agree with astropy to ~1e-12 (createCosmology.reference.test.ts); 1e-10 leaves room. */
const REFERENCE_RELATIVE = 1e-10;

function build(p: CosmologyParameters): Cosmology {
  const outcome = createCosmology(p);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

describe('baoDistances', () => {
  const rows = loadReferenceRows().filter((row) => row.z <= 10);
  const cases = [...new Set(rows.map((row) => row.case))];

  it.each(cases)('matches astropy 5.2.1 D_M, D_H = c/H, D_A and D_V = [z D_M^2 D_H]^(1/3) for %s (../shared/reference/distances.csv)', (name) => {
    const caseRows = rows.filter((row) => row.case === name);
    const cosmology = build(parametersForRow(caseRows[0]));
    // Reversed order: the function must return values in the caller's order.
    const reversed = caseRows.slice().reverse();
    const distances = baoDistances(cosmology, Float64Array.from(reversed, (row) => row.z));
    reversed.forEach((row, i) => {
      const hubbleMpc = C_KM_PER_S / row.H0 / row.E_z;
      // D_V from the reference's own D_M and E(z), Eisenstein et al. (2005) eq. 2.
      const volumeMpc = Math.cbrt(row.z * row.transverse_comoving_distance_Mpc ** 2 * hubbleMpc);
      const at = `${name} z = ${row.z}`;
      expect(relativeDifference(distances.transverseComovingMpc[i], row.transverse_comoving_distance_Mpc), at).toBeLessThan(REFERENCE_RELATIVE);
      expect(relativeDifference(distances.hubbleMpc[i], hubbleMpc), at).toBeLessThan(REFERENCE_RELATIVE);
      expect(relativeDifference(distances.angularDiameterMpc[i], row.angular_diameter_distance_Mpc), at).toBeLessThan(REFERENCE_RELATIVE);
      expect(relativeDifference(distances.volumeAveragedMpc[i], volumeMpc), at).toBeLessThan(REFERENCE_RELATIVE);
    });
  });

  it('obeys D_V^3 = z D_M^2 D_H and D_A = D_M / (1 + z) in a closed w0waCDM model (identities, Eisenstein et al. 2005 eq. 2; Hogg 1999 eq. 18)', () => {
    const cosmology = build({ darkEnergy: 'cpl', flat: false, omegaMatter: 0.32, omegaDarkEnergy: 0.75, w0: -0.85, wa: -0.4, h0KmPerSPerMpc: 67, cmbTemperatureK: 2.7255 });
    const z = Float64Array.of(0.1, 0.51, 0.93, 1.48, 2.33, 4);
    const d = baoDistances(cosmology, z);
    z.forEach((zi, i) => {
      expect(relativeDifference(d.volumeAveragedMpc[i] ** 3, zi * d.transverseComovingMpc[i] ** 2 * d.hubbleMpc[i])).toBeLessThan(1e-14);
      expect(relativeDifference(d.angularDiameterMpc[i] * (1 + zi), d.transverseComovingMpc[i])).toBeLessThan(1e-15);
      expect(d.transverseComovingMpc[i]).toBeLessThan(cosmology.comovingDistanceMpc(zi));
    });
  });

  it('reproduces the Einstein-de Sitter closed forms D_H = (c/H0)(1+z)^-3/2 and D_M = (2c/H0)(1 - (1+z)^-1/2) (Hogg 1999; common practice)', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 1, omegaDarkEnergy: 0, h0KmPerSPerMpc: 70 });
    const z = Float64Array.of(0.3, 1, 2.5);
    const d = baoDistances(cosmology, z);
    const hubble = C_KM_PER_S / 70;
    z.forEach((zi, i) => {
      expect(relativeDifference(d.hubbleMpc[i], hubble * (1 + zi) ** -1.5)).toBeLessThan(1e-13);
      expect(relativeDifference(d.transverseComovingMpc[i], 2 * hubble * (1 - 1 / Math.sqrt(1 + zi)))).toBeLessThan(1e-13);
    });
  });

  it('gives D_V -> 0 and D_H -> c/H0 at z = 0, and the flat limit of a curved model with Omega_k = 0', () => {
    const flat = build({ darkEnergy: 'constant_w', flat: true, omegaMatter: 0.3, w0: -0.9, h0KmPerSPerMpc: 70 });
    const curved = build({ darkEnergy: 'constant_w', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 0.7, w0: -0.9, h0KmPerSPerMpc: 70 });
    const z = Float64Array.of(0, 0.7, 2);
    const a = baoDistances(flat, z);
    const b = baoDistances(curved, z);
    expect(a.volumeAveragedMpc[0]).toBe(0);
    expect(a.hubbleMpc[0]).toBeCloseTo(C_KM_PER_S / 70, 10);
    for (let i = 1; i < z.length; i++) {
      expect(relativeDifference(b.transverseComovingMpc[i], a.transverseComovingMpc[i])).toBeLessThan(1e-13);
      expect(relativeDifference(b.volumeAveragedMpc[i], a.volumeAveragedMpc[i])).toBeLessThan(1e-13);
    }
  });
});

describe('baoDistanceRatios', () => {
  const table = readFileSync('../shared/data-real/desi-dr2-bao/measurements.csv', 'utf8').trim().split('\n').slice(1).map((line) => line.split(','));
  const covariance = readFileSync('../shared/data-real/desi-dr2-bao/covariance.txt', 'utf8').split('\n')
    .filter((line) => line.trim() && !line.startsWith('#')).flatMap((line) => line.trim().split(/\s+/).map(Number));
  const quantityKind: Record<string, BaoDistanceKind> = { DV_over_rd: 'volume_averaged', DM_over_rd: 'transverse_comoving', DH_over_rd: 'hubble' };
  const redshifts = Float64Array.from(table, (cells) => Number(cells[1]));
  const kinds = table.map((cells) => quantityKind[cells[2]]);
  const values = Float64Array.from(table, (cells) => Number(cells[3]));
  const sigmas = Float64Array.from(table, (cells) => Number(cells[4]));
  const count = values.length;
  const lower = Float64Array.from(covariance);
  if (!choleskyInPlace(lower, count).ok) throw new Error('DESI covariance is not positive definite');

  /** Flat LambdaCDM with radiation; h = 0.68 is arbitrary: BAO ratios depend on h r_d only (up to radiation, < 1e-4). */
  function ratios(omegaMatter: number, hTimesSoundHorizonMpc: number): Float64Array {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter, h0KmPerSPerMpc: 68, cmbTemperatureK: 2.7255 });
    return baoDistanceRatios(cosmology, redshifts, kinds, hTimesSoundHorizonMpc / 0.68);
  }
  function chiSquare(model: Float64Array): number {
    const residual = Float64Array.from(values, (value, i) => value - model[i]);
    const solved = choleskySolveInPlace(lower, count, Float64Array.from(residual));
    return residual.reduce((sum, r, i) => sum + r * solved[i], 0);
  }

  it('puts every DESI DR2 measurement within 2.5 sigma of the published BAO-only flat LambdaCDM best fit (DESI Collaboration 2025, arXiv:2503.14738: Omega_m = 0.2975, h r_d = 101.54 Mpc)', () => {
    const model = ratios(0.2975, 101.54);
    for (let i = 0; i < count; i++) expect(Math.abs(model[i] - values[i]) / sigmas[i], `${table[i][0]} ${table[i][2]}`).toBeLessThan(2.5);
  });

  it('has its chi-square minimum at the published DESI DR2 best fit, within 0.15 sigma in Omega_m and h r_d (same source; the published numbers are rounded)', () => {
    // h r_d profiled analytically: the model is linear in s = 1 / (h r_d); Omega_m by golden-section search.
    const profile = (omegaMatter: number): { chi2: number; hrd: number } => {
      const unit = ratios(omegaMatter, 1);
      const solvedUnit = choleskySolveInPlace(lower, count, Float64Array.from(unit));
      const s = values.reduce((sum, v, i) => sum + v * solvedUnit[i], 0) / unit.reduce((sum, u, i) => sum + u * solvedUnit[i], 0);
      return { chi2: chiSquare(unit.map((u) => u * s)), hrd: 1 / s };
    };
    let low = 0.25;
    let high = 0.35;
    const golden = (Math.sqrt(5) - 1) / 2;
    while (high - low > 1e-6) {
      const left = high - golden * (high - low);
      const right = low + golden * (high - low);
      if (profile(left).chi2 < profile(right).chi2) high = right;
      else low = left;
    }
    const best = 0.5 * (low + high);
    expect(Math.abs(best - 0.2975)).toBeLessThan(0.15 * 0.0086);
    expect(Math.abs(profile(best).hrd - 101.54)).toBeLessThan(0.15 * 0.73);
  });

  it('returns each row its own kind divided by r_d, in the caller order', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 });
    const z = Float64Array.of(2, 0.5, 0.5, 1, 1.5);
    const rowKinds: BaoDistanceKind[] = ['hubble', 'volume_averaged', 'transverse_comoving', 'angular_diameter', 'hubble'];
    const result = baoDistanceRatios(cosmology, z, rowKinds, 150);
    const d = baoDistances(cosmology, z);
    expect(Array.from(result)).toEqual([d.hubbleMpc[0] / 150, d.volumeAveragedMpc[1] / 150, d.transverseComovingMpc[2] / 150,
      d.angularDiameterMpc[3] / 150, d.hubbleMpc[4] / 150]);
    expect(BAO_DISTANCE_KINDS).toHaveLength(4);
  });

  it('reports an unknown kind, a bad r_d and mismatched lengths', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 });
    const z = Float64Array.of(0.5);
    expect(() => baoDistanceRatios(cosmology, z, ['DV' as BaoDistanceKind], 147)).toThrow(/unknown BAO distance 'DV'/);
    expect(() => baoDistanceRatios(cosmology, z, ['hubble'], 0)).toThrow(/sound horizon 0 Mpc/);
    expect(() => baoDistanceRatios(cosmology, z, ['hubble'], Number.NaN)).toThrow(/sound horizon NaN Mpc/);
    expect(() => baoDistanceRatios(cosmology, z, ['hubble', 'hubble'], 147)).toThrow(RangeError);
    expect(() => baoDistanceRatios(cosmology, Float64Array.of(-0.5), ['hubble'], 147)).toThrow(/outside the range/);
  });
});
