import type { IssueList } from './issueList.js';
import type { DataRow } from './locateTableLayout.js';
import type { MappedColumn } from './parseTableCells.js';

/** How many repeated ids the summarizing warning names as examples. */
const EXAMPLES_SHOWN = 3;

/**
 * Finds rows that repeat. A row whose every mapped cell (id included) equals
 * an earlier row's is a copy: an error naming both lines, because it would
 * count the same measurement twice. Ids that repeat with different values
 * are expected in compilations where several surveys observed one supernova
 * (Pantheon+, Brout et al. 2022, has 1701 rows of 1543 names): they give one
 * warning with the count and a few examples. Cost O(rows x mapped columns).
 * @param rows the data rows.
 * @param columns the mapped columns (cells compared as written).
 * @param idColumn the column mapped to `id`, if any (without it, only copies are looked for).
 * @param displayName the file name for messages.
 * @param issues where problems are recorded.
 * @example checkRepeatedRows(rows, columns, { field: 'id', index: 0, name: 'CID' }, 'sn.txt', issues)
 */
export function checkRepeatedRows(
  rows: readonly DataRow[], columns: readonly MappedColumn[], idColumn: MappedColumn | undefined, displayName: string, issues: IssueList,
): void {
  const indices = [...new Set(columns.map((column) => column.index))].sort((a, b) => a - b);
  const firstCopy = new Map<string, DataRow>();
  const firstId = new Map<string, DataRow>();
  const repeated: Array<{ id: string; first: DataRow; again: DataRow }> = [];
  for (const row of rows) {
    const key = JSON.stringify(indices.map((index) => row.fields[index].text));
    const copied = firstCopy.get(key);
    if (copied) {
      issues.add({
        file: displayName, line: row.line, row: row.row, code: 'data.duplicate_row',
        message: `this row repeats line ${copied.line} in every mapped column, so the same measurement would count twice`,
        found: idColumn ? `id '${row.fields[idColumn.index].text}' on lines ${copied.line} and ${row.line}` : `lines ${copied.line} and ${row.line}`,
        fix: 'delete one of the two rows',
      });
      continue;
    }
    firstCopy.set(key, row);
    if (!idColumn) continue;
    const id = row.fields[idColumn.index].text;
    const first = firstId.get(id);
    if (first) repeated.push({ id, first, again: row });
    else firstId.set(id, row);
  }
  if (repeated.length === 0 || !idColumn) return;
  const names = new Set(repeated.map((entry) => entry.id)).size;
  const examples = repeated.slice(0, EXAMPLES_SHOWN).map((entry) => `'${entry.id}' on lines ${entry.first.line} and ${entry.again.line}`).join(', ');
  issues.add({
    file: displayName, line: repeated[0].again.line, row: repeated[0].again.row, path: idColumn.name, severity: 'warning', code: 'data.repeated_ids',
    message: `${repeated.length} row(s) repeat the id of an earlier row with different values (${names} supernova(e) measured more than once, e.g. ${examples}); `
      + 'expected when several surveys observed one supernova, and then the covariance must correlate the rows',
    fix: 'nothing to do if the release lists one row per survey and its covariance accounts for it; otherwise rename or drop the repeated rows',
  });
}
