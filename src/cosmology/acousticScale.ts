import { comovingSoundHorizonMpc } from './comovingSoundHorizonMpc.js';
import type { Cosmology } from './cosmology.js';

/**
 * Acoustic scale l_A(z) = pi D_M(z) / r_s(z), the multipole of the acoustic
 * peak spacing (Hu & Sugiyama 1995, ApJ 444, 489, and 1996 for the notation;
 * Page et al. 2003, ApJS 148, 233, eq. 9), evaluated at the decoupling
 * redshift z*. D_M is the transverse comoving distance (curved models
 * included), r_s the comoving sound horizon of comovingSoundHorizonMpc.
 * Cost: one distance integral and one sound-horizon integral.
 * @param cosmology FLRW cosmology with radiation on and maxRedshift = Infinity.
 * @param omegaBaryonH2 omega_b = Omega_b h^2 (> 0).
 * @param redshift z, usually z* from decouplingRedshift (>= 0).
 * @returns l_A, dimensionless (a multipole).
 * @throws CandelaError as comovingSoundHorizonMpc.
 * @example acousticScale(planck2018BestFit, 0.02237, 1089.92) // => 301.98... (flat, Omega_m 0.3153, H0 67.36, radiation on)
 */
export function acousticScale(cosmology: Cosmology, omegaBaryonH2: number, redshift: number): number {
  const soundHorizonMpc = comovingSoundHorizonMpc(cosmology, omegaBaryonH2, redshift);
  return Math.PI * cosmology.transverseComovingDistanceMpc(redshift) / soundHorizonMpc;
}
