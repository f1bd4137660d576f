/**
 * The structure of a covariance that follows alpha and beta, measured for the
 * factorization benchmark: C_mu = A C_eta A^T with rows of A = (1, alpha,
 * -beta) (Betoule et al. 2014, A&A 568, A22, eq. 13) is a fixed quadratic
 * form in (alpha, beta),
 *
 *   C_mu = P_00 + alpha P_a + beta P_b + alpha^2 P_aa + alpha beta P_ab + beta^2 P_bb,
 *
 * with P_00 = C_mm, P_a = C_mx + C_xm, P_b = -(C_mc + C_cm), P_aa = C_xx,
 * P_ab = -(C_xc + C_cx), P_bb = C_cc, each N x N block C_pq[i][j] =
 * C_eta[3i+p][3j+q]. The six parts can be built once; each call then needs
 * only their combination on the lower triangle (what Cholesky reads): the
 * likelihood's covariance model does this when a dense 3N x 3N light-curve
 * covariance follows the sampled alpha and beta (measured 2.3-6.4x faster
 * than propagating the 3N x 3N matrix at N = 740, bench/RESULTS.md).
 */

/** The six N x N parts (row major, lower triangle filled), mag^2 and mag^2 per unit of alpha, beta. */
export interface LightCurveCovarianceParts {
  count: number;
  /** [P_00, P_a, P_b, P_aa, P_ab, P_bb]. */
  parts: Float64Array[];
}

/** Builds the six parts from the 3N x 3N light-curve covariance (interleaved m_B, x1, c). Cost 9 N^2 / 2 reads, 6 N^2 doubles of memory. */
export function splitLightCurveCovariance(cov3N: Float64Array, count: number): LightCurveCovarianceParts {
  const size = 3 * count;
  const parts = Array.from({ length: 6 }, () => new Float64Array(count * count));
  const entry = (i: number, p: number, j: number, q: number): number => cov3N[(3 * i + p) * size + 3 * j + q];
  for (let i = 0; i < count; i++) {
    for (let j = 0; j <= i; j++) {
      const cell = i * count + j;
      parts[0][cell] = entry(i, 0, j, 0);
      parts[1][cell] = entry(i, 0, j, 1) + entry(i, 1, j, 0);
      parts[2][cell] = -(entry(i, 0, j, 2) + entry(i, 2, j, 0));
      parts[3][cell] = entry(i, 1, j, 1);
      parts[4][cell] = -(entry(i, 1, j, 2) + entry(i, 2, j, 1));
      parts[5][cell] = entry(i, 2, j, 2);
    }
  }
  return { count, parts };
}

/** Writes the lower triangle of C_mu(alpha, beta) into `out` (row major N x N). Cost 6 N^2 / 2 multiply-adds, stride-1 reads. */
export function combineLightCurveCovariance(split: LightCurveCovarianceParts, alpha: number, beta: number, out: Float64Array): Float64Array {
  const { count, parts } = split;
  const [p00, pa, pb, paa, pab, pbb] = parts;
  const [ca, cb, caa, cab, cbb] = [alpha, beta, alpha * alpha, alpha * beta, beta * beta];
  for (let i = 0; i < count; i++) {
    const row = i * count;
    for (let cell = row; cell <= row + i; cell++) {
      out[cell] = p00[cell] + ca * pa[cell] + cb * pb[cell] + caa * paa[cell] + cab * pab[cell] + cbb * pbb[cell];
    }
  }
  return out;
}
