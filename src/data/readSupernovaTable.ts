import { CandelaError, type Issue } from '../errors.js';
import { checkSupernovaRows, DEFAULT_MAX_REDSHIFT_MISMATCH } from './checkSupernovaRows.js';
import { closestName } from './closestName.js';
import { createIssueList } from './issueList.js';
import { locateTableLayout } from './locateTableLayout.js';
import { parseTableCells, type MappedColumn } from './parseTableCells.js';
import { readTextLines } from './readTextLines.js';
import { REQUIRED_FIELDS, SUPERNOVA_FIELDS, type SupernovaField } from './supernovaField.js';
import type { SupernovaTable } from './supernovaTable.js';

/** How to read one supernova table. No release format is built in: the file's structure is described here. */
export interface TableReadOptions {
  /** Path to read. */
  file: string;
  /** How to name the file in messages (default: `file`). */
  displayName?: string;
  /** `light_curves`: m_B, x1, c per supernova; `magnitudes`: standardized magnitudes or distance moduli. */
  kind: 'light_curves' | 'magnitudes';
  /** Field separator; `auto` looks at the header line (tab, else comma, else whitespace). */
  delimiter: 'auto' | 'comma' | 'tab' | 'whitespace';
  /** Lines starting with this are comments (default '#'); a header line may start with it too. */
  commentPrefix?: string;
  /** An unnamed leading running-index column: `auto` detects rows with one integer field more than the header has names. */
  indexColumn: 'auto' | 'yes' | 'no';
  /** A fixed word starting every data row (removed); other non-comment lines are skipped with a warning. */
  rowPrefix?: string | null;
  /** A fixed word starting the header line (removed). */
  headerPrefix?: string | null;
  /** Tool field -> column name in the file. */
  columns: Partial<Record<SupernovaField, string>>;
  /** Values meaning "unknown" per field (e.g. host_log_mass: [-9]); they become NaN in nullable fields. */
  missingValues?: Partial<Record<SupernovaField, number[]>>;
  /** Largest accepted |z_helio - z| (default {@link DEFAULT_MAX_REDSHIFT_MISMATCH} = 0.02). */
  maxRedshiftMismatch?: number;
  /** Sample label of every row when no `sample` column is mapped (default 'all'). */
  sampleLabel?: string;
}

/**
 * Reads a supernova table (comma, tab or whitespace separated, with a header
 * line) into a {@link SupernovaTable}. Handles comment lines, a header with
 * or without the comment prefix, more header names than data fields (the
 * surplus trailing names are ignored with one warning and columns are read by
 * position), an unnamed leading index column, a row prefix word, and
 * missing-value markers. Absent optional columns: z_helio = z, z_err = 0,
 * covariances = 0, bias correction = 0; ids default to the data-row number.
 *
 * Cost O(file size).
 * @throws CandelaError listing every problem found (missing or duplicated
 *   mapped columns with a did-you-mean, unmapped required fields, bad cells,
 *   wrong field counts, z <= 0, |z_helio - z| too large, non-positive errors,
 *   empty table), each with file, line, column name and a fix.
 * @example
 * const { table } = readSupernovaTable({ file: '../shared/data-real/pantheon2018/lcparam_full_long.txt',
 *   kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
 *   columns: { id: 'name', z: 'zcmb', z_helio: 'zhel', magnitude: 'mb', magnitude_err: 'dmb' } });
 * table.count // 1048
 */
export function readSupernovaTable(options: TableReadOptions): { table: SupernovaTable; warnings: Issue[] } {
  const displayName = options.displayName ?? options.file;
  const issues = createIssueList();
  for (const field of REQUIRED_FIELDS[options.kind]) {
    if (options.columns[field] !== undefined) continue;
    issues.add({
      code: 'data.field_not_mapped', file: displayName, path: `columns.${field}`,
      message: `a '${options.kind}' table needs the field ${field}, but no column is mapped to it`,
      fix: `name the file column that holds ${field} in the column mapping`,
    });
  }
  const lines = readTextLines(options.file, displayName);
  const mapped = (Object.entries(options.columns) as Array<[SupernovaField, string | undefined]>)
    .filter((entry): entry is [SupernovaField, string] => entry[1] !== undefined && SUPERNOVA_FIELDS.includes(entry[0]));
  const layout = locateTableLayout(lines, {
    displayName,
    delimiter: options.delimiter,
    commentPrefix: options.commentPrefix ?? '#',
    indexColumn: options.indexColumn,
    rowPrefix: options.rowPrefix ?? null,
    headerPrefix: options.headerPrefix ?? null,
    mappedNames: new Set(mapped.map(([, name]) => name)),
  }, issues);
  if (!layout) throw new CandelaError(issues.finish());

  const positions = new Map<string, number[]>();
  layout.names.forEach((name, index) => positions.set(name.text, [...(positions.get(name.text) ?? []), index]));
  const columns: MappedColumn[] = [];
  for (const [field, name] of mapped) {
    const found = positions.get(name);
    if (!found) {
      const suggestion = closestName(name, layout.names.map((n) => n.text));
      issues.add({
        code: 'data.missing_column', file: displayName, line: layout.headerLine, path: `columns.${field}`,
        message: `column '${name}' (mapped to ${field}) is not in the header`,
        found: `columns ${layout.names.map((n) => n.text).join(', ')}`,
        fix: suggestion ? `did you mean '${suggestion}'?` : 'use one of the column names of the header line',
      });
      continue;
    }
    if (found.length > 1) {
      issues.add({
        code: 'data.duplicate_column', file: displayName, line: layout.headerLine, column: layout.names[found[1]].column, path: name,
        message: `column '${name}' (mapped to ${field}) appears ${found.length} times in the header, so it is ambiguous`,
        found: `positions ${found.map((p) => p + 1).join(', ')}`, fix: 'rename the duplicated columns in the file',
      });
      continue;
    }
    columns.push({ field, index: found[0], name });
  }
  if (layout.rowCount === 0) {
    issues.add({ code: 'data.empty_table', file: displayName, line: layout.headerLine, message: 'the table has a header but no data rows', fix: 'check the file and the row prefix' });
  }
  if (issues.hasErrors()) throw new CandelaError(issues.finish());

  const cells = parseTableCells(layout.rows, columns, options.missingValues ?? {}, displayName, issues);
  checkSupernovaRows(layout.rows, cells, columns, options.maxRedshiftMismatch ?? DEFAULT_MAX_REDSHIFT_MISMATCH, displayName, issues);
  const all = issues.finish();
  if (issues.hasErrors()) throw new CandelaError(all);

  const count = layout.rows.length;
  const { numbers, texts } = cells;
  const samples = texts.sample ?? new Array<string>(count).fill(options.sampleLabel ?? 'all');
  const sampleNames = [...new Set(samples)];
  const redshift = numbers.z as Float64Array;
  const table: SupernovaTable = {
    kind: options.kind,
    count,
    ids: texts.id ?? layout.rows.map((row) => String(row.row)),
    samples,
    sampleNames,
    sampleIndex: Int32Array.from(samples, (sample) => sampleNames.indexOf(sample)),
    redshift,
    redshiftHelio: numbers.z_helio ?? redshift.slice(),
    redshiftErr: numbers.z_err ?? new Float64Array(count),
    magnitude: numbers.magnitude,
    magnitudeErr: numbers.magnitude_err,
    peakMag: numbers.m_b,
    peakMagErr: numbers.m_b_err,
    stretch: numbers.x1,
    stretchErr: numbers.x1_err,
    color: numbers.color,
    colorErr: numbers.color_err,
    covPeakMagStretch: numbers.cov_m_b_x1 ?? (options.kind === 'light_curves' ? new Float64Array(count) : undefined),
    covPeakMagColor: numbers.cov_m_b_color ?? (options.kind === 'light_curves' ? new Float64Array(count) : undefined),
    covStretchColor: numbers.cov_x1_color ?? (options.kind === 'light_curves' ? new Float64Array(count) : undefined),
    hostLogMass: numbers.host_log_mass,
    hostLogMassErr: numbers.host_log_mass_err,
    biasCorrectionMag: numbers.bias_correction ?? new Float64Array(count),
    calibratorMu: numbers.calibrator_mu,
    sourceLine: Int32Array.from(layout.rows, (row) => row.line),
    sourceFile: displayName,
  };
  return { table, warnings: all };
}
