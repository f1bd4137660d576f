import { csvField } from '../density/csvField.js';
import type { DistanceTableFacts } from './distanceTableFacts.js';
import { DISTANCE_TABLE_COLUMNS } from './distanceTableFacts.js';

/**
 * The rows as CSV (RFC 4180), one header line with units in the names
 * (z,H_over_H0,D_C_Mpc,...), full double precision; an infinite age is an empty cell.
 * @param table the model, its facts and the rows.
 * @returns the CSV text, ending in a line break.
 * @throws nothing.
 * @example distanceTableCsv(table).split('\n')[0] // => 'z,H_over_H0,D_C_Mpc,D_M_Mpc,D_L_Mpc,D_A_Mpc,mu_mag,t_lookback_Gyr,t_age_Gyr,q'
 */
export function distanceTableCsv(table: DistanceTableFacts): string {
  const header = DISTANCE_TABLE_COLUMNS.map(([, label, unit]) => (label === 'H/H0' ? 'H_over_H0' : unit ? `${label}_${unit}` : label));
  const lines = [header.map(csvField).join(',')];
  for (const row of table.rows) lines.push(DISTANCE_TABLE_COLUMNS.map(([key]) => (row[key] === null ? '' : csvField(row[key] as number))).join(','));
  return `${lines.join('\n')}\n`;
}
