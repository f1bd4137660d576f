import { CandelaError } from '../errors.js';
import { compensatedSum } from '../math/index.js';

/**
 * Validated weights of n posterior draws (private helper of the compare layer).
 * Missing weights mean equal weights of 1.
 * @throws CandelaError `compare.invalid_argument` for a length mismatch, a negative or non-finite weight, or all weights zero.
 */
export function checkedWeights(count: number, weights: ArrayLike<number> | undefined, path: string): Float64Array {
  const result = new Float64Array(count);
  if (weights && weights.length !== count) {
    throw new CandelaError({ code: 'compare.invalid_argument', path, message: 'there must be one weight per draw', expected: String(count), found: String(weights.length) });
  }
  for (let k = 0; k < count; k++) {
    const w = weights ? weights[k] : 1;
    if (!(w >= 0) || !Number.isFinite(w)) {
      throw new CandelaError({ code: 'compare.invalid_argument', path: `${path}[${k}]`, message: 'a weight must be finite and >= 0', expected: '>= 0', found: String(w) });
    }
    result[k] = w;
  }
  if (!(compensatedSum(result) > 0)) {
    throw new CandelaError({ code: 'compare.invalid_argument', path, message: 'the weights are all zero', expected: 'some positive weight', found: '0' });
  }
  return result;
}

/** Kish (1965) effective number of draws, (sum w)^2 / sum w^2. */
export function effectiveDrawCount(weights: Float64Array): number {
  const squares = new Float64Array(weights.length);
  for (let k = 0; k < weights.length; k++) squares[k] = weights[k] * weights[k];
  const total = compensatedSum(weights);
  return (total * total) / compensatedSum(squares);
}

/**
 * Weighted means and covariance matrix (row major, d x d) of d columns of
 * draws, with the unbiased reliability-weight normalization
 * sum w / ((sum w)^2 - sum w^2) (the n - 1 form for equal weights).
 * Compensated sums (Neumaier 1974).
 */
export function weightedMeanAndCovariance(columns: ReadonlyArray<ArrayLike<number>>, weights: Float64Array): { mean: Float64Array; covariance: Float64Array } {
  const dimension = columns.length;
  const count = weights.length;
  const total = compensatedSum(weights);
  const terms = new Float64Array(count);
  const mean = new Float64Array(dimension);
  for (let i = 0; i < dimension; i++) {
    for (let k = 0; k < count; k++) terms[k] = weights[k] * columns[i][k];
    mean[i] = compensatedSum(terms) / total;
  }
  for (let k = 0; k < count; k++) terms[k] = weights[k] * weights[k];
  const denominator = total - compensatedSum(terms) / total;
  const covariance = new Float64Array(dimension * dimension);
  for (let i = 0; i < dimension; i++) {
    for (let j = 0; j <= i; j++) {
      for (let k = 0; k < count; k++) terms[k] = weights[k] * (columns[i][k] - mean[i]) * (columns[j][k] - mean[j]);
      const value = compensatedSum(terms) / denominator;
      covariance[i * dimension + j] = value;
      covariance[j * dimension + i] = value;
    }
  }
  return { mean, covariance };
}
