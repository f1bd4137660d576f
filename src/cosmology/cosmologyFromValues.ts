import type { CosmologyParameters } from './cosmology.js';
import type { DarkEnergyLaw } from './darkEnergyEvolution.js';
import { darkEnergyLaw } from './darkEnergyLaws.js';

/** The FLRW family of a model: its dark-energy law, flat or curved, and its radiation. */
export interface CosmologyFamily {
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  /** Photon temperature today, K (0: no radiation). */
  cmbTemperatureK: number;
  /** Massless neutrino species (used only with radiation). */
  effectiveNeutrinoSpecies: number;
}

/**
 * The one translation from parameter values by registry name to the
 * numbers of the FLRW core: omega_m, omega_de (curved models only), the
 * parameters the law declares (w0, wa), and h0 (or `fallbackH0KmPerSPerMpc`
 * when the values have none). Parameters the law does not declare keep the
 * law's own values (w0 = -1, wa = 0), whatever the values hold.
 * Cost: O(1).
 * @param family the model's law, curvature and radiation.
 * @param values parameter values by name (h0 in km/s/Mpc).
 * @param fallbackH0KmPerSPerMpc H0 used when `values` has no h0, km/s/Mpc.
 * @returns parameters for createCosmology (its checks say why they are unphysical).
 * @example cosmologyParametersFromValues({ darkEnergy: 'cpl', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 }, { omega_m: 0.3, w0: -0.9, wa: 0.1 }, 70)
 *   // => { darkEnergy: 'cpl', flat: true, omegaMatter: 0.3, w0: -0.9, wa: 0.1, h0KmPerSPerMpc: 70, ... }
 */
export function cosmologyParametersFromValues(
  family: CosmologyFamily, values: Readonly<Record<string, number>>, fallbackH0KmPerSPerMpc: number,
): CosmologyParameters {
  const declared = darkEnergyLaw(family.darkEnergy).parameters;
  const parameters: CosmologyParameters = {
    darkEnergy: family.darkEnergy,
    flat: family.flat,
    omegaMatter: values.omega_m,
    h0KmPerSPerMpc: values.h0 ?? fallbackH0KmPerSPerMpc,
    w0: declared.includes('w0') ? values.w0 : -1,
    wa: declared.includes('wa') ? values.wa : 0,
    cmbTemperatureK: family.cmbTemperatureK,
    effectiveNeutrinoSpecies: family.effectiveNeutrinoSpecies,
  };
  if (!family.flat) parameters.omegaDarkEnergy = values.omega_de;
  return parameters;
}
