import { checkPhysicalDensities } from './checkPhysicalDensities.js';

/**
 * Redshift of the drag epoch z_d, when the baryons are released from the
 * Compton drag of the photons, by the fitting formula of Eisenstein & Hu
 * (1998, ApJ 496, 605, eq. 4):
 *   z_d = 1291 (omega_m)^0.251 / [1 + 0.659 (omega_m)^0.828] [1 + b1 (omega_b)^b2],
 *   b1 = 0.313 (omega_m)^-0.419 [1 + 0.607 (omega_m)^0.674],
 *   b2 = 0.238 (omega_m)^0.223,
 * with omega_m = Omega_m h^2 and omega_b = Omega_b h^2 (their Omega_0 h^2 and Omega_b h^2).
 * The paper states (from memory) that it fits their recombination calculation to 1%
 * (0.025 <= omega_m <= 0.64). It is known to fall about 4% below the drag
 * redshift of modern Boltzmann codes (about 1020 against 1060 at Planck-like
 * parameters), because the definitions of the epoch differ; the sound
 * horizon at this z_d is then about 2% too large, which is why
 * dragSoundHorizonFitMpc fits r_d directly.
 * Cost: O(1).
 * @param omegaBaryonH2 omega_b = Omega_b h^2, physical baryon density (> 0).
 * @param omegaMatterH2 omega_m = Omega_m h^2, physical density of all matter (>= omegaBaryonH2).
 * @returns z_d (dimensionless).
 * @throws CandelaError cosmology.physical_density_invalid for densities that are not finite, positive and ordered.
 * @example dragRedshift(0.02237, 0.1424) // => 1020.7... (Planck-like omega_b, omega_m)
 */
export function dragRedshift(omegaBaryonH2: number, omegaMatterH2: number): number {
  checkPhysicalDensities(omegaBaryonH2, omegaMatterH2);
  const b1 = 0.313 * Math.pow(omegaMatterH2, -0.419) * (1 + 0.607 * Math.pow(omegaMatterH2, 0.674));
  const b2 = 0.238 * Math.pow(omegaMatterH2, 0.223);
  return (1291 * Math.pow(omegaMatterH2, 0.251) / (1 + 0.659 * Math.pow(omegaMatterH2, 0.828))) *
    (1 + b1 * Math.pow(omegaBaryonH2, b2));
}
