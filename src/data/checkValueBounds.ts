import type { IssueList } from './issueList.js';
import type { DataRow } from './locateTableLayout.js';
import type { MappedColumn, ParsedCells } from './parseTableCells.js';
import type { SupernovaField } from './supernovaField.js';

/**
 * Largest accepted |magnitude| (mag) of an apparent, standardized or
 * distance-modulus column. Type Ia supernovae are seen at apparent
 * magnitudes of about 9 to 27 and distance moduli of about 29 to 47
 * (common practice); 100 mag is beyond any telescope and any distance,
 * so such a value is a unit, column or overflow mistake.
 */
export const MAX_ABS_MAGNITUDE_MAG = 100;

/**
 * Largest accepted magnitude uncertainty (mag). Releases inflate the errors of
 * probable non-Ia objects so that they carry no weight: DES-SN5YR's
 * MUERR_FINAL goes up to 449.6 mag (its SOURCE.md). Ten thousand magnitudes
 * leaves that practice room while refusing values whose square overflows or
 * swamps a covariance (1e200 mag squares to infinity).
 */
export const MAX_MAGNITUDE_ERROR_MAG = 1e4;

/**
 * Largest accepted |value| of any other numeric column (redshifts, stretch,
 * colour, log host mass, their errors and covariances). None of them comes
 * near a million in any release (common practice); a host mass given in solar
 * masses instead of log10 does, and is caught here.
 */
export const MAX_ABS_OTHER_VALUE = 1e6;

const MAGNITUDE_FIELDS: readonly SupernovaField[] = ['magnitude', 'm_b', 'calibrator_mu'];
const MAGNITUDE_ERROR_FIELDS: readonly SupernovaField[] = ['magnitude_err', 'm_b_err'];

/** The bound of one field and the words that explain it. */
function boundOf(field: SupernovaField): { limit: number; what: string } {
  if (MAGNITUDE_FIELDS.includes(field)) return { limit: MAX_ABS_MAGNITUDE_MAG, what: `|${field}| <= ${MAX_ABS_MAGNITUDE_MAG} mag` };
  if (MAGNITUDE_ERROR_FIELDS.includes(field)) return { limit: MAX_MAGNITUDE_ERROR_MAG, what: `${field} <= ${MAX_MAGNITUDE_ERROR_MAG} mag` };
  return { limit: MAX_ABS_OTHER_VALUE, what: `|${field}| <= ${MAX_ABS_OTHER_VALUE}` };
}

/**
 * Refuses numbers no supernova can have: |magnitude| above
 * {@link MAX_ABS_MAGNITUDE_MAG}, a magnitude error above
 * {@link MAX_MAGNITUDE_ERROR_MAG}, any other value above
 * {@link MAX_ABS_OTHER_VALUE} in size. Each is an error naming the file,
 * line, row and column, so `check` refuses what a fit could not use.
 * NaN (an unknown value in a nullable field) passes. Cost O(rows x fields).
 * @param rows the rows the cells came from (for line numbers).
 * @param cells the parsed cells.
 * @param columns the mapped columns (for column names and positions).
 * @param displayName the file name for messages.
 * @param issues where problems are recorded.
 * @example checkValueBounds(rows, cells, columns, 'sn.txt', issues) // m_b = 1e300 -> error data.absurd_value
 */
export function checkValueBounds(
  rows: readonly DataRow[], cells: ParsedCells, columns: readonly MappedColumn[], displayName: string, issues: IssueList,
): void {
  for (const column of columns) {
    const values = cells.numbers[column.field];
    if (!values) continue;
    const { limit, what } = boundOf(column.field);
    values.forEach((value, r) => {
      if (!(Math.abs(value) > limit)) return;
      const row = rows[r];
      issues.add({
        file: displayName, line: row.line, row: row.row, column: row.fields[column.index].column, path: column.name,
        code: 'data.absurd_value',
        message: `column '${column.name}' (field ${column.field}) holds a value no supernova can have`,
        expected: what, found: row.fields[column.index].text,
        fix: 'correct the value (units? the right column?), or remove this supernova from the file',
      });
    });
  }
}
