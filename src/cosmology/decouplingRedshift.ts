import { checkPhysicalDensities } from './checkPhysicalDensities.js';

/**
 * Redshift of photon decoupling z* (the last-scattering surface) by the
 * fitting formula of Hu & Sugiyama (1996, ApJ 471, 542, appendix E, eq. E1):
 *   z* = 1048 [1 + 0.00124 (omega_b)^-0.738] [1 + g1 (omega_m)^g2],
 *   g1 = 0.0783 (omega_b)^-0.238 / [1 + 39.5 (omega_b)^0.763],
 *   g2 = 0.560 / [1 + 21.1 (omega_b)^1.81],
 * with omega_b = Omega_b h^2 and omega_m = Omega_m h^2 (their Omega_0 h^2).
 * It is the z* of the compressed CMB distance priors (e.g. Chen, Huang &
 * Wang 2019, JCAP 02, 028). Accuracy: about 1% over the paper's range (from memory); at
 * Planck-like parameters it lies 0.2% above the Planck 2018 z* = 1089.9.
 * Cost: O(1).
 * @param omegaBaryonH2 omega_b = Omega_b h^2 (> 0).
 * @param omegaMatterH2 omega_m = Omega_m h^2 of all matter (>= omegaBaryonH2).
 * @returns z* (dimensionless).
 * @throws CandelaError cosmology.physical_density_invalid for densities that are not finite, positive and ordered.
 * @example decouplingRedshift(0.02237, 0.1430) // => 1091.906... (Planck-like omega_b, omega_m)
 */
export function decouplingRedshift(omegaBaryonH2: number, omegaMatterH2: number): number {
  checkPhysicalDensities(omegaBaryonH2, omegaMatterH2);
  const g1 = 0.0783 * Math.pow(omegaBaryonH2, -0.238) / (1 + 39.5 * Math.pow(omegaBaryonH2, 0.763));
  const g2 = 0.560 / (1 + 21.1 * Math.pow(omegaBaryonH2, 1.81));
  return 1048 * (1 + 0.00124 * Math.pow(omegaBaryonH2, -0.738)) * (1 + g1 * Math.pow(omegaMatterH2, g2));
}
