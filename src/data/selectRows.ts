import type { SupernovaTable } from './supernovaTable.js';

/** The typed per-supernova columns of a table that may be absent. */
export const OPTIONAL_COLUMNS = [
  'magnitude', 'magnitudeErr', 'peakMag', 'peakMagErr', 'stretch', 'stretchErr', 'color', 'colorErr',
  'covPeakMagStretch', 'covPeakMagColor', 'covStretchColor', 'hostLogMass', 'hostLogMassErr', 'biasCorrectionMag', 'calibratorMu',
] as const satisfies ReadonlyArray<keyof SupernovaTable>;

/**
 * A new table holding the rows `indices` of `table`, in that order; sample
 * names are recomputed (first-seen order among the kept rows) so a sample
 * that lost all its supernovae disappears. Cost O(k x columns).
 * @param table the source table (not modified).
 * @param indices 0-based row indices.
 * @example selectRows(table, Int32Array.of(0, 5)).count // 2
 */
export function selectRows(table: SupernovaTable, indices: Int32Array): SupernovaTable {
  const take = (column: Float64Array): Float64Array => Float64Array.from(indices, (i) => column[i]);
  const samples = Array.from(indices, (i) => table.samples[i]);
  const sampleNames = [...new Set(samples)];
  const result: SupernovaTable = {
    kind: table.kind,
    count: indices.length,
    ids: Array.from(indices, (i) => table.ids[i]),
    samples,
    sampleNames,
    sampleIndex: Int32Array.from(samples, (sample) => sampleNames.indexOf(sample)),
    redshift: take(table.redshift),
    redshiftHelio: take(table.redshiftHelio),
    redshiftErr: take(table.redshiftErr),
    sourceLine: Int32Array.from(indices, (i) => table.sourceLine[i]),
    sourceFile: table.sourceFile,
  };
  for (const name of OPTIONAL_COLUMNS) {
    const column = table[name];
    if (column) result[name] = take(column);
  }
  if (table.sourceFiles && table.sourceFileIndex) {
    const fileIndex = table.sourceFileIndex;
    result.sourceFiles = table.sourceFiles;
    result.sourceFileIndex = Int32Array.from(indices, (i) => fileIndex[i]);
  }
  return result;
}
