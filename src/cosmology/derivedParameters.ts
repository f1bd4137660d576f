import { DEFAULT_EFFECTIVE_NEUTRINO_SPECIES } from './resolveCosmologyParameters.js';
import { CMB_TEMPERATURE_K } from './cosmologyConstants.js';
import { cosmologyParametersFromValues } from './cosmologyFromValues.js';
import { createCosmology } from './createCosmology.js';
import type { DarkEnergyLaw } from './darkEnergyEvolution.js';
import { SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';

/** Names of the derived quantities candela can store per sample, with what they mean. */
export const DERIVED_PARAMETER_MEANINGS: Record<string, string> = {
  omega_k: 'curvature density today, 1 - Omega_m - Omega_DE (- Omega_r)',
  omega_de: 'dark-energy density today (derived in flat models)',
  q0: 'deceleration parameter today',
  z_accel: 'redshift where the expansion starts to accelerate (q = 0); empty cell when there is none',
  age_gyr: 'age of the Universe today, Gyr, at the sampled h0 or at reference_h0',
  offset: 'the constrained combination abs_mag + 5 log10(c/H0 / Mpc) + 25, mag (when abs_mag is sampled)',
};

/** The cosmological model a derived-parameter function is built for. */
export interface DerivedModel {
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  radiation: boolean;
  /** H0 used for ages when h0 is not a parameter, km/s/Mpc. */
  referenceH0KmPerSPerMpc: number;
}


/**
 * Builds a function that fills the requested derived quantities for one
 * parameter set. Quantities that do not exist for the set (no acceleration)
 * are written as NaN here and become empty cells in files; an unphysical set
 * gives NaN for all (the pipeline stores derived values only for finite
 * log-posterior points).
 */
export function createDerivedParameters(model: DerivedModel, names: readonly string[]) {
  const family = { darkEnergy: model.darkEnergy, flat: model.flat, cmbTemperatureK: model.radiation ? CMB_TEMPERATURE_K : 0, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES };
  return function fillDerived(values: Readonly<Record<string, number>>, out: Float64Array, offset: number): void {
    const h0 = values.h0 ?? model.referenceH0KmPerSPerMpc;
    const outcome = createCosmology(cosmologyParametersFromValues(family, values, model.referenceH0KmPerSPerMpc));
    for (let k = 0; k < names.length; k++) {
      if (!outcome.ok) {
        out[offset + k] = Number.NaN;
        continue;
      }
      const cosmology = outcome.cosmology;
      switch (names[k]) {
        case 'omega_k': out[offset + k] = cosmology.omegaCurvature; break;
        case 'omega_de': out[offset + k] = cosmology.omegaDarkEnergy; break;
        case 'q0': out[offset + k] = cosmology.q0; break;
        case 'z_accel': out[offset + k] = cosmology.accelerationRedshift() ?? Number.NaN; break;
        case 'age_gyr': out[offset + k] = cosmology.ageTodayGyr; break;
        case 'offset': out[offset + k] = (values.abs_mag ?? Number.NaN) + 5 * Math.log10(SPEED_OF_LIGHT_KM_PER_S / h0) + 25; break;
        default: out[offset + k] = Number.NaN;
      }
    }
  };
}
