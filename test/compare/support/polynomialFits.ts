import { choleskyInPlace, choleskySolveInPlace, logDeterminantFromCholesky } from '../../../src/math/index.js';

/** Design matrix rows [1, x, x^2, ...] of a polynomial of the given number of coefficients. */
function designRow(x: number, coefficients: number): number[] {
  return Array.from({ length: coefficients }, (_, p) => x ** p);
}

/**
 * Weighted least-squares polynomial fit by the normal equations
 * (X^T X / s^2) c = X^T y / s^2 (Press et al. 2007, Numerical Recipes section 15.4),
 * solved with the Cholesky kernels of src/math. Returns the coefficients and chi2_min.
 */
export function fitPolynomial(x: number[], y: number[], sigma: number, coefficients: number): { coefficients: number[]; chiSquareMinimum: number } {
  const normal = new Float64Array(coefficients * coefficients);
  const right = new Float64Array(coefficients);
  x.forEach((value, i) => {
    const row = designRow(value, coefficients);
    for (let p = 0; p < coefficients; p++) {
      right[p] += (row[p] * y[i]) / sigma ** 2;
      for (let q = 0; q < coefficients; q++) normal[p * coefficients + q] += (row[p] * row[q]) / sigma ** 2;
    }
  });
  choleskyInPlace(normal, coefficients);
  const solution = Array.from(choleskySolveInPlace(normal, coefficients, right));
  const chiSquareMinimum = x.reduce((sum, value, i) => {
    const model = designRow(value, coefficients).reduce((total, term, p) => total + term * solution[p], 0);
    return sum + ((y[i] - model) / sigma) ** 2;
  }, 0);
  return { coefficients: solution, chiSquareMinimum };
}

/**
 * Exact ln Z of the polynomial model with prior c ~ N(0, tau^2 I): y ~ N(0, s^2 I + tau^2 X X^T)
 * (linear-Gaussian marginal likelihood, common practice).
 */
export function polynomialLogEvidence(x: number[], y: number[], sigma: number, coefficients: number, priorWidth: number): number {
  const n = x.length;
  const covariance = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const rowI = designRow(x[i], coefficients);
    for (let j = 0; j < n; j++) {
      const rowJ = designRow(x[j], coefficients);
      covariance[i * n + j] = priorWidth ** 2 * rowI.reduce((sum, value, p) => sum + value * rowJ[p], 0) + (i === j ? sigma ** 2 : 0);
    }
  }
  choleskyInPlace(covariance, n);
  const solved = choleskySolveInPlace(covariance, n, Float64Array.from(y));
  const quadratic = y.reduce((sum, value, i) => sum + value * solved[i], 0);
  return -0.5 * (n * Math.log(2 * Math.PI) + logDeterminantFromCholesky(covariance, n) + quadratic);
}
