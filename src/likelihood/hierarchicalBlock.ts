/**
 * The 3 x 3 algebra of one supernova in the hierarchical (latent-variable)
 * standardization model (private helper). Symmetric blocks are stored as
 * [s00, s01, s02, s11, s12, s22]; lower Cholesky factors as
 * [l00, l10, l20, l11, l21, l22].
 *
 * Model (March, Trotta, Berkes, Starkman & Vaudrevange 2011, MNRAS 418,
 * 2308, with latent variables as in Kelly 2007, ApJ 665, 1489): for
 * supernova i with true stretch x and colour c,
 *
 *   m_B    = mu(z) + M - s_i - alpha x + beta c + e_int + n_m
 *   x1_obs = x + n_x
 *   c_obs  = c + n_c
 *   x ~ N(x*, R_x^2),  c ~ N(c*, R_c^2),  e_int ~ N(0, sigma_int^2),
 *   (n_m, n_x, n_c) ~ N(0, V_i)   (light-curve fit covariance + fixed scatter),
 *
 * s_i = mass_step (f_high - 1/2). Derivation of the marginal: with t = (x, c),
 * t = t* + xi, xi ~ N(0, D), D = diag(R_x^2, R_c^2), and
 *
 *   A = | -alpha  beta |        o = b + A t* + A xi + e,
 *       |    1     0   |        b = (mu + M - s_i, 0, 0),
 *       |    0     1   |        e = (e_int + n_m, n_x, n_c) ~ N(0, V_i + diag(sigma_int^2, 0, 0)).
 *
 * o is a sum of independent Gaussians, so integrating t out is exact:
 *
 *   o ~ N(m_i, Sigma_i),  m_i = (mu + M - s_i - alpha x* + beta c*, x*, c*),
 *   Sigma_i = V_i + diag(sigma_int^2, 0, 0) + A D A^T,
 *
 *   A D A^T = | alpha^2 R_x^2 + beta^2 R_c^2   -alpha R_x^2   beta R_c^2 |
 *             |        -alpha R_x^2                R_x^2          0      |
 *             |         beta R_c^2                  0           R_c^2    |.
 *
 * The intrinsic scatter is pure magnitude scatter, so it enters the (m_B, m_B)
 * entry only. The latent posterior follows from cov(t, o) = D A^T:
 * E[t | o] = t* + D A^T Sigma^-1 (o - m), Cov[t | o] = D - D A^T Sigma^-1 A D.
 */

/**
 * Sigma_i = V_i + diag(sigma_int^2, 0, 0) + A D A^T (see the module comment).
 * Cost O(1), no allocation.
 * @param measurement V blocks, 6 per supernova
 * @param at offset of V_i in `measurement` (6 i)
 * @param alpha stretch coefficient, mag; beta colour coefficient, mag/mag
 * @param stretchVariance R_x^2; colorVariance R_c^2 (mag^2); intrinsicVariance sigma_int^2 (mag^2)
 * @param out 6 entries of Sigma_i
 * @example populationCovarianceBlock(Float64Array.of(0.01, 0, 0, 0.09, 0, 0.0016), 0, 0.14, 3.1, 1, 0.01, 0.01, out)
 *   // out[0] = 0.01 + 0.01 + 0.0196 + 0.0961 = 0.1357
 */
export function populationCovarianceBlock(
  measurement: Float64Array, at: number, alpha: number, beta: number,
  stretchVariance: number, colorVariance: number, intrinsicVariance: number, out: Float64Array,
): void {
  out[0] = measurement[at] + intrinsicVariance + alpha * alpha * stretchVariance + beta * beta * colorVariance;
  out[1] = measurement[at + 1] - alpha * stretchVariance;
  out[2] = measurement[at + 2] + beta * colorVariance;
  out[3] = measurement[at + 3] + stretchVariance;
  out[4] = measurement[at + 4];
  out[5] = measurement[at + 5] + colorVariance;
}

/**
 * Cholesky factor of a symmetric 3 x 3 block, written out (Golub & Van Loan,
 * Matrix Computations, algorithm 4.2.1). Cost O(1), no allocation.
 * @param block [s00, s01, s02, s11, s12, s22]
 * @param factor out: [l00, l10, l20, l11, l21, l22]
 * @returns ln det = 2 ln(l00 l11 l22), or NaN when the block is not positive definite
 * @example choleskyBlock(Float64Array.of(4, 0, 0, 9, 0, 1), factor) // ln 36; factor = [2, 0, 0, 3, 0, 1]
 */
export function choleskyBlock(block: Float64Array, factor: Float64Array): number {
  const l00 = Math.sqrt(block[0]);
  const l10 = block[1] / l00;
  const l20 = block[2] / l00;
  const pivot11 = block[3] - l10 * l10;
  const l11 = Math.sqrt(pivot11);
  const l21 = (block[4] - l20 * l10) / l11;
  const pivot22 = block[5] - l20 * l20 - l21 * l21;
  const l22 = Math.sqrt(pivot22);
  factor[0] = l00; factor[1] = l10; factor[2] = l20; factor[3] = l11; factor[4] = l21; factor[5] = l22;
  if (!(block[0] > 0 && pivot11 > 0 && pivot22 > 0) || !Number.isFinite(l00 * l11 * l22)) return NaN;
  return 2 * Math.log(l00 * l11 * l22);
}

/**
 * y = L^-1 v for one block (forward substitution), written into out[at..at+2].
 * Cost O(1), no allocation.
 * @param factor [l00, l10, l20, l11, l21, l22] from {@link choleskyBlock}
 * @example whitenBlock(Float64Array.of(2, 0, 0, 3, 0, 1), 2, 3, 1, out, 0) // out = [1, 1, 1]
 */
export function whitenBlock(factor: Float64Array, v0: number, v1: number, v2: number, out: Float64Array, at: number): void {
  const y0 = v0 / factor[0];
  const y1 = (v1 - factor[1] * y0) / factor[3];
  out[at] = y0;
  out[at + 1] = y1;
  out[at + 2] = (v2 - factor[2] * y0 - factor[4] * y1) / factor[5];
}
