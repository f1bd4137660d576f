import { CandelaError } from '../errors.js';
import { checkPhysicalDensities } from './checkPhysicalDensities.js';

/**
 * Comoving sound horizon at the drag epoch r_d by the fitting formula of
 * Aubourg et al. (2015, PRD 92, 123516, eq. 16), calibrated on CAMB:
 *   r_d = 55.154 exp[-72.3 (omega_nu + 0.0006)^2] / (omega_cb^0.25351 omega_b^0.12807) Mpc,
 * with omega_cb = (Omega_c + Omega_b) h^2, omega_b = Omega_b h^2 and
 * omega_nu = Omega_nu h^2 of massive neutrinos (0 for massless ones;
 * 0.00064 for one 0.06 eV species). The coefficients are quoted from memory
 * (no copy of the paper here), as is its stated accuracy, about 0.02% near
 * the Planck cosmology, for the standard N_eff = 3.046 only: for another
 * N_eff use comovingSoundHorizonMpc at the drag redshift instead.
 * The test checks it against the Planck 2018 r_drag to 1e-3 (also from memory).
 * Cost: O(1).
 * @param omegaColdPlusBaryonH2 omega_cb = (Omega_c + Omega_b) h^2 (>= omegaBaryonH2).
 * @param omegaBaryonH2 omega_b = Omega_b h^2 (> 0).
 * @param omegaNeutrinoH2 omega_nu = Omega_nu h^2 of massive neutrinos (>= 0, default 0).
 * @returns r_d in Mpc.
 * @throws CandelaError cosmology.physical_density_invalid for unusable densities.
 * @example dragSoundHorizonFitMpc(0.14237, 0.02237, 0.000644) // => 147.06... Mpc
 */
export function dragSoundHorizonFitMpc(omegaColdPlusBaryonH2: number, omegaBaryonH2: number, omegaNeutrinoH2 = 0): number {
  checkPhysicalDensities(omegaBaryonH2, omegaColdPlusBaryonH2, 'omegaColdPlusBaryonH2');
  if (!(Number.isFinite(omegaNeutrinoH2) && omegaNeutrinoH2 >= 0)) {
    throw new CandelaError({
      code: 'cosmology.physical_density_invalid', message: `omegaNeutrinoH2 = ${omegaNeutrinoH2} is not a usable physical density`,
      path: 'omegaNeutrinoH2', expected: 'a finite omega_nu h^2 >= 0 (0 for massless neutrinos)', found: String(omegaNeutrinoH2),
      fix: 'give omega_nu h^2 = sum of neutrino masses / 93.14 eV, or 0',
    });
  }
  const neutrinoShift = omegaNeutrinoH2 + 0.0006;
  return 55.154 * Math.exp(-72.3 * neutrinoShift * neutrinoShift) /
    (Math.pow(omegaColdPlusBaryonH2, 0.25351) * Math.pow(omegaBaryonH2, 0.12807));
}
