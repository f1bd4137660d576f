import type { CandelaConfig } from '../../config/index.js';
import { readSystematicModes, withoutModeColumns } from '../../data/index.js';
import type { LoadedSupernovae } from '../run/loadSupernovae.js';

/** One systematic of the budget: its name and what of the loaded data carries it. */
export interface BudgetSystematic {
  /** The configuration's name (`name`, or the file's stem), or `<name>.<column>` for a per_column mode file. */
  name: string;
  /** Indices into LoadedSupernovae.covariances of the matrices it consists of. */
  covarianceIndices: number[];
  /** Columns of LoadedSupernovae.systematicModes (the joined U) it consists of. */
  modeColumns: number[];
}

/**
 * The systematics of a configuration, in configuration order (data set by
 * data set: its covariance matrices, then its mode files): one per
 * `covariances` entry (except those that hold the statistical errors, which
 * are never removed) and one per `systematic_modes` entry, or one per column
 * of it with `per_column: true`, named `<name>.<column name>` from the file's
 * header (`<name>.<n>` without one). The indices follow loadSupernovae's
 * joining: matrices in the order read, mode columns side by side.
 *
 * Cost: O(entries), plus one read of each per_column mode file (for its header).
 * @param config the run's configuration.
 * @param data its data, as loadSupernovae returned them.
 * @returns the systematics, possibly none.
 * @example budgetSystematics(config, data).map((s) => s.name) // ['kestrel.calibration_nearby', ...]
 */
export function budgetSystematics(config: CandelaConfig, data: LoadedSupernovae): BudgetSystematic[] {
  const systematics: BudgetSystematic[] = [];
  let matrix = 0;
  let column = 0;
  let modeFile = 0;
  for (const set of config.supernovae) {
    for (const source of set.covariances) {
      if (!source.includesStatistical) systematics.push({ name: source.name, covarianceIndices: [matrix], modeColumns: [] });
      matrix++;
    }
    for (const source of set.systematicModes) {
      const width = data.systematicModeFiles[modeFile]?.modes ?? 0;
      modeFile++;
      const columns = Array.from({ length: width }, (_, j) => column + j);
      column += width;
      if (!source.perColumn) {
        systematics.push({ name: source.name, covarianceIndices: [], modeColumns: columns });
        continue;
      }
      const header = readSystematicModes({
        file: source.file.resolved, displayName: source.file.written, expectedSupernovae: data.systematicModeFiles[modeFile - 1].supernovae, scale: source.scale,
      }).columnNames;
      columns.forEach((at, j) => systematics.push({ name: `${source.name}.${header?.[j] ?? j + 1}`, covarianceIndices: [], modeColumns: [at] }));
    }
  }
  return systematics;
}

/**
 * The data of one variant of the budget: the statistical errors plus the
 * systematics in `kept` only. Removed covariance matrices are dropped;
 * removed mode columns are set to zero (their part of U U^T vanishes), and
 * with no column left the modes are dropped altogether. Matrices that hold
 * the statistical errors are always kept.
 *
 * Cost: O(N K) for the modes copy.
 * @param data the loaded data with every systematic.
 * @param all every systematic of the budget.
 * @param kept the systematics this variant keeps.
 * @returns a LoadedSupernovae sharing the table with `data`.
 */
export function variantData(data: LoadedSupernovae, all: readonly BudgetSystematic[], kept: readonly BudgetSystematic[]): LoadedSupernovae {
  const removedMatrices = new Set(all.filter((s) => !kept.includes(s)).flatMap((s) => s.covarianceIndices));
  const removedColumns = new Set(all.filter((s) => !kept.includes(s)).flatMap((s) => s.modeColumns));
  const covariances = data.covariances.filter((_, index) => !removedMatrices.has(index));
  const modes = data.systematicModes;
  if (!modes || removedColumns.size === 0) return { ...data, covariances };
  const { systematicModes: _dropped, ...rest } = data;
  const keptModes = withoutModeColumns(modes, removedColumns);
  return keptModes ? { ...rest, covariances, systematicModes: keptModes } : { ...rest, covariances };
}
