/**
 * Below this |Omega_k chi^2| the transverse distance uses its Taylor series:
 * the first omitted term, t^5 / 11!, is below 3e-18 relative there, and the
 * series joins sinh and sin smoothly through Omega_k = 0 (no division by a
 * vanishing sqrt(|Omega_k|)).
 */
const SERIES_LIMIT = 1e-2;

/**
 * Transverse comoving distance from the line-of-sight comoving distance, both
 * in Hubble units (distance H0 / c) (Hogg 1999, arXiv:astro-ph/9905116, eq. 16):
 * D_M = sinh(sqrt(Omega_k) chi) / sqrt(Omega_k) for Omega_k > 0, chi for
 * Omega_k = 0, sin(sqrt(-Omega_k) chi) / sqrt(-Omega_k) for Omega_k < 0.
 * Written as chi S(Omega_k chi^2) with S(t) = 1 + t/6 + t^2/120 + t^3/5040 + t^4/362880
 * for |t| < 1e-2. Beyond the antipode of a closed universe D_M is negative
 * (the sine's sign is kept, as in Hogg 1999).
 * Cost: O(1), one sinh/sin at most.
 * @param comovingHubble chi = D_C H0 / c (>= 0), dimensionless.
 * @param omegaCurvature Omega_k, dimensionless.
 * @throws nothing.
 * @example transverseComovingDistance(1, 0.25) // => 2 sinh(0.5) = 1.0421906109874948
 */
export function transverseComovingDistance(comovingHubble: number, omegaCurvature: number): number {
  const t = omegaCurvature * comovingHubble * comovingHubble;
  if (Math.abs(t) < SERIES_LIMIT) {
    return comovingHubble * (1 + t * (1 / 6 + t * (1 / 120 + t * (1 / 5040 + t / 362880))));
  }
  if (omegaCurvature > 0) {
    const root = Math.sqrt(omegaCurvature);
    return Math.sinh(root * comovingHubble) / root;
  }
  const root = Math.sqrt(-omegaCurvature);
  return Math.sin(root * comovingHubble) / root;
}
