/**
 * Propagates a light-curve covariance to standardized magnitudes:
 * C_mu = A C_eta A^T with A the N x 3N block-diagonal matrix whose rows are
 * (1, alpha, -beta) (Betoule et al. 2014, A&A 568, A22), for
 * C_eta in canonical interleaved order (m_B1, x1_1, c_1, m_B2, ...).
 * Each output entry is sum_{p,q} a_p a_q C_eta[3i+p, 3j+q]. Cost O(9 N^2),
 * no allocation.
 * @param cov3N row-major 3N x 3N matrix, in the units of (mag, 1, mag).
 * @param count number of supernovae N.
 * @param alpha stretch coefficient, mag.
 * @param beta colour coefficient, mag/mag.
 * @param out row-major N x N output, mag^2; returned.
 * @example propagateLightCurveCovariance(Float64Array.of(1,0,0, 0,1,0, 0,0,1), 1, 0.1, 3, new Float64Array(1)) // [1 + 0.01 + 9]
 */
export function propagateLightCurveCovariance(cov3N: Float64Array, count: number, alpha: number, beta: number, out: Float64Array): Float64Array {
  const size = 3 * count;
  const a1 = alpha;
  const a2 = -beta;
  for (let i = 0; i < count; i++) {
    const row0 = 3 * i * size;
    const row1 = row0 + size;
    const row2 = row1 + size;
    for (let j = 0; j < count; j++) {
      const c = 3 * j;
      const fromMag = cov3N[row0 + c] + a1 * cov3N[row0 + c + 1] + a2 * cov3N[row0 + c + 2];
      const fromStretch = cov3N[row1 + c] + a1 * cov3N[row1 + c + 1] + a2 * cov3N[row1 + c + 2];
      const fromColor = cov3N[row2 + c] + a1 * cov3N[row2 + c + 1] + a2 * cov3N[row2 + c + 2];
      out[i * count + j] = fromMag + a1 * fromStretch + a2 * fromColor;
    }
  }
  return out;
}
