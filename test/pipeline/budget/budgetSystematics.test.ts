// The systematics of a configuration and the data of one budget variant.
import { describe, expect, it } from 'vitest';
import type { CandelaConfig } from '../../../src/config/index.js';
import type { CovarianceMatrix } from '../../../src/data/index.js';
import { budgetSystematics, variantData } from '../../../src/pipeline/budget/budgetSystematics.js';
import type { LoadedSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';

const path = (name: string) => ({ written: name, resolved: name });
const matrix = (source: string): CovarianceMatrix => ({ target: 'magnitudes', size: 2, values: Float64Array.of(1, 0, 0, 1), sourceFile: source });

/** Two data sets: the first with a statistical matrix, a systematic one and a two-column mode file; the second with one mode column. */
function fixture(): { config: CandelaConfig; data: LoadedSupernovae } {
  const covariance = (name: string, includesStatistical: boolean) => ({ file: path(`${name}.txt`), name, includesStatistical });
  const modes = (name: string) => ({ file: path(`${name}.csv`), name, scale: 1, perColumn: false });
  const config = {
    supernovae: [
      { covariances: [covariance('stat', true), covariance('zero_points', false)], systematicModes: [modes('dust')] },
      { covariances: [], systematicModes: [modes('drift')] },
    ],
  } as unknown as CandelaConfig;
  const data = {
    covariances: [matrix('stat.txt'), matrix('zero_points.txt')],
    systematicModes: { count: 2, modeCount: 3, values: Float64Array.of(1, 2, 0, 3, 4, 5), sourceFile: 'dust.csv + drift.csv' },
    systematicModeFiles: [{ label: 'a', file: 'dust.csv', supernovae: 1, modes: 2 }, { label: 'b', file: 'drift.csv', supernovae: 1, modes: 1 }],
  } as unknown as LoadedSupernovae;
  return { config, data };
}

describe('budgetSystematics', () => {
  it('lists every covariance matrix but the statistical one and every mode file, with their matrices and columns', () => {
    const { config, data } = fixture();
    expect(budgetSystematics(config, data)).toEqual([
      { name: 'zero_points', covarianceIndices: [1], modeColumns: [] },
      { name: 'dust', covarianceIndices: [], modeColumns: [0, 1] },
      { name: 'drift', covarianceIndices: [], modeColumns: [2] },
    ]);
  });
});

describe('variantData', () => {
  const { config, data } = fixture();
  const all = budgetSystematics(config, data);

  it('keeps everything for the full set', () => {
    const variant = variantData(data, all, all);
    expect(variant.covariances).toHaveLength(2);
    expect(variant.systematicModes).toBe(data.systematicModes);
  });

  it('drops a removed matrix and zeroes the columns of a removed mode file, keeping the statistical matrix', () => {
    const variant = variantData(data, all, [all[2]]);
    expect(variant.covariances.map((c) => c.sourceFile)).toEqual(['stat.txt']);
    expect(Array.from(variant.systematicModes!.values)).toEqual([0, 0, 0, 0, 0, 5]);
    expect(Array.from(data.systematicModes!.values)).toEqual([1, 2, 0, 3, 4, 5]); // the run's data are not touched
  });

  it('drops the modes altogether for the statistical-only variant', () => {
    const variant = variantData(data, all, []);
    expect(variant.systematicModes).toBeUndefined();
    expect(variant.covariances.map((c) => c.sourceFile)).toEqual(['stat.txt']);
  });
});
