import type { IssueList } from './issueList.js';
import type { DataRow } from './locateTableLayout.js';
import { parseNumberCell } from './parseNumberCell.js';
import { NULLABLE_FIELDS, type SupernovaField } from './supernovaField.js';

/** Where a mapped field is found: its 0-based field index and the column name. */
export interface MappedColumn {
  field: SupernovaField;
  index: number;
  name: string;
}

/** The mapped columns as typed arrays (numbers) or strings (id, sample), one entry per kept row. */
export interface ParsedCells {
  numbers: Partial<Record<SupernovaField, Float64Array>>;
  texts: Partial<Record<'id' | 'sample', string[]>>;
}

/**
 * Converts the cells of the mapped columns. Numeric fields must hold finite
 * decimal numbers; a nullable field (host mass, its error, calibrator
 * distance) may instead be empty, `nan`, or equal to one of its declared
 * missing-value markers, and then becomes NaN. A marker in a required field
 * is an error. Every bad cell is added to `issues` with its line, column and
 * row. Cost O(rows x mapped columns).
 * @param rows the data rows from {@link locateTableLayout}.
 * @param columns the mapped fields and where they are.
 * @param missingValues markers meaning "unknown", per field.
 * @param displayName the file name for messages.
 * @param issues where problems are recorded.
 * @example parseTableCells(rows, [{ field: 'z', index: 1, name: 'zcmb' }], {}, 'sn.txt', issues).numbers.z
 */
export function parseTableCells(
  rows: readonly DataRow[],
  columns: readonly MappedColumn[],
  missingValues: Partial<Record<SupernovaField, number[]>>,
  displayName: string,
  issues: IssueList,
): ParsedCells {
  const parsed: ParsedCells = { numbers: {}, texts: {} };
  for (const { field, index, name } of columns) {
    if (field === 'id' || field === 'sample') {
      parsed.texts[field] = rows.map((row) => row.fields[index].text);
      continue;
    }
    const nullable = NULLABLE_FIELDS.includes(field);
    const markers = missingValues[field] ?? [];
    const values = new Float64Array(rows.length);
    rows.forEach((row, r) => {
      const cell = row.fields[index];
      const where = { file: displayName, line: row.line, column: cell.column, row: row.row, path: name };
      const outcome = parseNumberCell(cell.text);
      if (outcome.kind === 'number') {
        if (markers.includes(outcome.value)) {
          if (nullable) {
            values[r] = NaN;
            return;
          }
          issues.add({
            ...where, code: 'data.missing_required',
            message: `column '${name}' (field ${field}) holds the missing-value marker ${cell.text}, but ${field} is needed for every supernova`,
            found: cell.text, fix: 'remove this supernova from the file or give it a value',
          });
        }
        values[r] = outcome.value;
        return;
      }
      values[r] = NaN;
      if (nullable && (outcome.kind === 'empty' || (outcome.kind === 'non_finite' && outcome.isNaN))) return;
      const fix = nullable
        ? 'correct the value, or list it under the missing values of this field if it means "unknown"'
        : 'correct the value, or remove this supernova from the file';
      if (outcome.kind === 'empty') {
        issues.add({ ...where, code: 'data.empty_cell', message: `column '${name}' (field ${field}) is empty`, expected: 'a number', found: 'an empty cell', fix });
      } else if (outcome.kind === 'non_finite') {
        issues.add({ ...where, code: 'data.not_finite', message: `column '${name}' (field ${field}) holds a value that is not finite`, expected: 'a finite number', found: cell.text, fix });
      } else {
        issues.add({ ...where, code: 'data.non_numeric', message: `column '${name}' (field ${field}) holds a value that is not a number`, expected: 'a decimal number', found: cell.text, fix });
      }
    });
    parsed.numbers[field] = values;
  }
  return parsed;
}
