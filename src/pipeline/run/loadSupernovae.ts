import { CandelaError, type Issue } from '../../errors.js';
import type { CandelaConfig, SupernovaDataSet } from '../../config/index.js';
import {
  applyCuts, checkPositiveDefinite, concatenateTables, readCovarianceMatrix, readSupernovaTable, readSystematicModes, subsetCovariance,
  subsetSystematicModes, type CovarianceMatrix, type CutReport, type SupernovaTable, type SystematicModes,
} from '../../data/index.js';
import { locateConfigKey, pointAtConfigKey } from './pointAtConfigKey.js';

/** The data of a run, read, checked, cut and joined. */
export interface LoadedSupernovae {
  table: SupernovaTable;
  /** Covariances on the joined table (block-diagonal embedding of each data set's matrices). */
  covariances: CovarianceMatrix[];
  /** True when a covariance file already holds the statistical errors (the error columns are then not added). */
  covarianceIncludesStatistical: boolean;
  /**
   * Systematic modes U on the joined table (N x K, mag; C_sys = U U^T): each
   * data set's files side by side, each set's columns zero in the rows of the
   * other sets. Undefined when no data set has modes.
   */
  systematicModes?: SystematicModes;
  /** Per mode file read: its data set, path as written, and the size of U before cuts (rows x modes). */
  systematicModeFiles: Array<{ label: string; file: string; supernovae: number; modes: number }>;
  /** One cut report per data set, with its label. */
  cutReports: Array<{ label: string; report: CutReport }>;
  warnings: Issue[];
  /** Every input file read (for checksums), as written and as resolved. */
  inputFiles: Array<{ written: string; resolved: string }>;
}

/** One data set, read, checked and cut. */
interface LoadedPart {
  table: SupernovaTable;
  covariances: CovarianceMatrix[];
  /** The set's mode files side by side, rows of the kept supernovae (null: none). */
  modes: SystematicModes | null;
  modeFiles: LoadedSupernovae['systematicModeFiles'];
  report: CutReport;
  warnings: Issue[];
}

/**
 * Reads every data set of the configuration: table, covariance and mode
 * files, cuts; then joins them. All problems of all files are collected and
 * thrown together as one CandelaError, before any output is touched.
 */
export function loadSupernovae(config: CandelaConfig): LoadedSupernovae {
  const issues: Issue[] = [];
  const warnings: Issue[] = [];
  const parts: LoadedPart[] = [];
  const cutReports: LoadedSupernovae['cutReports'] = [];
  const inputFiles: LoadedSupernovae['inputFiles'] = [];
  let includesStatistical = false;
  const multiple = config.supernovae.length > 1;
  for (const [index, set] of config.supernovae.entries()) {
    try {
      const part = loadDataSet(set, multiple, config, index);
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
    for (const source of set.systematicModes) inputFiles.push({ written: source.file.written, resolved: source.file.resolved });
  }
  if (issues.length > 0) throw new CandelaError(issues);
  if (parts.length === 0) return { table: emptyTable(), covariances: [], covarianceIncludesStatistical: false, systematicModeFiles: [], cutReports, warnings, inputFiles };
  const joined = parts.length === 1 ? { table: parts[0].table, warnings: [] } : concatenateTables(parts.map((p) => p.table));
  warnings.push(...joined.warnings);
  const covariances = embedCovariances(parts, joined.table.count);
  const systematicModes = embedSystematicModes(parts, joined.table.count);
  const systematicModeFiles = parts.flatMap((part) => part.modeFiles);
  return {
    table: joined.table, covariances, covarianceIncludesStatistical: includesStatistical,
    ...(systematicModes ? { systematicModes } : {}), systematicModeFiles, cutReports, warnings, inputFiles,
  };
}

function loadDataSet(set: SupernovaDataSet, multiple: boolean, config: CandelaConfig, index: number): LoadedPart {
  const issues: Issue[] = [];
  const key = `supernovae[${index}]`;
  const collectAt = (error: unknown, role: string, paths: string[]): void => {
    if (error instanceof CandelaError) issues.push(...error.issues.map((issue) => pointAtConfigKey(issue, config, role, paths)));
    else throw error;
  };
  let read: ReturnType<typeof readSupernovaTable> | null = null;
  try {
    read = readTable(set);
  } catch (error) {
    collectAt(error, 'table', [`${key}.table.file`, `${key}.table`]);
  }
  if (!read) throw new CandelaError(issues);
  const { table: raw, warnings } = read;
  const fullCovariances: CovarianceMatrix[] = [];
  for (const [k, source] of set.covariances.entries()) {
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
      collectAt(error, 'covariance', [`${key}.covariances[${k}].file`, `${key}.covariances[${k}]`]);
    }
  }
  const fullModes: SystematicModes[] = [];
  for (const [k, source] of set.systematicModes.entries()) {
    try {
      fullModes.push(readSystematicModes({
        file: source.file.resolved, displayName: source.file.written, expectedSupernovae: raw.count, scale: source.scale,
      }));
    } catch (error) {
      collectAt(error, 'systematic-mode', [`${key}.systematic_modes[${k}].file`, `${key}.systematic_modes[${k}]`]);
    }
  }
  if (issues.length > 0) throw new CandelaError(issues);
  return cutDataSet(set, raw, warnings, fullCovariances, fullModes, multiple, locateConfigKey(config, [`${key}.cuts`, key]));
}

/** Reads a data set's table as its configuration describes it. */
function readTable(set: SupernovaDataSet): ReturnType<typeof readSupernovaTable> {
  return readSupernovaTable({
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
}

/** Applies a data set's cuts to its table, covariances and modes, and checks what is left. */
function cutDataSet(
  set: SupernovaDataSet, raw: SupernovaTable, warnings: Issue[], fullCovariances: CovarianceMatrix[], fullModes: SystematicModes[],
  multiple: boolean, cutsAt: Pick<Issue, 'file' | 'line' | 'column' | 'path'>,
): LoadedPart {
  const cuts = set.cuts;
  let outcome: ReturnType<typeof applyCuts>;
  try {
    outcome = applyCuts(raw, {
      redshiftMin: cuts.redshift?.[0],
      redshiftMax: cuts.redshift?.[1],
      maxAbsStretch: cuts.maxAbsX1 ?? undefined,
      maxAbsColor: cuts.maxAbsColor ?? undefined,
      maxErrors: cuts.maxErrors,
      keepSamples: cuts.keepSamples ?? undefined,
      dropIds: cuts.dropIds,
      exemptCalibratorsFromRedshiftCuts: cuts.keepCalibrators,
    });
  } catch (error) {
    if (!(error instanceof CandelaError)) throw error;
    // A cut problem is fixed in the configuration: point at its cuts key, name the data set and its table.
    throw new CandelaError(error.issues.map((issue) => ({
      ...issue, ...cutsAt, message: `${issue.message} (data set '${set.label}', table ${set.table.file.written})`,
      fix: issue.code === 'cuts.nothing_left' ? `loosen the cuts under ${cutsAt.path}, so that some supernovae remain` : issue.fix,
    })));
  }
  const { table: cut, keptIndices, report } = outcome;
  const relabelled = multiple ? relabelSamples(cut, set.label) : cut;
  const table = set.covariances.some((source) => source.includesStatistical) ? withoutStatisticalErrors(relabelled) : relabelled;
  const covariances = fullCovariances.map((cov) => subsetCovariance(cov, keptIndices));
  // D + U U^T is positive definite whenever D is, so the modes stay out of this check (no N x N product is formed).
  const pdIssue = checkJoinedPositiveDefinite(table, covariances, set);
  if (pdIssue) throw new CandelaError(pdIssue);
  const kept = fullModes.map((modes) => subsetSystematicModes(modes, keptIndices));
  const modes = kept.length === 0 ? null
    : kept.length === 1 ? kept[0] : placeModeColumns(kept.map((block) => ({ block, firstRow: 0 })), table.count);
  const modeFiles = fullModes.map((m) => ({ label: set.label, file: m.sourceFile, supernovae: m.count, modes: m.modeCount }));
  return { table, covariances, modes, modeFiles, report, warnings: [...warnings, ...report.warnings] };
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
function embedCovariances(parts: LoadedPart[], total: number): CovarianceMatrix[] {
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

/** The joined modes: each data set's columns in its own rows (zeros elsewhere), sets side by side. */
function embedSystematicModes(parts: LoadedPart[], total: number): SystematicModes | undefined {
  const blocks: Array<{ block: SystematicModes; firstRow: number }> = [];
  let offset = 0;
  for (const part of parts) {
    if (part.modes) blocks.push({ block: part.modes, firstRow: offset });
    offset += part.table.count;
  }
  if (blocks.length === 0) return undefined;
  return blocks.length === 1 && total === blocks[0].block.count ? blocks[0].block : placeModeColumns(blocks, total);
}

/**
 * Places blocks of modes side by side in one `rows` x (sum of K) matrix: the
 * columns of each block follow those of the previous one, its rows start at
 * `firstRow`, every other entry is 0. Cost O(rows x total K).
 */
function placeModeColumns(blocks: Array<{ block: SystematicModes; firstRow: number }>, rows: number): SystematicModes {
  const width = blocks.reduce((sum, { block }) => sum + block.modeCount, 0);
  const values = new Float64Array(rows * width);
  let column = 0;
  for (const { block, firstRow } of blocks) {
    const k = block.modeCount;
    for (let i = 0; i < block.count; i++) {
      values.set(block.values.subarray(i * k, (i + 1) * k), (firstRow + i) * width + column);
    }
    column += k;
  }
  return { count: rows, modeCount: width, values, sourceFile: [...new Set(blocks.map(({ block }) => block.sourceFile))].join(' + ') };
}

/** The table of a run without supernovae (probes only): no rows. */
function emptyTable(): SupernovaTable {
  const none = new Float64Array(0);
  return {
    kind: 'magnitudes', count: 0, ids: [], samples: [], sampleNames: [], sampleIndex: new Int32Array(0),
    redshift: none, redshiftHelio: none, redshiftErr: none, magnitude: none, magnitudeErr: none,
    sourceLine: new Int32Array(0), sourceFile: '',
  };
}
