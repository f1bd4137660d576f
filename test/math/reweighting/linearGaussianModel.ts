// A linear model with Gaussian errors, the outside reference of the reweighting tests:
// d = A theta + e, e ~ N(0, C), flat prior. Its posterior is Gaussian with the
// generalized least-squares mean and covariance (Aitken 1935, Proc. R. Soc. Edinb.
// 55, 42): Cov = (A^T C^-1 A)^-1, mean = Cov A^T C^-1 d. Dense helpers, small sizes only.
import { choleskyInPlace, choleskySolveInPlace, createRandomStream, solveLowerInPlace } from '../../../src/math/index.js';

export interface LinearGaussianModel {
  /** Rows of data. */
  n: number;
  /** Parameters. */
  p: number;
  /** Design A, n x p row major. */
  design: Float64Array;
  data: Float64Array;
}

/** The posterior of theta under covariance C (n x n): GLS mean and covariance. */
export function generalizedLeastSquares(model: LinearGaussianModel, covariance: Float64Array): { mean: Float64Array; covariance: Float64Array } {
  const { n, p, design, data } = model;
  const factor = Float64Array.from(covariance);
  if (!choleskyInPlace(factor, n).ok) throw new Error('C not positive definite');
  const whitenedColumns: Float64Array[] = [];
  for (let j = 0; j < p; j++) whitenedColumns.push(choleskySolveInPlace(factor, n, Float64Array.from({ length: n }, (_, i) => design[i * p + j])));
  const fisher = new Float64Array(p * p);
  const projected = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    for (let l = 0; l < p; l++) for (let i = 0; i < n; i++) fisher[j * p + l] += design[i * p + l] * whitenedColumns[j][i];
    for (let i = 0; i < n; i++) projected[j] += data[i] * whitenedColumns[j][i];
  }
  const fisherFactor = Float64Array.from(fisher);
  choleskyInPlace(fisherFactor, p);
  const mean = choleskySolveInPlace(fisherFactor, p, Float64Array.from(projected));
  const inverse = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    const unit = new Float64Array(p);
    unit[j] = 1;
    choleskySolveInPlace(fisherFactor, p, unit);
    for (let l = 0; l < p; l++) inverse[l * p + j] = unit[l];
  }
  return { mean, covariance: inverse };
}

/** ln L(theta) = -r^T C^-1 r / 2 (constants dropped) at each draw (n x p row major). */
export function logLikelihoodAtDraws(model: LinearGaussianModel, covariance: Float64Array, draws: Float64Array): Float64Array {
  const { n, p, design, data } = model;
  const factor = Float64Array.from(covariance);
  if (!choleskyInPlace(factor, n).ok) throw new Error('C not positive definite');
  const count = draws.length / p;
  const result = new Float64Array(count);
  const residual = new Float64Array(n);
  for (let s = 0; s < count; s++) {
    for (let i = 0; i < n; i++) {
      let prediction = 0;
      for (let j = 0; j < p; j++) prediction += design[i * p + j] * draws[s * p + j];
      residual[i] = data[i] - prediction;
    }
    solveLowerInPlace(factor, n, residual);
    let chi2 = 0;
    for (let i = 0; i < n; i++) chi2 += residual[i] * residual[i];
    result[s] = -chi2 / 2;
  }
  return result;
}

/** Independent draws from N(mean, covariance), count x p row major, seeded. */
export function drawGaussian(mean: Float64Array, covariance: Float64Array, count: number, seed: string): Float64Array {
  const p = mean.length;
  const factor = Float64Array.from(covariance);
  choleskyInPlace(factor, p);
  const random = createRandomStream(seed);
  const draws = new Float64Array(count * p);
  const z = new Float64Array(p);
  for (let s = 0; s < count; s++) {
    for (let j = 0; j < p; j++) z[j] = random.normal();
    for (let j = 0; j < p; j++) {
      let value = mean[j];
      for (let l = 0; l <= j; l++) value += factor[j * p + l] * z[l];
      draws[s * p + j] = value;
    }
  }
  return draws;
}

/** D + sum over the listed modes of U_k U_k^T, n x n. */
export function covarianceWithModes(diagonal: Float64Array, modes: readonly Float64Array[]): Float64Array {
  const n = diagonal.length;
  const result = new Float64Array(n * n);
  for (let i = 0; i < n; i++) result[i * n + i] = diagonal[i];
  for (const mode of modes) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) result[i * n + j] += mode[i] * mode[j];
  return result;
}
