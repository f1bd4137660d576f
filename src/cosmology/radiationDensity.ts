import { GRAVITATIONAL_CONSTANT_SI, MEGAPARSEC_KM, SPEED_OF_LIGHT_M_PER_S, STEFAN_BOLTZMANN_W_PER_M2_K4 } from '../math/index.js';

/** Today's radiation density parameters (fractions of the critical density). */
export interface RadiationDensity {
  /** Omega_gamma, CMB photons. */
  photons: number;
  /** Omega_nu, massless neutrinos. */
  neutrinos: number;
  /** Omega_r = Omega_gamma + Omega_nu. */
  total: number;
}

/**
 * Energy density of one massless neutrino species relative to photons, (7/8)(4/11)^(4/3):
 * 7/8 for fermions, and neutrinos are colder than photons by (4/11)^(1/3) after
 * electron-positron annihilation (Kolb & Turner 1990, "The Early Universe", chapter 3).
 */
export const NEUTRINO_TO_PHOTON_PER_SPECIES = (7 / 8) * Math.pow(4 / 11, 4 / 3);

/**
 * Radiation density today from the CMB temperature: photons
 * Omega_gamma = 4 sigma_SB T^4 / (c^3 rho_crit) with rho_crit = 3 H0^2 / (8 pi G),
 * plus N_eff massless neutrino species Omega_nu = (7/8)(4/11)^(4/3) N_eff Omega_gamma.
 * A temperature of 0 K means no radiation at all (no photons, no neutrinos).
 * With the rounded CODATA 2018 sigma_SB of ../math/constants.ts, Omega_gamma is
 * 3e-11 relative below the value from the exact SI-2019 h and k_B, which moves
 * E(z) by less than 1e-14 relative at z <= 10.
 * Cost: O(1).
 * @param cmbTemperatureK CMB temperature today, K (>= 0).
 * @param h0KmPerSPerMpc Hubble constant, km/s/Mpc (> 0).
 * @param effectiveNeutrinoSpecies N_eff, massless species (>= 0; 3.046 is standard).
 * @throws nothing (the caller validates the numbers).
 * @example radiationDensity(2.7255, 70, 3.046).total // => 8.538168828e-5 (photons 5.0468884e-5)
 */
export function radiationDensity(cmbTemperatureK: number, h0KmPerSPerMpc: number, effectiveNeutrinoSpecies: number): RadiationDensity {
  if (cmbTemperatureK === 0) return { photons: 0, neutrinos: 0, total: 0 };
  const hubblePerSecond = h0KmPerSPerMpc / MEGAPARSEC_KM;
  const criticalDensityKgPerM3 = (3 * hubblePerSecond * hubblePerSecond) / (8 * Math.PI * GRAVITATIONAL_CONSTANT_SI);
  const photonDensityKgPerM3 = (4 * STEFAN_BOLTZMANN_W_PER_M2_K4 * Math.pow(cmbTemperatureK, 4)) / Math.pow(SPEED_OF_LIGHT_M_PER_S, 3);
  const photons = photonDensityKgPerM3 / criticalDensityKgPerM3;
  const neutrinos = NEUTRINO_TO_PHOTON_PER_SPECIES * effectiveNeutrinoSpecies * photons;
  return { photons, neutrinos, total: photons + neutrinos };
}
