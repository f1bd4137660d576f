import type { RadiationDensity } from './radiationDensity.js';
import { radiationDensity } from './radiationDensity.js';

/** H0 of the reduced Hubble constant h = 1, km/s/Mpc: Omega h^2 is Omega at this H0. */
const HUBBLE_UNIT_KM_PER_S_PER_MPC = 100;

/**
 * Physical radiation densities omega = Omega h^2 (h = H0 / 100 km/s/Mpc),
 * which do not depend on H0: photons omega_gamma from the CMB temperature,
 * omega_gamma = 4 sigma_SB T^4 / (c^3 rho_crit,100) with
 * rho_crit,100 = 3 (100 km/s/Mpc)^2 / (8 pi G), and N_eff massless neutrino
 * species omega_nu = (7/8)(4/11)^(4/3) N_eff omega_gamma. Computed by
 * radiationDensity at H0 = 100 km/s/Mpc, so it is the same convention as the
 * distance engine's radiation option, to the last bit.
 * Cost: O(1).
 * @param cmbTemperatureK CMB temperature today, K (>= 0; 0 means no radiation).
 * @param effectiveNeutrinoSpecies N_eff (>= 0; 3.046 is the standard value).
 * @returns photons omega_gamma h^2, neutrinos omega_nu h^2 and their total omega_r h^2 (dimensionless).
 * @throws nothing (the caller validates the numbers).
 * @example physicalRadiationDensity(2.7255, 3.046).photons // => 2.4729753...e-5
 */
export function physicalRadiationDensity(cmbTemperatureK: number, effectiveNeutrinoSpecies: number): RadiationDensity {
  return radiationDensity(cmbTemperatureK, HUBBLE_UNIT_KM_PER_S_PER_MPC, effectiveNeutrinoSpecies);
}
