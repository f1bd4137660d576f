import { CandelaError, type Issue } from '../errors.js';
import { createIssueList } from './issueList.js';
import { OPTIONAL_COLUMNS } from './selectRows.js';
import type { SupernovaTable } from './supernovaTable.js';

/** Columns whose absence means "unknown" (NaN) rather than zero when tables are joined. */
const UNKNOWN_WHEN_ABSENT = new Set<string>(['magnitude', 'magnitudeErr', 'peakMag', 'peakMagErr', 'stretch', 'stretchErr', 'color', 'colorErr', 'hostLogMass', 'hostLogMassErr', 'calibratorMu']);

/**
 * Joins several tables of the same kind into one, rows in the order given.
 * Sample labels are kept (give each file its own label when it has no sample
 * column); a column present in only some tables is filled with NaN (unknown:
 * host mass, calibrator distance, ...) or 0 (covariances, bias corrections)
 * for the others. Per-row source files are kept in `sourceFiles` /
 * `sourceFileIndex`. Cost O(total rows x columns).
 * @param tables at least one table.
 * @returns the joined table and warnings for ids that occur in more than one table.
 * @throws CandelaError `data.mixed_kinds` when light-curve and magnitude tables are mixed, `data.no_tables` for an empty list.
 * @example concatenateTables([lowRedshift, highRedshift]).table.count // the sum of both counts
 */
export function concatenateTables(tables: readonly SupernovaTable[]): { table: SupernovaTable; warnings: Issue[] } {
  if (tables.length === 0) throw new CandelaError({ code: 'data.no_tables', message: 'no supernova table to join', fix: 'list at least one data set' });
  const kind = tables[0].kind;
  const other = tables.find((table) => table.kind !== kind);
  if (other) {
    throw new CandelaError({
      code: 'data.mixed_kinds', file: other.sourceFile, message: `cannot join a '${other.kind}' table with '${kind}' tables`,
      fix: 'use data sets of one kind in a run (all light curves or all standardized magnitudes)',
    });
  }
  const count = tables.reduce((sum, table) => sum + table.count, 0);
  const joinFloat = (pick: (table: SupernovaTable) => Float64Array | undefined, fill: number): Float64Array => {
    const out = new Float64Array(count);
    let offset = 0;
    for (const table of tables) {
      const values = pick(table);
      if (values) out.set(values, offset);
      else out.fill(fill, offset, offset + table.count);
      offset += table.count;
    }
    return out;
  };
  const files: string[] = [];
  const fileIndex = new Int32Array(count);
  let offset = 0;
  for (const table of tables) {
    for (let i = 0; i < table.count; i++) {
      const file = table.sourceFiles && table.sourceFileIndex ? table.sourceFiles[table.sourceFileIndex[i]] : table.sourceFile;
      let index = files.indexOf(file);
      if (index < 0) index = files.push(file) - 1;
      fileIndex[offset + i] = index;
    }
    offset += table.count;
  }
  const samples = tables.flatMap((table) => table.samples);
  const sampleNames = [...new Set(samples)];
  const joined: SupernovaTable = {
    kind,
    count,
    ids: tables.flatMap((table) => table.ids),
    samples,
    sampleNames,
    sampleIndex: Int32Array.from(samples, (sample) => sampleNames.indexOf(sample)),
    redshift: joinFloat((table) => table.redshift, NaN),
    redshiftHelio: joinFloat((table) => table.redshiftHelio, NaN),
    redshiftErr: joinFloat((table) => table.redshiftErr, 0),
    sourceLine: Int32Array.from(tables.flatMap((table) => Array.from(table.sourceLine))),
    sourceFile: files.join(' + '),
    sourceFiles: files,
    sourceFileIndex: fileIndex,
  };
  for (const name of OPTIONAL_COLUMNS) {
    if (tables.some((table) => table[name])) joined[name] = joinFloat((table) => table[name], UNKNOWN_WHEN_ABSENT.has(name) ? NaN : 0);
  }
  const issues = createIssueList();
  const seen = new Map<string, number>();
  tables.forEach((table, t) => {
    for (const id of new Set(table.ids)) {
      const first = seen.get(id);
      if (first === undefined) seen.set(id, t);
      else issues.add({ code: 'data.duplicate_id_across_tables', severity: 'warning', file: table.sourceFile, path: id, message: `id '${id}' is also in ${tables[first].sourceFile}`, fix: 'if it is the same supernova, drop it from one data set (or let the covariance correlate both)' });
    }
  });
  return { table: joined, warnings: issues.finish() };
}
