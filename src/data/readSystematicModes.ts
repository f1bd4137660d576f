import { CandelaError } from '../errors.js';
import { MAX_MAGNITUDE_ERROR_MAG } from './checkValueBounds.js';
import { createIssueList, type IssueList } from './issueList.js';
import { parseNumberCell } from './parseNumberCell.js';
import { readTextLines } from './readTextLines.js';
import { detectDelimiter, splitFields, type Delimiter, type Field } from './splitFields.js';
import type { SystematicModes } from './supernovaTable.js';

/** How to read one file of systematic modes. */
export interface SystematicModeReadOptions {
  /** Path to read. */
  file: string;
  /** How to name the file in messages (as the user wrote it). */
  displayName: string;
  /** Number of supernovae N of the table, before any cut: the file must have N rows. */
  expectedSupernovae: number;
  /** Factor applied to every shift (dimensionless, finite, > 0); the covariance U U^T scales by its square. */
  scale: number;
}

/** One data line of the file: its 1-based line number and its fields. */
interface ModeRow {
  line: number;
  fields: Field[];
}

const FIX_ROWS = 'write one row per supernova of the table, in the table\'s row order and before any cut, with one shift (mag) per mode';

/**
 * Reads systematic modes U (N x K, mag): one row per supernova in the
 * table's row order (before cuts), one column per systematic, each entry the
 * shift of that supernova's magnitude under a one-standard-deviation change
 * of that systematic, so that the systematic covariance is C_sys = U U^T.
 * Values are separated by commas, tabs or spaces (the first data row
 * decides; a header may use its own separator). Blank lines and lines
 * starting with `#` are skipped; a first line whose every field is a
 * non-numeric word is a header of mode names (used in messages and returned
 * as `columnNames` when it has one name per column). Every
 * entry is multiplied by `scale`, so C_sys scales by scale^2. Every problem
 * is collected before throwing.
 *
 * Cost O(N K) time and memory.
 * @throws CandelaError `data.file_not_found` / `data.file_unreadable`,
 *   `modes.bad_option` (scale), `modes.non_numeric` and `modes.not_finite`
 *   (line, column, mode), `modes.ragged_row` (line, expected and found
 *   count), `modes.no_modes` (no data row), `modes.wrong_row_count`
 *   (expected N, found rows).
 * @example
 * // modes.csv: "# two modes\ncalib,dust\n0.01,0\n0.02,-0.01\n0.03,0.005"
 * readSystematicModes({ file: 'modes.csv', displayName: 'modes.csv', expectedSupernovae: 3, scale: 1 })
 * // { count: 3, modeCount: 2, values: [0.01, 0, 0.02, -0.01, 0.03, 0.005], sourceFile: 'modes.csv', columnNames: ['calib', 'dust'] }
 */
export function readSystematicModes(options: SystematicModeReadOptions): SystematicModes {
  const { displayName, scale } = options;
  if (!(Number.isFinite(scale) && scale > 0)) {
    throw new CandelaError({
      code: 'modes.bad_option', file: displayName, path: 'scale', message: 'the scale factor must be a finite positive number',
      expected: 'a number > 0', found: String(scale), fix: 'set scale to a positive number (1 keeps the shifts as written)',
    });
  }
  const lines = readTextLines(options.file, displayName);
  const content: Array<{ line: number; text: string }> = [];
  lines.forEach((text, index) => {
    const trimmed = text.trim();
    if (trimmed !== '' && !trimmed.startsWith('#')) content.push({ line: index + 1, text });
  });
  const first = content[0] ? { line: content[0].line, fields: splitFields(content[0].text, detectDelimiter(content[0].text)) } : null;
  const header = first && isHeader(first.fields) ? first : null;
  const body = header ? content.slice(1) : content;
  const delimiter: Delimiter = body.length > 0 ? detectDelimiter(body[0].text) : 'whitespace';
  const rows = body.map(({ line, text }): ModeRow => ({ line, fields: splitFields(text, delimiter) }));
  const issues = createIssueList();

  if (rows.length === 0) {
    throw new CandelaError({
      code: 'modes.no_modes', file: displayName, line: header?.line,
      message: header ? 'the file names modes but holds no rows of shifts' : 'the file holds no rows of shifts (no mode columns)',
      expected: `${options.expectedSupernovae} rows of at least one number`, found: 'no data row', fix: FIX_ROWS,
    });
  }
  const modeCount = rows[0].fields.length;
  const names = header && header.fields.length === modeCount ? header.fields.map((field) => field.text) : null;
  const count = rows.length;
  const values = new Float64Array(count * modeCount);
  rows.forEach((row, rowIndex) => {
    if (row.fields.length !== modeCount) {
      issues.add({
        code: 'modes.ragged_row', file: displayName, line: row.line, row: rowIndex + 1,
        message: `this row has ${row.fields.length} values but the first row (line ${rows[0].line}) has ${modeCount}`,
        expected: `${modeCount} values (one per mode)`, found: `${row.fields.length} values`,
        fix: 'give every row one value per mode; write 0 where a mode does not move a supernova',
      });
    }
    row.fields.slice(0, modeCount).forEach((field, mode) => {
      values[rowIndex * modeCount + mode] = readCell(field, row, rowIndex, mode, names, displayName, issues) * scale;
    });
  });
  if (count !== options.expectedSupernovae) {
    const extra = count > options.expectedSupernovae;
    issues.add({
      code: 'modes.wrong_row_count', file: displayName,
      line: extra ? rows[options.expectedSupernovae].line : rows[count - 1].line,
      message: `the file has ${count} rows of shifts but the table has ${options.expectedSupernovae} supernovae` +
        (extra ? `; the first extra row is on this line` : '; the last row is on this line'),
      expected: `${options.expectedSupernovae} rows (one per supernova of the table, before cuts)`, found: `${count} rows`,
      fix: 'check that the modes belong to this table and were written before any cut',
    });
  }
  if (issues.hasErrors()) throw new CandelaError(issues.finish());
  return { count, modeCount, values, sourceFile: displayName, ...(names ? { columnNames: names } : {}) };
}

/** A header line: every field is a word that is neither a number nor a non-finite word (nan, inf). */
function isHeader(fields: readonly Field[]): boolean {
  return fields.length > 0 && fields.every((field) => parseNumberCell(field.text).kind === 'not_a_number');
}

function readCell(
  field: Field, row: ModeRow, rowIndex: number, mode: number, names: string[] | null, displayName: string, issues: IssueList,
): number {
  const cell = parseNumberCell(field.text);
  if (cell.kind === 'number' && Math.abs(cell.value) > MAX_MAGNITUDE_ERROR_MAG) {
    issues.add({
      code: 'modes.absurd_value', file: displayName, line: row.line, column: field.column, row: rowIndex + 1, path: names ? names[mode] : `mode ${mode + 1}`,
      message: 'a mode shift is beyond any physical magnitude shift', expected: `|shift| <= ${MAX_MAGNITUDE_ERROR_MAG} mag`, found: field.text,
      fix: 'check the units and the file; regenerate the modes',
    });
  }
  if (cell.kind === 'number') return cell.value;
  const nonFinite = cell.kind === 'non_finite';
  issues.add({
    code: nonFinite ? 'modes.not_finite' : 'modes.non_numeric', file: displayName,
    line: row.line, column: field.column, row: rowIndex + 1, path: names ? names[mode] : `mode ${mode + 1}`,
    message: nonFinite ? 'a mode shift is not finite' : cell.kind === 'empty' ? 'a mode shift is empty' : 'a mode shift is not a number',
    expected: 'a finite decimal number (mag)', found: cell.kind === 'empty' ? 'an empty cell' : field.text,
    fix: 'regenerate the file; every shift must be a finite number, 0 where a mode does not move a supernova',
  });
  return 0;
}
