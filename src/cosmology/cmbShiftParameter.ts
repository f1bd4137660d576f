import type { Cosmology } from './cosmology.js';

/**
 * CMB shift parameter R(z) = sqrt(Omega_m H0^2) D_M(z) / c
 * (Bond, Efstathiou & Tegmark 1997, MNRAS 291, L33; in this form Wang &
 * Mukherjee 2007, PRD 76, 103533, eq. 2), evaluated at the decoupling
 * redshift z*: the distance to last scattering in units set by the
 * physical matter density. D_M is the transverse comoving distance, so
 * curved models are included (Hogg 1999, eq. 16).
 * Cost: one distance integral.
 * @param cosmology the FLRW cosmology (maxRedshift >= redshift; radiation on for z ~ 1000).
 * @param redshift z, usually z* from decouplingRedshift (>= 0).
 * @returns R, dimensionless.
 * @throws CandelaError cosmology.redshift_out_of_range.
 * @example cmbShiftParameter(planck2018BestFit, 1089.92) // => 1.7496... (flat, Omega_m 0.3153, H0 67.36, radiation on)
 */
export function cmbShiftParameter(cosmology: Cosmology, redshift: number): number {
  return Math.sqrt(cosmology.omegaMatter) * cosmology.transverseComovingDistanceMpc(redshift) / cosmology.hubbleDistanceMpc;
}
