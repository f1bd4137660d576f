import { CandelaError, type Issue } from '../errors.js';
import type { CandelaConfig, SupernovaDataSet } from '../config/index.js';
import {
  applyCuts, checkPositiveDefinite, concatenateTables, readCovarianceMatrix, readSupernovaTable, subsetCovariance,
  type CovarianceMatrix, type CutReport, type SupernovaTable,
} from '../data/index.js';

/** The data of a run, read, checked, cut and joined. */
export interface LoadedSupernovae {
  table: SupernovaTable;
  /** Covariances on the joined table (block-diagonal embedding of each data set's matrices). */
  covariances: CovarianceMatrix[];
  /** True when a covariance file already holds the statistical errors (the error columns are then not added). */
  covarianceIncludesStatistical: boolean;
  /** One cut report per data set, with its label. */
  cutReports: Array<{ label: string; report: CutReport }>;
  warnings: Issue[];
  /** Every input file read (for checksums), as written and as resolved. */
  inputFiles: Array<{ written: string; resolved: string }>;
}

/**
 * Reads every data set of the configuration: table, covariance files, cuts;
 * then joins them. All problems of all files are collected and thrown
 * together as one CandelaError, before any output is touched.
 */
export function loadSupernovae(config: CandelaConfig): LoadedSupernovae {
  const issues: Issue[] = [];
  const warnings: Issue[] = [];
  const parts: Array<{ table: SupernovaTable; covariances: CovarianceMatrix[] }> = [];
  const cutReports: LoadedSupernovae['cutReports'] = [];
  const inputFiles: LoadedSupernovae['inputFiles'] = [];
  let includesStatistical = false;
  const multiple = config.supernovae.length > 1;
  for (const set of config.supernovae) {
    try {
      const part = loadDataSet(set, multiple);
      warnings.push(...part.warnings);
      parts.push(part);
      cutReports.push({ label: set.label, report: part.report });
    } catch (error) {
      if (error instanceof CandelaError) issues.push(...error.issues);
      else throw error;
    }
    inputFiles.push({ written: set.table.file.written, resolved: set.table.file.resolved });
    for (const source of set.covariances) {
      inputFiles.push({ written: source.file.written, resolved: source.file.resolved });
      if (source.includesStatistical) includesStatistical = true;
    }
  }
  if (issues.length > 0) throw new CandelaError(issues);
  const joined = parts.length === 1 ? { table: parts[0].table, warnings: [] } : concatenateTables(parts.map((p) => p.table));
  warnings.push(...joined.warnings);
  const covariances = embedCovariances(parts, joined.table.count);
  return { table: joined.table, covariances, covarianceIncludesStatistical: includesStatistical, cutReports, warnings, inputFiles };
}

function loadDataSet(set: SupernovaDataSet, multiple: boolean) {
  const issues: Issue[] = [];
  const { table: raw, warnings } = readSupernovaTable({
    file: set.table.file.resolved,
    displayName: set.table.file.written,
    kind: set.kind,
    delimiter: set.table.delimiter,
    commentPrefix: set.table.comment ?? undefined,
    indexColumn: set.table.indexColumn,
    rowPrefix: set.table.rowPrefix,
    columns: set.columns,
    missingValues: set.missingValues,
    maxRedshiftMismatch: set.maxRedshiftMismatch,
    sampleLabel: set.label,
  });
  const fullCovariances: CovarianceMatrix[] = [];
  for (const source of set.covariances) {
    try {
      fullCovariances.push(readCovarianceMatrix({
        file: source.file.resolved,
        displayName: source.file.written,
        target: source.appliesTo === 'magnitudes' ? 'magnitudes' : 'light_curves',
        expectedSupernovae: raw.count,
        blockOrder: source.blockOrder,
        layout: source.layout,
        scale: source.scale,
        symmetryTolerance: source.symmetryTolerance,
      }));
    } catch (error) {
      if (error instanceof CandelaError) issues.push(...error.issues);
      else throw error;
    }
  }
  if (issues.length > 0) throw new CandelaError(issues);
  const cuts = set.cuts;
  const { table: cut, keptIndices, report } = applyCuts(raw, {
    redshiftMin: cuts.redshift?.[0],
    redshiftMax: cuts.redshift?.[1],
    maxAbsStretch: cuts.maxAbsX1 ?? undefined,
    maxAbsColor: cuts.maxAbsColor ?? undefined,
    maxErrors: cuts.maxErrors,
    keepSamples: cuts.keepSamples ?? undefined,
    dropIds: cuts.dropIds,
    exemptCalibratorsFromRedshiftCuts: cuts.keepCalibrators,
  });
  if (cut.count === 0) {
    throw new CandelaError({ code: 'data.all_cut', file: set.table.file.written, path: `supernovae.${set.label}.cuts`, message: 'the cuts removed every supernova', fix: 'loosen the cuts' });
  }
  const relabelled = multiple ? relabelSamples(cut, set.label) : cut;
  const table = set.covariances.some((source) => source.includesStatistical) ? withoutStatisticalErrors(relabelled) : relabelled;
  const covariances = fullCovariances.map((cov) => subsetCovariance(cov, keptIndices));
  const pdIssue = checkJoinedPositiveDefinite(table, covariances, set);
  if (pdIssue) throw new CandelaError(pdIssue);
  return { table, covariances, report, warnings: [...warnings, ...report.warnings] };
}

/**
 * When a covariance file already holds the statistical errors, the per-row
 * error columns must not be added again: they are zeroed (after the cuts,
 * which may still use them).
 */
function withoutStatisticalErrors(table: SupernovaTable): SupernovaTable {
  const zero = () => new Float64Array(table.count);
  if (table.kind === 'magnitudes') return { ...table, magnitudeErr: zero() };
  return { ...table, peakMagErr: zero(), stretchErr: zero(), colorErr: zero(), covPeakMagStretch: zero(), covPeakMagColor: zero(), covStretchColor: zero() };
}

/** With several data sets, sample labels are prefixed by the data-set label so they stay distinct. */
function relabelSamples(table: SupernovaTable, label: string): SupernovaTable {
  if (table.sampleNames.length === 1 && table.sampleNames[0] === label) return table;
  const rename = (sample: string) => (sample === label ? sample : `${label}_${sample}`);
  return { ...table, samples: table.samples.map(rename), sampleNames: table.sampleNames.map(rename) };
}

/** Each magnitude-level covariance plus the diagonal of statistical errors must be positive definite. */
function checkJoinedPositiveDefinite(table: SupernovaTable, covariances: CovarianceMatrix[], set: SupernovaDataSet): Issue | null {
  const magnitudeLevel = covariances.filter((cov) => cov.target === 'magnitudes');
  if (magnitudeLevel.length === 0) return null;
  const n = table.count;
  const sum = new Float64Array(n * n);
  for (const cov of magnitudeLevel) for (let k = 0; k < sum.length; k++) sum[k] += cov.values[k];
  const errors = table.kind === 'magnitudes' ? table.magnitudeErr : table.peakMagErr;
  const includes = set.covariances.some((source) => source.includesStatistical);
  const diagonal = new Float64Array(n);
  if (!includes && errors) for (let i = 0; i < n; i++) diagonal[i] = errors[i] * errors[i];
  return checkPositiveDefinite(sum, n, diagonal, magnitudeLevel.map((c) => c.sourceFile).join(' + '), table.ids);
}

/** Places every data set's matrices on the diagonal of the joined N x N (or 3N x 3N) matrix. */
function embedCovariances(parts: Array<{ table: SupernovaTable; covariances: CovarianceMatrix[] }>, total: number): CovarianceMatrix[] {
  if (parts.length === 1) return parts[0].covariances;
  const result: CovarianceMatrix[] = [];
  let offset = 0;
  for (const part of parts) {
    for (const cov of part.covariances) {
      const block = cov.target === 'light_curves' ? 3 : 1;
      const size = total * block;
      const values = new Float64Array(size * size);
      const start = offset * block;
      for (let i = 0; i < cov.size; i++) {
        values.set(cov.values.subarray(i * cov.size, (i + 1) * cov.size), (start + i) * size + start);
      }
      result.push({ target: cov.target, size, values, sourceFile: cov.sourceFile });
    }
    offset += part.table.count;
  }
  return result;
}
