import type { DistanceTableFacts } from './distanceTableFacts.js';
import { DISTANCE_TABLE_COLUMNS } from './distanceTableFacts.js';

/** Display names of the dark-energy laws (a law without one is printed by its key). */
const LAW_NAMES: Record<string, string> = { lambda: 'cosmological constant', constant_w: 'constant w', cpl: 'w0-wa (CPL)' };

/**
 * The table as aligned text for a terminal: a model summary, the z-independent
 * facts, then one line per redshift (8 significant digits).
 * @param table the model, its facts and the rows.
 * @returns the text, ending in a line break.
 * @throws nothing.
 * @example distanceTableText(table).split('\n')[0] // => 'Flat universe, dark energy: w0-wa (CPL), no radiation'
 */
export function distanceTableText(table: DistanceTableFacts): string {
  const { model, today } = table;
  const number = (value: number | null, digits = 8): string => (value === null ? 'inf' : Number(value.toPrecision(digits)).toString());
  const lines = [
    `${model.flat ? 'Flat' : 'Curved'} universe, dark energy: ${LAW_NAMES[model.darkEnergy] ?? model.darkEnergy}, ` +
      (model.cmbTemperatureK > 0 ? `radiation from T_CMB = ${model.cmbTemperatureK} K, N_eff = ${model.effectiveNeutrinoSpecies}` : 'no radiation'),
    `  Omega_m = ${number(model.omegaMatter)}  Omega_DE = ${number(model.omegaDarkEnergy)}  Omega_k = ${number(model.omegaCurvature)}  Omega_r = ${number(model.omegaRadiation)}` +
      (model.darkEnergy === 'lambda' ? '' : `  w0 = ${model.w0}`) + (model.darkEnergy === 'cpl' ? `  wa = ${model.wa}` : '') + `  H0 = ${model.h0KmPerSPerMpc} km/s/Mpc`,
    `  age today ${number(today.ageGyr, 6)} Gyr, q0 = ${number(today.q0, 6)}, ` +
      (today.accelerationRedshift === null ? 'no onset of acceleration below z = 1000' : `acceleration began at z = ${number(today.accelerationRedshift, 5)}`) +
      `, c/H0 = ${number(today.hubbleDistanceMpc, 8)} Mpc, 1/H0 = ${number(today.hubbleTimeGyr, 6)} Gyr`,
    '',
  ];
  const header = DISTANCE_TABLE_COLUMNS.map(([, label, unit]) => (unit ? `${label} [${unit}]` : label));
  const body = table.rows.map((row) => DISTANCE_TABLE_COLUMNS.map(([key]) => number(row[key])));
  const widths = header.map((label, j) => Math.max(label.length, ...body.map((cells) => cells[j].length)));
  for (const cells of [header, ...body]) lines.push(cells.map((cell, j) => cell.padStart(widths[j])).join('  '));
  return `${lines.join('\n')}\n`;
}
