import { choleskyInPlace } from '../math/index.js';

/**
 * Smallest Cholesky pivot of the walkers' correlation matrix below which the
 * ensemble is treated as lying in a lower-dimensional subspace. The pivot is
 * 1 - R^2 of one parameter regressed on the previous ones; 1e-10 flags exact
 * (up to rounding) linear dependence only. Common practice, not tuned.
 */
export const SPAN_PIVOT_TOLERANCE = 1e-10;

/**
 * Checks that an ensemble of walkers spans the whole parameter space. An
 * affine-invariant ensemble whose walkers lie in a lower-dimensional affine
 * subspace stays in it forever (Goodman & Weare 2010, section 3), so a start
 * with, e.g., all walkers at one point must be refused.
 *
 * Method: the sample correlation matrix of the walkers must be positive
 * definite with every Cholesky pivot above {@link SPAN_PIVOT_TOLERANCE}.
 * Cost: O(walkers x dimension^2 + dimension^3); allocates two small matrices.
 * Returns undefined when the ensemble spans, or a sentence saying why not.
 * @example ensembleSpanProblem(Float64Array.of(0, 0, 1, 1, 2, 2, 3, 3), 4, 2) // 'the walkers are linearly dependent ...'
 */
export function ensembleSpanProblem(positions: Float64Array, walkers: number, dimension: number): string | undefined {
  const mean = new Float64Array(dimension);
  for (let w = 0; w < walkers; w++) for (let k = 0; k < dimension; k++) mean[k] += positions[w * dimension + k] / walkers;
  const covariance = new Float64Array(dimension * dimension);
  for (let w = 0; w < walkers; w++) {
    const row = w * dimension;
    for (let i = 0; i < dimension; i++) {
      const di = positions[row + i] - mean[i];
      for (let j = 0; j <= i; j++) covariance[i * dimension + j] += di * (positions[row + j] - mean[j]);
    }
  }
  for (let i = 0; i < dimension; i++) {
    if (!(covariance[i * dimension + i] > 0)) return `every walker has the same value of parameter ${i + 1}`;
  }
  for (let i = 0; i < dimension; i++) {
    for (let j = 0; j < i; j++) {
      covariance[i * dimension + j] /= Math.sqrt(covariance[i * dimension + i] * covariance[j * dimension + j]);
    }
  }
  for (let i = 0; i < dimension; i++) covariance[i * dimension + i] = 1;
  const factor = choleskyInPlace(covariance, dimension);
  if (!factor.ok || factor.smallestPivot < SPAN_PIVOT_TOLERANCE) {
    return 'the walkers are linearly dependent (they lie in a lower-dimensional subspace), so the ensemble could never leave it';
  }
  return undefined;
}
