import { CandelaError } from '../../errors.js';
import type { Issue } from '../../errors.js';
import { CMB_TEMPERATURE_K, createCosmology } from '../../cosmology/index.js';
import type { CosmologyParameters } from '../../cosmology/index.js';
import { distanceTableCsv, distanceTableJson, distanceTableText } from '../../output/index.js';
import type { DistanceTableRow } from '../../output/index.js';

/**
 * Plain options of a distance table (no configuration file involved): the
 * cosmology's parameters, with radiation switched on or off as a whole
 * (cmbTemperatureK, default 2.7255 K, is then read only when it is on).
 */
export interface DistanceTableOptions extends CosmologyParameters {
  /** Photons + massless neutrinos on or off. */
  radiation: boolean;
  /** Redshifts to tabulate, >= 0, in the order wanted. */
  redshifts: readonly number[];
}

/** One row: distances in Mpc, modulus in mag, times in Gyr; ageGyr is null for an infinite age (the shape the output formats print). */
export type { DistanceTableRow };

/** The table with the facts of the model that do not depend on z. */
export interface DistanceTable {
  model: Required<CosmologyParameters> & { omegaCurvature: number; omegaRadiation: number; method: string };
  today: { ageGyr: number | null; q0: number; accelerationRedshift: number | null; hubbleDistanceMpc: number; hubbleTimeGyr: number };
  rows: DistanceTableRow[];
}

/**
 * Builds a cosmology from plain options and tabulates, at each redshift,
 * E(z), D_C, D_M, D_L, D_A (Mpc), mu (mag), lookback time and age (Gyr) and q(z).
 * Cost: one scalar quadrature per quantity and redshift (~0.1 ms per row).
 * @param options model and redshifts (units in the option names).
 * @throws CandelaError listing every bad option (path = option field, with a fix), or the reason the model is unphysical.
 * @example computeDistanceTable({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70, radiation: false, redshifts: [1] })
 *   .rows[0].luminosityDistanceMpc // => 6607.66
 */
export function computeDistanceTable(options: DistanceTableOptions): DistanceTable {
  const issues: Issue[] = [];
  if (options.redshifts.length === 0) {
    issues.push({ code: 'distances.no_redshifts', path: 'redshifts', message: 'no redshifts were given', fix: 'give at least one redshift >= 0' });
  }
  options.redshifts.forEach((z, i) => {
    if (!(Number.isFinite(z) && z >= 0)) {
      issues.push({ code: 'distances.bad_redshift', path: 'redshifts', row: i + 1, message: `redshift number ${i + 1} is not usable`,
        expected: 'a finite number >= 0', found: String(z), fix: 'give redshifts as plain numbers >= 0, e.g. 0.5' });
    }
  });
  if (!options.flat && options.omegaDarkEnergy === undefined) {
    issues.push({ code: 'distances.missing_omega_de', path: 'omegaDarkEnergy', message: 'a curved model needs Omega_DE',
      fix: 'give Omega_DE, or make the model flat (Omega_DE = 1 - Omega_m - Omega_r)' });
  }
  if (options.darkEnergy === 'lambda' && ((options.w0 ?? -1) !== -1 || (options.wa ?? 0) !== 0)) {
    issues.push({ code: 'distances.w_without_law', path: 'darkEnergy', message: 'w0 or wa was given for the cosmological-constant model',
      expected: 'w0 = -1, wa = 0', found: `w0 = ${options.w0 ?? -1}, wa = ${options.wa ?? 0}`, fix: 'choose the constant-w or the w0-wa model to vary w' });
  } else if (options.darkEnergy === 'constant_w' && (options.wa ?? 0) !== 0) {
    issues.push({ code: 'distances.wa_without_law', path: 'wa', message: 'wa was given for the constant-w model',
      expected: 'wa = 0', found: String(options.wa), fix: 'choose the w0-wa model to vary wa' });
  }
  if (issues.length) throw new CandelaError(issues);

  const outcome = createCosmology({
    darkEnergy: options.darkEnergy, flat: options.flat, omegaMatter: options.omegaMatter,
    omegaDarkEnergy: options.flat ? undefined : options.omegaDarkEnergy, w0: options.w0, wa: options.wa,
    h0KmPerSPerMpc: options.h0KmPerSPerMpc, effectiveNeutrinoSpecies: options.effectiveNeutrinoSpecies,
    cmbTemperatureK: options.radiation ? (options.cmbTemperatureK ?? CMB_TEMPERATURE_K) : 0,
  });
  if (!outcome.ok) {
    throw new CandelaError({ code: 'distances.unphysical_model', path: 'model', message: `the model cannot be computed: ${outcome.reason}`,
      fix: 'change Omega_m, Omega_DE, w0 or wa so that H(z)^2 stays positive at all redshifts (and H0 > 0, Omega_m >= 0)' });
  }
  const cosmology = outcome.cosmology;
  const finiteOrNull = (value: number): number | null => (Number.isFinite(value) ? value : null);
  const rows = options.redshifts.map((z): DistanceTableRow => ({
    z,
    expansionRate: cosmology.expansionRate(z),
    comovingDistanceMpc: cosmology.comovingDistanceMpc(z),
    transverseComovingDistanceMpc: cosmology.transverseComovingDistanceMpc(z),
    luminosityDistanceMpc: cosmology.luminosityDistanceMpc(z),
    angularDiameterDistanceMpc: cosmology.angularDiameterDistanceMpc(z),
    distanceModulusMag: cosmology.distanceModulusMag(z),
    lookbackTimeGyr: cosmology.lookbackTimeGyr(z),
    ageGyr: finiteOrNull(cosmology.ageGyr(z)),
    decelerationParameter: cosmology.decelerationParameter(z),
  }));
  return {
    model: { ...cosmology.parameters, omegaCurvature: cosmology.omegaCurvature, omegaRadiation: cosmology.omegaRadiation, method: cosmology.method },
    today: { ageGyr: finiteOrNull(cosmology.ageTodayGyr), q0: cosmology.q0, accelerationRedshift: cosmology.accelerationRedshift(),
      hubbleDistanceMpc: cosmology.hubbleDistanceMpc, hubbleTimeGyr: cosmology.hubbleTimeGyr },
    rows,
  };
}

/** The redshift-file reader of `candela distances --z-file` (the data layer's). */
export { readRedshiftFile } from '../../data/index.js';

/**
 * The table as aligned text for a terminal (the output layer's distanceTableText).
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example formatDistanceTableText(table).split('\n')[0] // => 'Flat universe, dark energy: w0-wa (CPL), no radiation'
 */
export function formatDistanceTableText(table: DistanceTable): string {
  return distanceTableText(table);
}

/**
 * The table as one JSON object { model, today, rows } (the output layer's distanceTableJson).
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example JSON.parse(formatDistanceTableJson(table)).rows[0].distance_modulus_mag // => 44.1002...
 */
export function formatDistanceTableJson(table: DistanceTable): string {
  return distanceTableJson(table);
}

/**
 * The rows as CSV (the output layer's distanceTableCsv).
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example formatDistanceTableCsv(table).split('\n')[0] // => 'z,H_over_H0,D_C_Mpc,D_M_Mpc,D_L_Mpc,D_A_Mpc,mu_mag,t_lookback_Gyr,t_age_Gyr,q'
 */
export function formatDistanceTableCsv(table: DistanceTable): string {
  return distanceTableCsv(table);
}
