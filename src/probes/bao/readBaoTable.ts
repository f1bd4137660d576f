import { CandelaError, type Issue } from '../../errors.js';
import { readMeasurementCovariance, readTextLines } from '../../data/index.js';
import type { BaoDistanceKind } from '../../cosmology/index.js';
import { closestWord } from '../../math/index.js';

/**
 * The quantity names a BAO table may use, and the distance each measures
 * over the sound horizon at the drag epoch r_d. These are the names of the
 * DESI releases' tables (DESI Collaboration 2025, arXiv:2503.14738); D_A
 * for older compilations.
 */
export const BAO_QUANTITIES: Readonly<Record<string, BaoDistanceKind>> = {
  DM_over_rd: 'transverse_comoving',
  DH_over_rd: 'hubble',
  DV_over_rd: 'volume_averaged',
  DA_over_rd: 'angular_diameter',
};

/** A BAO table, read and checked. */
export interface BaoTable {
  /** Effective redshift of each row. */
  redshifts: Float64Array;
  /** Distance each row measures (over r_d). */
  kinds: BaoDistanceKind[];
  /** The row's quantity name as written. */
  quantities: string[];
  /** Tracer or label of each row ('' when the table has none). */
  tracers: string[];
  /** Measured ratio per row (dimensionless). */
  values: Float64Array;
  /** Row-major covariance of `values`. */
  covariance: Float64Array;
}

const REDSHIFT_COLUMNS = ['z_eff', 'z'];

/**
 * Reads a BAO table: a CSV file with a header naming at least `z_eff` (or
 * `z`), `quantity` and `value`, optionally `tracer` and `sigma`; and either a
 * covariance file (rows in table order) or, without one, the `sigma` column
 * as independent errors.
 * Cost: O(rows^3) for the covariance check.
 * @param tablePath path of the CSV table; tableName as written by the user.
 * @param covariancePath path of the covariance file, or undefined.
 * @throws CandelaError naming file, line, column and fix for a missing column, a non-numeric cell, an unknown
 *   quantity (with did-you-mean), a redshift <= 0, a value or sigma <= 0, a covariance of the wrong size, asymmetric
 *   or not positive definite.
 * @example readBaoTable('../shared/data-real/desi-dr2-bao/measurements.csv', 'measurements.csv', cov, 'covariance.txt').values.length // 13
 */
export function readBaoTable(tablePath: string, tableName: string, covariancePath: string | undefined, covarianceName: string | undefined): BaoTable {
  const lines = readTextLines(tablePath, tableName);
  const issues: Issue[] = [];
  const bad = (line: number, path: string, message: string, found: string, fix: string) =>
    issues.push({ code: 'bao.bad_cell', file: tableName, line, path, message, found, fix });
  const headerIndex = lines.findIndex((line) => line.trim() !== '' && !line.trim().startsWith('#'));
  if (headerIndex < 0) throw new CandelaError({ code: 'bao.empty_table', file: tableName, message: 'the BAO table has no header and no rows', fix: 'give a CSV header z_eff,quantity,value[,sigma][,tracer] and one row per measurement' });
  const header = lines[headerIndex].split(',').map((cell) => cell.trim());
  const column = (names: readonly string[]) => header.findIndex((name) => names.includes(name));
  const zColumn = column(REDSHIFT_COLUMNS);
  const quantityColumn = column(['quantity']);
  const valueColumn = column(['value']);
  const sigmaColumn = column(['sigma']);
  const tracerColumn = column(['tracer']);
  for (const [index, name] of [[zColumn, 'z_eff'], [quantityColumn, 'quantity'], [valueColumn, 'value']] as const) {
    if (index < 0) {
      issues.push({ code: 'bao.missing_column', file: tableName, line: headerIndex + 1, path: name, message: `the BAO table has no ${name} column`,
        expected: 'a header with z_eff (or z), quantity and value', found: header.join(','), fix: `add a ${name} column (header names are case-sensitive)` });
    }
  }
  if (sigmaColumn < 0 && covariancePath === undefined) {
    issues.push({ code: 'bao.no_errors', file: tableName, line: headerIndex + 1, path: 'sigma', message: 'the BAO table has neither a sigma column nor a covariance file',
      fix: 'add a sigma column of independent errors, or name the covariance file in the configuration' });
  }
  if (issues.length) throw new CandelaError(issues);
  const redshifts: number[] = [];
  const kinds: BaoDistanceKind[] = [];
  const quantities: string[] = [];
  const tracers: string[] = [];
  const values: number[] = [];
  const sigmas: number[] = [];
  for (let index = headerIndex + 1; index < lines.length; index++) {
    const text = lines[index].trim();
    if (text === '' || text.startsWith('#')) continue;
    const line = index + 1;
    const cells = text.split(',').map((cell) => cell.trim());
    if (cells.length !== header.length) {
      bad(line, 'row', `the row has ${cells.length} cells but the header has ${header.length}`, text, 'give every row one cell per header column');
      continue;
    }
    const number = (at: number, name: string, positive: boolean): number => {
      const value = Number(cells[at]);
      if (cells[at] === '' || !Number.isFinite(value)) bad(line, name, `${name} is not a finite number`, cells[at], `write ${name} as a decimal number`);
      else if (positive && !(value > 0)) bad(line, name, `${name} must be positive`, cells[at], `correct ${name} (ratios, redshifts and errors of BAO measurements are > 0)`);
      return value;
    };
    const quantity = cells[quantityColumn];
    const kind = BAO_QUANTITIES[quantity];
    if (!kind) {
      const suggestion = closestWord(quantity, Object.keys(BAO_QUANTITIES));
      issues.push({ code: 'bao.unknown_quantity', file: tableName, line, path: 'quantity', message: `unknown BAO quantity "${quantity}"`,
        expected: `one of ${Object.keys(BAO_QUANTITIES).join(', ')}`, found: `"${quantity}"`,
        fix: suggestion ? `did you mean "${suggestion}"?` : 'name the measured distance ratio with one of the listed quantities' });
    }
    redshifts.push(number(zColumn, 'z_eff', true));
    values.push(number(valueColumn, 'value', true));
    if (sigmaColumn >= 0) sigmas.push(number(sigmaColumn, 'sigma', true));
    kinds.push(kind ?? 'transverse_comoving');
    quantities.push(quantity);
    tracers.push(tracerColumn >= 0 ? cells[tracerColumn] : '');
  }
  if (values.length === 0 && issues.length === 0) issues.push({ code: 'bao.empty_table', file: tableName, message: 'the BAO table has a header but no rows', fix: 'add one row per measurement' });
  if (issues.length) throw new CandelaError(issues);
  const count = values.length;
  let covariance: Float64Array;
  if (covariancePath !== undefined) {
    covariance = readMeasurementCovariance(covariancePath, covarianceName ?? covariancePath, count, 'BAO measurements');
  } else {
    covariance = new Float64Array(count * count);
    for (let i = 0; i < count; i++) covariance[i * count + i] = sigmas[i] ** 2;
  }
  return { redshifts: Float64Array.from(redshifts), kinds, quantities, tracers, values: Float64Array.from(values), covariance };
}
