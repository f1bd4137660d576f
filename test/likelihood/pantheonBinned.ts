// Test helper (not a test): a small parse of the Pantheon 2018 binned Hubble diagram
// (Scolnic et al. 2018, ApJ 859, 101; ../shared/data-real/pantheon2018/SOURCE.md):
// 40 rows of 18 whitespace fields (name zcmb zhel dz mb dmb ...), and sys_DS17f.txt = N then N*N values.
import { readFileSync } from 'node:fs';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';

export const PANTHEON_BINNED_TABLE = '../shared/data-real/pantheon2018/Binned_data/lcparam_DS17f.txt';
export const PANTHEON_BINNED_SYSTEMATICS = '../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt';

/** The 40 bins as a magnitude table (mb = standardized magnitude, dmb its statistical error). */
export function readPantheonBinned(): SupernovaTable {
  const rows = readFileSync(PANTHEON_BINNED_TABLE, 'utf8').split('\n').filter((line) => line.trim() && !line.startsWith('#'));
  const fields = rows.map((line) => line.trim().split(/\s+/));
  const column = (index: number) => Float64Array.from(fields, (f) => Number(f[index]));
  const count = rows.length;
  return {
    kind: 'magnitudes', count, ids: fields.map((f) => f[0]), samples: fields.map(() => 'all'), sampleNames: ['all'],
    sampleIndex: new Int32Array(count), redshift: column(1), redshiftHelio: column(2), redshiftErr: column(3),
    magnitude: column(4), magnitudeErr: column(5),
    sourceLine: Int32Array.from(fields, (_, i) => i + 2), sourceFile: PANTHEON_BINNED_TABLE,
  };
}

/** The 40 x 40 systematic covariance (mag^2). */
export function readPantheonBinnedSystematics(): CovarianceMatrix {
  const values = readFileSync(PANTHEON_BINNED_SYSTEMATICS, 'utf8').split(/\s+/).filter(Boolean).map(Number);
  const size = values[0];
  return { target: 'magnitudes', size, values: Float64Array.from(values.slice(1)), sourceFile: PANTHEON_BINNED_SYSTEMATICS };
}
