import { checkRepeatedRows } from './checkRepeatedRows.js';
import { checkValueBounds, MAX_MAGNITUDE_ERROR_MAG } from './checkValueBounds.js';
import type { IssueList } from './issueList.js';
import type { DataRow } from './locateTableLayout.js';
import type { MappedColumn, ParsedCells } from './parseTableCells.js';
import { NON_NEGATIVE_ERROR_FIELDS, POSITIVE_ERROR_FIELDS, type SupernovaField } from './supernovaField.js';

/**
 * Default largest accepted |z_helio - z|. The CMB dipole (about 370 km/s)
 * moves a redshift by at most 1.2e-3 (1 + z) and peculiar-velocity
 * corrections of up to 1000 km/s by 3.3e-3 (1 + z): at z = 2.3 together
 * about 0.015 (common practice; the four public releases in ../shared differ
 * by at most 0.0034). A larger gap means a wrong column was mapped.
 */
export const DEFAULT_MAX_REDSHIFT_MISMATCH = 0.02;

/** Magnitude errors above this (mag) carry almost no weight; they are counted in one warning (e.g. likely non-Ia objects whose error was inflated). */
export const HUGE_MAGNITUDE_ERROR_MAG = 10;

/** Relative slack on |cov(a,b)| <= sigma_a sigma_b before a light-curve covariance is flagged: the files round to a few digits. */
const CORRELATION_SLACK = 0.01;

const COVARIANCE_PAIRS: Array<[SupernovaField, SupernovaField, SupernovaField]> = [
  ['cov_m_b_x1', 'm_b_err', 'x1_err'],
  ['cov_m_b_color', 'm_b_err', 'color_err'],
  ['cov_x1_color', 'x1_err', 'color_err'],
];

/**
 * Physical checks on parsed rows: z > 0 and z_helio > 0, |z_helio - z| at
 * most `maxRedshiftMismatch`, uncertainties positive (or non-negative for z
 * and host mass), errors above {@link HUGE_MAGNITUDE_ERROR_MAG} (one
 * warning), light-curve covariances implying |correlation| > 1 (warning),
 * values no supernova can have (errors, checkValueBounds), copied rows
 * (errors) and ids repeated with other values (one warning,
 * checkRepeatedRows). Cost O(rows).
 * @param rows the rows the cells came from (for line numbers).
 * @param cells the parsed cells.
 * @param columns the mapped columns (for column names).
 * @param maxRedshiftMismatch largest accepted |z_helio - z| (dimensionless).
 * @param displayName the file name for messages.
 * @param issues where problems are recorded.
 * @example checkSupernovaRows(rows, cells, columns, 0.02, 'sn.txt', issues)
 */
export function checkSupernovaRows(
  rows: readonly DataRow[], cells: ParsedCells, columns: readonly MappedColumn[],
  maxRedshiftMismatch: number, displayName: string, issues: IssueList,
): void {
  const columnOf = new Map(columns.map((column) => [column.field, column]));
  const at = (field: SupernovaField, r: number) => {
    const column = columnOf.get(field);
    return { file: displayName, line: rows[r].line, row: rows[r].row, path: column?.name, column: column ? rows[r].fields[column.index].column : undefined };
  };
  const { numbers } = cells;
  for (const field of ['z', 'z_helio'] as const) {
    numbers[field]?.forEach((z, r) => {
      if (z > 0) return;
      issues.add({
        ...at(field, r), code: 'data.redshift_not_positive', message: `redshift (field ${field}) must be positive`,
        expected: 'z > 0', found: String(z), fix: 'remove this supernova, or check that the right column is mapped',
      });
    });
  }
  const z = numbers.z;
  const zHelio = numbers.z_helio;
  if (z && zHelio) {
    for (let r = 0; r < rows.length; r++) {
      const gap = Math.abs(zHelio[r] - z[r]);
      if (!(gap > maxRedshiftMismatch)) continue;
      issues.add({
        ...at('z_helio', r), code: 'data.redshift_mismatch',
        message: `heliocentric and Hubble-diagram redshifts differ by ${gap.toPrecision(3)}, more than frame corrections can explain`,
        expected: `|z_helio - z| <= ${maxRedshiftMismatch}`, found: `z = ${z[r]}, z_helio = ${zHelio[r]}`,
        fix: 'check which columns are mapped to z and z_helio, or raise the allowed redshift mismatch',
      });
    }
  }
  for (const field of [...POSITIVE_ERROR_FIELDS, ...NON_NEGATIVE_ERROR_FIELDS]) {
    const strict = POSITIVE_ERROR_FIELDS.includes(field);
    numbers[field]?.forEach((sigma, r) => {
      if (strict ? sigma > 0 : !(sigma < 0)) return;
      issues.add({
        ...at(field, r), code: 'data.bad_uncertainty', message: `uncertainty (field ${field}) must be ${strict ? 'positive' : 'zero or positive'}`,
        expected: strict ? '> 0' : '>= 0', found: String(sigma), fix: 'correct the uncertainty, or map the right column to this field',
      });
    });
  }
  for (const [covField, aField, bField] of COVARIANCE_PAIRS) {
    const cov = numbers[covField];
    const a = numbers[aField];
    const b = numbers[bField];
    if (!cov || !a || !b) continue;
    cov.forEach((value, r) => {
      if (!(Math.abs(value) > a[r] * b[r] * (1 + CORRELATION_SLACK))) return;
      issues.add({
        ...at(covField, r), severity: 'warning', code: 'data.correlation_above_one',
        message: `covariance ${covField} implies a correlation of ${(value / (a[r] * b[r])).toFixed(3)}, beyond [-1, 1]`,
        fix: 'check that covariances (not correlations) are mapped and that the errors are standard deviations',
      });
    });
  }
  for (const field of ['magnitude_err', 'm_b_err'] as const) {
    const sigma = numbers[field];
    if (!sigma) continue;
    const huge = sigma.filter((value) => value > HUGE_MAGNITUDE_ERROR_MAG && value <= MAX_MAGNITUDE_ERROR_MAG).length; // larger ones are errors (checkValueBounds)
    if (huge > 0) {
      issues.add({
        file: displayName, path: columnOf.get(field)?.name, severity: 'warning', code: 'data.huge_uncertainty',
        message: `${huge} supernova(e) have ${field} above ${HUGE_MAGNITUDE_ERROR_MAG} mag and carry almost no weight (often: likely non-Ia objects with inflated errors)`,
      });
    }
  }
  checkValueBounds(rows, cells, columns, displayName, issues);
  checkRepeatedRows(rows, columns, columnOf.get('id'), displayName, issues);
}
