import { CandelaError } from '../../errors.js';
import { checkSamples } from '../../math/index.js';

/**
 * Weighted Pearson correlation matrix of several columns of the same
 * samples, by two passes (means, then centred co-moments), which avoids the
 * cancellation of the one-pass sum-of-products formula. The weight
 * normalization cancels in a correlation, so this equals R's
 * cov2cor(cov.wt(x, wt)$cov). A column with zero spread has correlation 1
 * with itself and 0 with the others (no NaN).
 *
 * Cost: O(n p^2) for n samples and p columns; p^2 doubles of memory.
 * @param columns p columns of n samples each (any units).
 * @param weights optional non-negative weights, length n.
 * @param names optional column names for error messages.
 * @returns row-major p x p matrix, entry [i * p + j].
 * @throws CandelaError `output.column_length` when columns differ in length,
 *   or the sample errors of each column.
 * @example weightedCorrelationMatrix([[1, 2, 3], [2, 4, 7]]) // [1, 0.993, 0.993, 1]
 */
export function weightedCorrelationMatrix(columns: readonly ArrayLike<number>[], weights?: ArrayLike<number>, names?: readonly string[]): Float64Array {
  const dimension = columns.length;
  const matrix = new Float64Array(dimension * dimension);
  if (dimension === 0) return matrix;
  const count = columns[0].length;
  columns.forEach((column, index) => {
    const label = names?.[index] ?? `column ${index + 1}`;
    if (column.length !== count) {
      throw new CandelaError({ code: 'output.column_length', path: label, message: `${label} has ${column.length} samples, the first column ${count}`, expected: String(count), found: String(column.length) });
    }
    checkSamples(column, weights, label);
  });
  const means = new Float64Array(dimension);
  let totalWeight = 0;
  for (let s = 0; s < count; s++) totalWeight += weights ? weights[s] : 1;
  for (let p = 0; p < dimension; p++) {
    let sum = 0;
    for (let s = 0; s < count; s++) sum += (weights ? weights[s] : 1) * columns[p][s];
    means[p] = sum / totalWeight;
  }
  const centred = new Float64Array(dimension);
  for (let s = 0; s < count; s++) {
    const weight = weights ? weights[s] : 1;
    if (weight === 0) continue;
    for (let p = 0; p < dimension; p++) centred[p] = columns[p][s] - means[p];
    for (let p = 0; p < dimension; p++) {
      const scaled = weight * centred[p];
      for (let q = p; q < dimension; q++) matrix[p * dimension + q] += scaled * centred[q];
    }
  }
  const scale = new Float64Array(dimension);
  for (let p = 0; p < dimension; p++) {
    const variance = matrix[p * dimension + p];
    scale[p] = variance > 0 ? 1 / Math.sqrt(variance) : 0;
  }
  for (let p = 0; p < dimension; p++) {
    for (let q = p; q < dimension; q++) {
      const value = p === q ? 1 : Math.max(-1, Math.min(1, matrix[p * dimension + q] * scale[p] * scale[q]));
      matrix[p * dimension + q] = value;
      matrix[q * dimension + p] = value;
    }
  }
  return matrix;
}
