import { CandelaError } from '../errors.js';
import { checkEarlyUniverseCosmology, comovingSoundHorizonMpc } from './comovingSoundHorizonMpc.js';
import type { Cosmology } from './cosmology.js';
import { decouplingRedshift } from './decouplingRedshift.js';

/** The CMB distance summary of one cosmology: what a compressed CMB prior constrains, and its ingredients. */
export interface CompressedCmbDistances {
  /** z*, photon decoupling (Hu & Sugiyama 1996, eq. E1), dimensionless. */
  decouplingRedshift: number;
  /** D_M(z*), transverse comoving distance to last scattering, Mpc. */
  transverseComovingDistanceMpc: number;
  /** r_s(z*), comoving sound horizon at decoupling, Mpc. */
  soundHorizonMpc: number;
  /** R = sqrt(Omega_m H0^2) D_M(z*) / c, dimensionless. */
  shiftParameter: number;
  /** l_A = pi D_M(z*) / r_s(z*), dimensionless. */
  acousticScale: number;
}

/**
 * The compressed CMB distances of a cosmology: z* from the fit of Hu &
 * Sugiyama (1996, eq. E1) with omega_b h^2 and omega_m = Omega_m h^2, then
 * the shift parameter R (Bond, Efstathiou & Tegmark 1997) and the acoustic
 * scale l_A (Hu & Sugiyama 1996; Page et al. 2003, eq. 9) at z*, as in the
 * distance priors of Wang & Mukherjee (2007) and Chen, Huang & Wang (2019,
 * JCAP 02, 028), whose Gaussian prior on (R, l_A, omega_b h^2) these feed.
 * Same as cmbShiftParameter and acousticScale at decouplingRedshift, with one
 * distance integral shared.
 * Cost: one distance integral and one sound-horizon integral (~0.1 ms).
 * @param cosmology FLRW cosmology with radiation on (cmbTemperatureK > 0) and maxRedshift = Infinity.
 * @param omegaBaryonH2 omega_b = Omega_b h^2 (> 0, <= Omega_m h^2).
 * @returns z*, D_M(z*) and r_s(z*) in Mpc, R and l_A.
 * @throws CandelaError cosmology.radiation_required, cosmology.redshift_range_too_small,
 *   cosmology.physical_density_invalid, cosmology.last_scattering_unreachable (a closed universe whose
 *   D_M(z*) is not positive).
 * @example compressedCmbDistances(planck2018BestFit, 0.02237) // => { decouplingRedshift: 1091.91, soundHorizonMpc: 144.09, shiftParameter: 1.7496, acousticScale: 302.35, ... }
 */
export function compressedCmbDistances(cosmology: Cosmology, omegaBaryonH2: number): CompressedCmbDistances {
  checkEarlyUniverseCosmology(cosmology);
  const h = cosmology.parameters.h0KmPerSPerMpc / 100;
  const zStar = decouplingRedshift(omegaBaryonH2, cosmology.omegaMatter * h * h);
  const transverseComovingDistanceMpc = cosmology.transverseComovingDistanceMpc(zStar);
  if (!(transverseComovingDistanceMpc > 0)) {
    throw new CandelaError({
      code: 'cosmology.last_scattering_unreachable', message: `D_M(z* = ${zStar}) = ${transverseComovingDistanceMpc} Mpc: the last-scattering surface lies at or beyond the antipode of this closed universe`,
      path: 'omegaCurvature', expected: 'D_M(z*) > 0', found: String(cosmology.omegaCurvature), fix: 'restrict the prior on the curvature to less closed models',
    });
  }
  const soundHorizonMpc = comovingSoundHorizonMpc(cosmology, omegaBaryonH2, zStar);
  return {
    decouplingRedshift: zStar,
    transverseComovingDistanceMpc,
    soundHorizonMpc,
    shiftParameter: Math.sqrt(cosmology.omegaMatter) * transverseComovingDistanceMpc / cosmology.hubbleDistanceMpc,
    acousticScale: Math.PI * transverseComovingDistanceMpc / soundHorizonMpc,
  };
}
