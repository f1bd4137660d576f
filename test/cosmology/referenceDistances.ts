/**
 * Loader for ../shared/reference/distances.csv: 390 rows of FLRW distances
 * computed with astropy 5.2.1 (13 cosmologies x {no radiation, T_CMB = 2.7255 K
 * with N_eff = 3.046} x 15 redshifts). See ../shared/reference/README.md.
 */
import { readFileSync } from 'node:fs';
import type { CosmologyParameters, DarkEnergyLaw } from '../../src/cosmology/index.js';

export interface ReferenceRow {
  case: string;
  H0: number; Om0: number; Ode0: number; w0: number; wa: number; Tcmb0: number; Ok0: number; z: number;
  E_z: number;
  comoving_distance_Mpc: number;
  transverse_comoving_distance_Mpc: number;
  luminosity_distance_Mpc: number;
  angular_diameter_distance_Mpc: number;
  distmod_mag: number;
  lookback_time_Gyr: number;
  age_Gyr: number;
  age_today_Gyr: number;
}

export const REFERENCE_PATH = '../shared/reference/distances.csv';

/** All rows, numbers parsed (the case name stays a string). */
export function loadReferenceRows(): ReferenceRow[] {
  const lines = readFileSync(REFERENCE_PATH, 'utf8').split(/\r?\n/).filter((line) => line && !line.startsWith('#'));
  const header = lines[0].split(',');
  return lines.slice(1).map((line) => {
    const cells = line.split(',');
    const row: Record<string, string | number> = {};
    header.forEach((name, i) => { row[name] = name === 'case' ? cells[i] : Number(cells[i]); });
    return row as unknown as ReferenceRow;
  });
}

/**
 * The candela parameters for a reference case: astropy's Flat* classes are
 * flat (Ode0 derived), the others keep the stated Ode0; the law follows w0, wa.
 */
export function parametersForRow(row: ReferenceRow, law?: DarkEnergyLaw): CosmologyParameters {
  const flat = row.case.includes('_flat_');
  const darkEnergy: DarkEnergyLaw = law ?? (row.wa !== 0 ? 'cpl' : row.w0 !== -1 ? 'constant_w' : 'lambda');
  return {
    darkEnergy,
    flat,
    omegaMatter: row.Om0,
    omegaDarkEnergy: flat ? undefined : row.Ode0,
    w0: row.w0,
    wa: row.wa,
    h0KmPerSPerMpc: row.H0,
    cmbTemperatureK: row.Tcmb0,
    effectiveNeutrinoSpecies: 3.046,
  };
}

/** Relative difference |a - b| / |b| (0 when both are 0). */
export function relativeDifference(actual: number, expected: number): number {
  if (actual === expected) return 0;
  return Math.abs(actual - expected) / Math.abs(expected);
}
