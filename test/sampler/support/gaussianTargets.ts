/**
 * Exact Gaussian test targets with a chosen condition number. The mean and
 * covariance of a multivariate normal are its parameters (definition of the
 * distribution), so they are the reference values of the sampler tests.
 */

/** Row-major n x n orthogonal matrix: Gram-Schmidt on a fixed, well-conditioned pattern. */
export function fixedRotation(n: number): Float64Array {
  const q = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    const row = Float64Array.from({ length: n }, (_, c) => Math.sin(1 + 3 * r + 7 * c + r * c) + (r === c ? 2 : 0));
    for (let p = 0; p < r; p++) {
      let dot = 0;
      for (let c = 0; c < n; c++) dot += row[c] * q[p * n + c];
      for (let c = 0; c < n; c++) row[c] -= dot * q[p * n + c];
    }
    const norm = Math.hypot(...row);
    for (let c = 0; c < n; c++) q[r * n + c] = row[c] / norm;
  }
  return q;
}

/** Covariance Q diag(eigenvalues) Q^T for the orthogonal Q (rows are eigenvectors). */
export function covarianceFromEigen(rotation: Float64Array, eigenvalues: number[]): Float64Array {
  const n = eigenvalues.length;
  const covariance = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < n; k++) sum += rotation[k * n + i] * eigenvalues[k] * rotation[k * n + j];
      covariance[i * n + j] = sum;
    }
  }
  return covariance;
}

/** Rotation of the plane by `angle` radians (rows are the rotated axes). */
export function planeRotation(angle: number): Float64Array {
  return Float64Array.of(Math.cos(angle), Math.sin(angle), -Math.sin(angle), Math.cos(angle));
}
