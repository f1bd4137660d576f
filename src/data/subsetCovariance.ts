import type { CovarianceMatrix } from './supernovaTable.js';

/**
 * The covariance of the supernovae kept by a cut: rows and columns of the
 * kept supernovae, in the order of `keptIndices`. For a light-curve matrix
 * (3N x 3N, canonical interleaved order) each kept supernova keeps its three
 * rows. Cost O(k^2) (O(9 k^2) for light curves), k = kept count.
 * @param cov the full matrix.
 * @param keptIndices 0-based supernova indices into the uncut table (from applyCuts).
 * @throws RangeError when an index is outside the matrix (a programming error).
 * @example subsetCovariance(cov4x4, Int32Array.of(0, 2)).size // 2
 */
export function subsetCovariance(cov: CovarianceMatrix, keptIndices: Int32Array): CovarianceMatrix {
  const block = cov.target === 'light_curves' ? 3 : 1;
  const rows = new Int32Array(keptIndices.length * block);
  keptIndices.forEach((index, k) => {
    for (let p = 0; p < block; p++) rows[k * block + p] = index * block + p;
  });
  for (const row of rows) {
    if (row < 0 || row >= cov.size) throw new RangeError(`subsetCovariance: row ${row} outside a ${cov.size} x ${cov.size} matrix`);
  }
  const size = rows.length;
  const values = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    const source = rows[i] * cov.size;
    for (let j = 0; j < size; j++) values[i * size + j] = cov.values[source + rows[j]];
  }
  return { target: cov.target, size, values, sourceFile: cov.sourceFile };
}
