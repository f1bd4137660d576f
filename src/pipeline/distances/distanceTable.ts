import { readFileSync } from 'node:fs';
import { CandelaError } from '../../errors.js';
import type { Issue } from '../../errors.js';
import { CMB_TEMPERATURE_K, createCosmology } from '../../cosmology/index.js';
import type { CosmologyParameters, DarkEnergyLaw } from '../../cosmology/index.js';

/** CMB temperature used when radiation is switched on without a temperature, K (Fixsen 2009, ApJ 707, 916). */
/** Photon temperature when radiation is on: the cosmology layer's constant (Fixsen 2009). */
export const DEFAULT_CMB_TEMPERATURE_K = CMB_TEMPERATURE_K;

/** Plain options of a distance table (no configuration file involved). */
export interface DistanceTableOptions {
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  omegaMatter: number;
  /** Required when flat = false. */
  omegaDarkEnergy?: number;
  w0?: number;
  wa?: number;
  h0KmPerSPerMpc: number;
  /** Photons + massless neutrinos on (default T_CMB 2.7255 K) or off. */
  radiation: boolean;
  /** T_CMB in K when radiation is on. */
  cmbTemperatureK?: number;
  effectiveNeutrinoSpecies?: number;
  /** Redshifts to tabulate, >= 0, in the order wanted. */
  redshifts: readonly number[];
}

/** One row: distances in Mpc, modulus in mag, times in Gyr; ageGyr is null for an infinite age. */
export interface DistanceTableRow {
  z: number; expansionRate: number; comovingDistanceMpc: number; transverseComovingDistanceMpc: number;
  luminosityDistanceMpc: number; angularDiameterDistanceMpc: number; distanceModulusMag: number;
  lookbackTimeGyr: number; ageGyr: number | null; decelerationParameter: number;
}

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
    cmbTemperatureK: options.radiation ? (options.cmbTemperatureK ?? DEFAULT_CMB_TEMPERATURE_K) : 0,
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

/** Column keys, short labels and units, in output order (shared by the three formats). */
const COLUMNS: [keyof DistanceTableRow, string, string][] = [
  ['z', 'z', ''], ['expansionRate', 'H/H0', ''], ['comovingDistanceMpc', 'D_C', 'Mpc'],
  ['transverseComovingDistanceMpc', 'D_M', 'Mpc'], ['luminosityDistanceMpc', 'D_L', 'Mpc'],
  ['angularDiameterDistanceMpc', 'D_A', 'Mpc'], ['distanceModulusMag', 'mu', 'mag'],
  ['lookbackTimeGyr', 't_lookback', 'Gyr'], ['ageGyr', 't_age', 'Gyr'], ['decelerationParameter', 'q', ''],
];

const LAW_NAMES: Record<DarkEnergyLaw, string> = { lambda: 'cosmological constant', constant_w: 'constant w', cpl: 'w0-wa (CPL)' };

/**
 * The table as aligned text for a terminal: a model summary, the z-independent
 * facts, then one line per redshift (8 significant digits).
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example formatDistanceTableText(table).split('\n')[0] // => 'Flat universe, dark energy: w0-wa (CPL), no radiation'
 */
export function formatDistanceTableText(table: DistanceTable): string {
  const { model, today } = table;
  const number = (value: number | null, digits = 8): string => (value === null ? 'inf' : Number(value.toPrecision(digits)).toString());
  const lines = [
    `${model.flat ? 'Flat' : 'Curved'} universe, dark energy: ${LAW_NAMES[model.darkEnergy]}, ` +
      (model.cmbTemperatureK > 0 ? `radiation from T_CMB = ${model.cmbTemperatureK} K, N_eff = ${model.effectiveNeutrinoSpecies}` : 'no radiation'),
    `  Omega_m = ${number(model.omegaMatter)}  Omega_DE = ${number(model.omegaDarkEnergy)}  Omega_k = ${number(model.omegaCurvature)}  Omega_r = ${number(model.omegaRadiation)}` +
      (model.darkEnergy === 'lambda' ? '' : `  w0 = ${model.w0}`) + (model.darkEnergy === 'cpl' ? `  wa = ${model.wa}` : '') + `  H0 = ${model.h0KmPerSPerMpc} km/s/Mpc`,
    `  age today ${number(today.ageGyr, 6)} Gyr, q0 = ${number(today.q0, 6)}, ` +
      (today.accelerationRedshift === null ? 'no onset of acceleration below z = 1000' : `acceleration began at z = ${number(today.accelerationRedshift, 5)}`) +
      `, c/H0 = ${number(today.hubbleDistanceMpc, 8)} Mpc, 1/H0 = ${number(today.hubbleTimeGyr, 6)} Gyr`,
    '',
  ];
  const header = COLUMNS.map(([, label, unit]) => (unit ? `${label} [${unit}]` : label));
  const body = table.rows.map((row) => COLUMNS.map(([key]) => number(row[key])));
  const widths = header.map((label, j) => Math.max(label.length, ...body.map((cells) => cells[j].length)));
  for (const cells of [header, ...body]) lines.push(cells.map((cell, j) => cell.padStart(widths[j])).join('  '));
  return `${lines.join('\n')}\n`;
}

/** JSON key of each row field: snake_case with the unit last, as in every other JSON file candela writes. */
const ROW_KEYS: Record<keyof DistanceTableRow, string> = {
  z: 'z', expansionRate: 'expansion_rate', comovingDistanceMpc: 'comoving_distance_mpc',
  transverseComovingDistanceMpc: 'transverse_comoving_distance_mpc', luminosityDistanceMpc: 'luminosity_distance_mpc',
  angularDiameterDistanceMpc: 'angular_diameter_distance_mpc', distanceModulusMag: 'distance_modulus_mag',
  lookbackTimeGyr: 'lookback_time_gyr', ageGyr: 'age_gyr', decelerationParameter: 'deceleration_parameter',
};

/**
 * The table as one JSON object { model, today, rows } with full double precision
 * and snake_case keys (the model's densities under the parameter names omega_m,
 * omega_de, omega_k, omega_r, w0, wa, h0 in km/s/Mpc); infinite ages are null.
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example JSON.parse(formatDistanceTableJson(table)).rows[0].distance_modulus_mag // => 44.1002...
 */
export function formatDistanceTableJson(table: DistanceTable): string {
  const { model, today } = table;
  const document = {
    model: {
      dark_energy: model.darkEnergy, flat: model.flat, omega_m: model.omegaMatter, omega_de: model.omegaDarkEnergy,
      omega_k: model.omegaCurvature, omega_r: model.omegaRadiation, w0: model.w0, wa: model.wa, h0: model.h0KmPerSPerMpc,
      cmb_temperature_k: model.cmbTemperatureK, effective_neutrino_species: model.effectiveNeutrinoSpecies, method: model.method,
    },
    today: {
      age_gyr: today.ageGyr, q0: today.q0, acceleration_redshift: today.accelerationRedshift,
      hubble_distance_mpc: today.hubbleDistanceMpc, hubble_time_gyr: today.hubbleTimeGyr,
    },
    rows: table.rows.map((row) => Object.fromEntries(Object.entries(ROW_KEYS).map(([field, key]) => [key, row[field as keyof DistanceTableRow]]))),
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}

/**
 * The rows as CSV (RFC 4180), one header line with units in the names
 * (z,H_over_H0,D_C_Mpc,...), full double precision; an infinite age is an empty cell.
 * @param table from computeDistanceTable.
 * @throws nothing.
 * @example formatDistanceTableCsv(table).split('\n')[0] // => 'z,H_over_H0,D_C_Mpc,D_M_Mpc,D_L_Mpc,D_A_Mpc,mu_mag,t_lookback_Gyr,t_age_Gyr,q'
 */
export function formatDistanceTableCsv(table: DistanceTable): string {
  const header = COLUMNS.map(([, label, unit]) => (label === 'H/H0' ? 'H_over_H0' : unit ? `${label}_${unit}` : label));
  const lines = [header.join(',')];
  for (const row of table.rows) lines.push(COLUMNS.map(([key]) => (row[key] === null ? '' : String(row[key]))).join(','));
  return `${lines.join('\n')}\n`;
}

/**
 * Reads redshifts from a text file: one per line, or a column of a CSV /
 * whitespace table with a header line (the column named by `column`, else the
 * only column, else one named z or redshift). Blank lines and lines starting
 * with # are skipped.
 * @param file path (relative to the working directory).
 * @param column header name of the column to use (optional).
 * @throws CandelaError for a missing file, an ambiguous or missing column, or a cell that is not a number (with the line).
 * @example readRedshiftFile('redshifts.txt') // => [0.1, 0.5, 1]
 */
export function readRedshiftFile(file: string, column?: string): number[] {
  let text: string;
  try { text = readFileSync(file, 'utf8'); } catch (error) {
    throw new CandelaError({ code: 'distances.file_unreadable', file, path: 'redshiftFile', message: `cannot read the redshift file (${(error as NodeJS.ErrnoException).code ?? 'error'})`,
      fix: 'check the path; it is resolved from the directory candela runs in' });
  }
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/).map((line, i) => ({ cells: line.trim().split(/\s*[,;\t]\s*|\s+/), line: i + 1, blank: !line.trim() || line.trim().startsWith('#') }))
    .filter((entry) => !entry.blank);
  if (lines.length === 0) throw new CandelaError({ code: 'distances.empty_file', file, path: 'redshiftFile', message: 'the redshift file has no data lines', fix: 'put one redshift per line' });
  const hasHeader = lines[0].cells.some((cell) => cell !== '' && !Number.isFinite(Number(cell)));
  const names = hasHeader ? lines[0].cells : [];
  let index = 0;
  if (column !== undefined || lines[0].cells.length > 1) {
    const wanted = column ?? names.find((name) => /^(z|redshift)$/i.test(name));
    index = wanted === undefined ? -1 : names.indexOf(wanted);
    if (index < 0) {
      throw new CandelaError({ code: 'distances.no_redshift_column', file, line: lines[0].line, path: 'redshiftColumn',
        message: hasHeader ? 'cannot tell which column holds the redshifts' : 'the file has several columns but no header line naming them',
        expected: column ? `a column named ${column}` : 'one column, or a header with a column named z or redshift', found: lines[0].cells.join(', '),
        fix: hasHeader ? 'name the column to use' : 'add a header line, or keep one redshift per line' });
    }
  }
  const issues: Issue[] = [];
  const values = lines.slice(hasHeader ? 1 : 0).map(({ cells, line }) => {
    const value = Number(cells[index]);
    if (cells[index] === undefined || cells[index] === '' || !Number.isFinite(value)) {
      issues.push({ code: 'distances.bad_redshift', file, line, path: 'redshiftFile', message: 'the redshift cell is not a number', found: String(cells[index] ?? ''), fix: 'write the redshift as a plain number, e.g. 0.5' });
    }
    return value;
  });
  if (issues.length) throw new CandelaError(issues);
  return values;
}
