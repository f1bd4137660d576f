import { CandelaError, type Issue } from '../errors.js';
import { closestName } from './closestName.js';
import type { CutReport, CutStep } from './cutReport.js';
import { selectRows } from './selectRows.js';
import type { SupernovaTable } from './supernovaTable.js';

/** An uncertainty that a cut can bound. */
export type CuttableError = 'm_b_err' | 'x1_err' | 'color_err' | 'magnitude_err' | 'z_err' | 'host_log_mass_err';

/** Selection cuts; every one is optional. Bounds are inclusive. */
export interface CutOptions {
  /** Keep z >= redshiftMin (Hubble-diagram redshift). */
  redshiftMin?: number;
  /** Keep z <= redshiftMax. */
  redshiftMax?: number;
  /** Keep |x1| <= maxAbsStretch. */
  maxAbsStretch?: number;
  /** Keep |c| <= maxAbsColor (mag). */
  maxAbsColor?: number;
  /** Keep rows whose uncertainty is at most the bound (an unknown, NaN, uncertainty is kept). */
  maxErrors?: Partial<Record<CuttableError, number>>;
  /** Keep only these samples. */
  keepSamples?: string[];
  /** Remove these ids (every row with the id). */
  dropIds?: string[];
  /** Keep rows with a finite calibrator distance whatever their redshift (Cepheid hosts are nearby). */
  exemptCalibratorsFromRedshiftCuts?: boolean;
}

const ERROR_COLUMNS: Record<CuttableError, keyof SupernovaTable> = {
  m_b_err: 'peakMagErr', x1_err: 'stretchErr', color_err: 'colorErr',
  magnitude_err: 'magnitudeErr', z_err: 'redshiftErr', host_log_mass_err: 'hostLogMassErr',
};

/**
 * Applies the cuts in a fixed order (dropIds, keepSamples, redshiftMin,
 * redshiftMax, maxAbsStretch, maxAbsColor, then maxErrors in the order
 * m_b_err, x1_err, color_err, magnitude_err, z_err, host_log_mass_err) and
 * reports how many rows each removed and what is left per sample.
 * Cost O(rows x cuts).
 * @param table the table (not modified).
 * @param cuts the cuts; bounds are dimensionless except colour (mag) and magnitude errors (mag).
 * @returns the cut table, the kept 0-based row indices of the input (for subsetCovariance) and the report.
 * @throws CandelaError `cuts.column_absent` when a cut needs a column the table lacks,
 *   `cuts.bad_value` for a non-finite bound, `cuts.nothing_left` when no row survives.
 * @example applyCuts(table, { redshiftMin: 0.01 }).report.steps[0].description // 'z >= 0.01'
 */
export function applyCuts(table: SupernovaTable, cuts: CutOptions): { table: SupernovaTable; keptIndices: Int32Array; report: CutReport } {
  const keep = new Uint8Array(table.count).fill(1);
  let remaining = table.count;
  const steps: CutStep[] = [];
  const warnings: Issue[] = [];
  const problems: Issue[] = [];
  const apply = (name: string, description: string, removes: (i: number) => boolean): void => {
    let removed = 0;
    for (let i = 0; i < table.count; i++) {
      if (keep[i] && removes(i)) {
        keep[i] = 0;
        removed++;
      }
    }
    remaining -= removed;
    steps.push({ name, description, removed, remaining });
  };
  const bound = (name: string, value: number | undefined): value is number => {
    if (value === undefined) return false;
    if (Number.isFinite(value)) return true;
    problems.push({ code: 'cuts.bad_value', path: name, message: `cut ${name} must be a finite number`, found: String(value), fix: 'correct the cut value or remove the cut' });
    return false;
  };
  const column = (name: string, key: keyof SupernovaTable): Float64Array | undefined => {
    const values = table[key];
    if (values instanceof Float64Array) return values;
    problems.push({ code: 'cuts.column_absent', path: name, file: table.sourceFile, message: `cut ${name} needs a column the table does not have`, fix: 'map that column when reading the table, or remove the cut' });
    return undefined;
  };

  if (cuts.dropIds?.length) {
    const known = new Set(table.ids);
    for (const id of cuts.dropIds) {
      if (known.has(id)) continue;
      const suggestion = closestName(id, [...known]);
      warnings.push({ code: 'cuts.unknown_id', severity: 'warning', path: 'dropIds', file: table.sourceFile, message: `id '${id}' is not in the table; nothing was dropped for it`, fix: suggestion ? `did you mean '${suggestion}'?` : 'check the id spelling' });
    }
    const drop = new Set(cuts.dropIds);
    apply('dropIds', `ids not in the drop list (${cuts.dropIds.length} listed)`, (i) => drop.has(table.ids[i]));
  }
  if (cuts.keepSamples?.length) {
    for (const sample of cuts.keepSamples) {
      if (table.sampleNames.includes(sample)) continue;
      warnings.push({ code: 'cuts.unknown_sample', severity: 'warning', path: 'keepSamples', file: table.sourceFile, message: `sample '${sample}' is not in the table`, expected: `one of ${table.sampleNames.join(', ')}`, fix: 'check the sample labels' });
    }
    const wanted = new Set(cuts.keepSamples);
    apply('keepSamples', `samples ${cuts.keepSamples.join(', ')}`, (i) => !wanted.has(table.samples[i]));
  }
  const spared = (i: number): boolean => cuts.exemptCalibratorsFromRedshiftCuts === true && table.calibratorMu !== undefined && Number.isFinite(table.calibratorMu[i]);
  const calibratorNote = cuts.exemptCalibratorsFromRedshiftCuts ? ' or calibrator' : '';
  if (bound('redshiftMin', cuts.redshiftMin)) {
    const min = cuts.redshiftMin;
    apply('redshiftMin', `z >= ${min}${calibratorNote}`, (i) => !(table.redshift[i] >= min) && !spared(i));
  }
  if (bound('redshiftMax', cuts.redshiftMax)) {
    const max = cuts.redshiftMax;
    apply('redshiftMax', `z <= ${max}${calibratorNote}`, (i) => !(table.redshift[i] <= max) && !spared(i));
  }
  if (bound('maxAbsStretch', cuts.maxAbsStretch)) {
    const max = cuts.maxAbsStretch;
    const stretch = column('maxAbsStretch', 'stretch');
    if (stretch) apply('maxAbsStretch', `|x1| <= ${max}`, (i) => !(Math.abs(stretch[i]) <= max));
  }
  if (bound('maxAbsColor', cuts.maxAbsColor)) {
    const max = cuts.maxAbsColor;
    const color = column('maxAbsColor', 'color');
    if (color) apply('maxAbsColor', `|c| <= ${max}`, (i) => !(Math.abs(color[i]) <= max));
  }
  for (const field of Object.keys(ERROR_COLUMNS) as CuttableError[]) {
    const max = cuts.maxErrors?.[field];
    if (!bound(`maxErrors.${field}`, max)) continue;
    const sigma = column(`maxErrors.${field}`, ERROR_COLUMNS[field]);
    if (sigma) apply(`maxErrors.${field}`, `${field} <= ${max}`, (i) => sigma[i] > max);
  }
  if (problems.length === 0 && remaining === 0) {
    const removedBy = steps.filter((step) => step.removed > 0).map((step) => `keep ${step.description}: ${step.removed} removed`).join('; ');
    problems.push({
      code: 'cuts.nothing_left', file: table.sourceFile, message: `the cuts removed all ${table.count} supernovae`,
      found: removedBy || undefined, fix: 'loosen the cuts; the cut report lists what each removed',
    });
  }
  if (problems.length > 0) throw new CandelaError(problems);

  const keptIndices = new Int32Array(remaining);
  for (let i = 0, k = 0; i < table.count; i++) if (keep[i]) keptIndices[k++] = i;
  const result = selectRows(table, keptIndices);
  const perSample = table.sampleNames.map((sample) => ({
    sample,
    before: table.samples.filter((s) => s === sample).length,
    after: result.samples.filter((s) => s === sample).length,
  }));
  return { table: result, keptIndices, report: { initialCount: table.count, finalCount: remaining, steps, perSample, warnings } };
}
