import type { IssueList } from './issueList.js';
import { detectDelimiter, splitFields, type Delimiter, type Field } from './splitFields.js';

/** How the lines of a table file are to be read. */
export interface LayoutOptions {
  displayName: string;
  delimiter: Delimiter | 'auto';
  commentPrefix: string;
  indexColumn: 'auto' | 'yes' | 'no';
  rowPrefix: string | null;
  headerPrefix: string | null;
  /** The column names the user mapped: they identify the header line. */
  mappedNames: ReadonlySet<string>;
}

/** One data row: its 1-based line and data-row numbers and its fields (prefix word and index removed). */
export interface DataRow {
  line: number;
  row: number;
  fields: Field[];
}

/** The structure found in a table file. */
export interface TableLayout {
  delimiter: Delimiter;
  headerLine: number;
  /** Header names that have data, in order (surplus trailing names removed). */
  names: Field[];
  /** Rows with the expected number of fields. */
  rows: DataRow[];
  /** Total data rows, including rows rejected for a wrong field count. */
  rowCount: number;
}

/**
 * Finds the header line, the data rows, the delimiter, an unnamed leading
 * index column and surplus trailing header names. The header is the line,
 * among the comment lines before the data and the first non-comment line,
 * that names the most mapped columns (ties go to the later line); a comment
 * prefix in front of it is ignored. Problems are added to `issues`.
 * Cost O(file size).
 * @param lines the file's lines (index 0 = line 1).
 * @param options how to read them; see {@link LayoutOptions}.
 * @param issues where problems are recorded.
 * @returns the layout, or null when no header was found.
 * @example locateTableLayout(['#name z', 'a 0.1'], opts, issues)?.names.map((n) => n.text) // ['name', 'z']
 */
export function locateTableLayout(lines: readonly string[], options: LayoutOptions, issues: IssueList): TableLayout | null {
  const { displayName, commentPrefix, rowPrefix } = options;
  const isBlank = (text: string): boolean => text.trim() === '';
  const isComment = (text: string): boolean => commentPrefix !== '' && text.trimStart().startsWith(commentPrefix);
  const startsWithPrefix = (text: string): boolean =>
    rowPrefix !== null && new RegExp(`^${escapeRegExp(rowPrefix)}(?:[\\s,]|$)`).test(text.trimStart());

  const firstDataIndex = lines.findIndex((text) => !isBlank(text) && !isComment(text) && (rowPrefix === null || startsWithPrefix(text)));
  const lastCandidate = rowPrefix === null ? firstDataIndex : firstDataIndex - 1;
  let header = -1;
  let bestScore = 0;
  for (let i = 0; i <= (lastCandidate < 0 ? lines.length - 1 : lastCandidate); i++) {
    if (isBlank(lines[i])) continue;
    const score = headerFields(lines[i]).filter((field) => options.mappedNames.has(field.text)).length;
    if (score > 0 && score >= bestScore) {
      bestScore = score;
      header = i;
    }
  }
  if (header < 0) {
    issues.add({
      code: 'data.header_not_found',
      message: 'no header line naming the mapped columns was found',
      file: displayName,
      expected: `a line naming columns such as ${[...options.mappedNames].slice(0, 4).join(', ')}`,
      fix: 'add a header line with the column names, or correct the column names in the mapping',
    });
    return null;
  }

  const names = headerFields(lines[header]);
  const delimiter = options.delimiter === 'auto' ? detectDelimiter(lines[header]) : options.delimiter;
  const rawRows: DataRow[] = [];
  let skipped = 0;
  for (let i = header + 1; i < lines.length; i++) {
    const text = lines[i];
    if (isBlank(text) || isComment(text)) continue;
    if (rowPrefix !== null && !startsWithPrefix(text)) {
      skipped++;
      continue;
    }
    const fields = splitFields(text, delimiter);
    rawRows.push({ line: i + 1, row: rawRows.length + 1, fields: rowPrefix === null ? fields : fields.slice(1) });
  }
  if (skipped > 0) {
    issues.add({
      code: 'data.lines_skipped', severity: 'warning', file: displayName,
      message: `${skipped} line(s) after the header neither start with the row prefix '${rowPrefix}' nor are comments; they were skipped`,
    });
  }
  return fitRowsToHeader(names, rawRows, delimiter, header + 1, options, issues);

  function headerFields(text: string): Field[] {
    const stripped = isComment(text) ? text.replace(commentPrefix, ' '.repeat(commentPrefix.length)) : text;
    const fields = splitFields(stripped, options.delimiter === 'auto' ? detectDelimiter(stripped) : options.delimiter);
    return options.headerPrefix !== null && fields[0]?.text === options.headerPrefix ? fields.slice(1) : fields;
  }
}

function fitRowsToHeader(
  names: Field[], rawRows: DataRow[], delimiter: Delimiter, headerLine: number, options: LayoutOptions, issues: IssueList,
): TableLayout {
  const { displayName } = options;
  const countFrequency = new Map<number, number>();
  for (const row of rawRows) countFrequency.set(row.fields.length, (countFrequency.get(row.fields.length) ?? 0) + 1);
  let usual = names.length;
  let usualFrequency = 0;
  for (const [count, frequency] of countFrequency) {
    if (frequency > usualFrequency) {
      usual = count;
      usualFrequency = frequency;
    }
  }
  const firstIsInteger = rawRows.length > 0 && /^\d+$/.test(rawRows[0].fields[0]?.text ?? '');
  const dropIndex = options.indexColumn === 'yes' || (options.indexColumn === 'auto' && usual === names.length + 1 && firstIsInteger);
  const dataFields = dropIndex ? usual - 1 : usual;

  let kept = names;
  if (dataFields < names.length && rawRows.length > 0) {
    const surplus = names.slice(dataFields);
    const mapped = surplus.filter((name) => options.mappedNames.has(name.text));
    for (const name of mapped) {
      issues.add({
        code: 'data.mapped_column_without_data', file: displayName, line: headerLine, column: name.column, path: name.text,
        message: `column '${name.text}' is named in the header but the data rows have only ${dataFields} fields, so it has no data`,
        expected: `${names.length} fields per row`, found: `${dataFields}`,
        fix: 'map this field to another column, or repair the rows',
      });
    }
    if (mapped.length === 0) {
      issues.add({
        code: 'data.header_surplus_names', severity: 'warning', file: displayName, line: headerLine,
        message: `the header names ${names.length} columns but the data rows have ${dataFields} fields; the trailing name(s) ${surplus.map((n) => `'${n.text}'`).join(', ')} have no data and were ignored (columns read by position)`,
      });
    }
    kept = names.slice(0, dataFields);
  } else if (dataFields > names.length) {
    issues.add({
      code: 'data.more_fields_than_names', file: displayName, line: headerLine,
      message: `the data rows have ${dataFields} fields but the header names only ${names.length} columns`,
      expected: `${names.length} fields per row`, found: `${dataFields}`,
      fix: options.indexColumn === 'no'
        ? "if the first field of each row is a row number, set the index column option to 'yes' or 'auto'; otherwise check the delimiter"
        : 'check the delimiter, and that the header line is complete',
    });
  }

  const rows: DataRow[] = [];
  for (const row of rawRows) {
    if (row.fields.length !== usual) {
      issues.add({
        code: 'data.field_count', file: displayName, line: row.line, row: row.row,
        message: `row has ${row.fields.length} fields where the other rows have ${usual}`,
        expected: `${usual} fields`, found: `${row.fields.length}`,
        fix: `check this row for a missing or extra ${delimiter === 'whitespace' ? 'value (empty cells are not possible with whitespace separators)' : 'separator'}`,
      });
      continue;
    }
    rows.push(dropIndex ? { ...row, fields: row.fields.slice(1) } : row);
  }
  return { delimiter, headerLine, names: kept, rows, rowCount: rawRows.length };
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}
