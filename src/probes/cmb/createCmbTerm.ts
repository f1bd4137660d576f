import {
  CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES, compressedCmbDistances, cosmologyParametersFromValues, createCosmology,
} from '../../cosmology/index.js';
import { createMeasurementTerm, type LikelihoodTerm } from '../../likelihood/index.js';
import type { ProbeModel } from '../probeDefinition.js';
import type { CmbPrior } from './readCmbPrior.js';

/**
 * The compressed CMB term: a Gaussian prior (createMeasurementTerm) on the
 * shift parameter R = sqrt(Omega_m H0^2) D_M(z*) / c (Bond, Efstathiou &
 * Tegmark 1997), the acoustic scale l_A = pi D_M(z*) / r_s(z*) and
 * omega_b h^2, with z* from Hu & Sugiyama (1996, eq. E1) and r_s integrated
 * from the baryon-photon sound speed (src/cosmology/compressedCmbDistances.ts).
 * Radiation is on (T_CMB = 2.7255 K, Fixsen 2009; 3.046 massless neutrino
 * species). Reads omega_m (and omega_de, w0, wa as the model has them), h0
 * and omega_b_h2.
 * Cost: about 0.4 ms per call (two quadratures to z*).
 */
export function createCmbTerm(prior: CmbPrior, model: ProbeModel, name: string): LikelihoodTerm {
  const family = { darkEnergy: model.darkEnergy, flat: model.flat, cmbTemperatureK: CMB_TEMPERATURE_K, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES };
  return createMeasurementTerm({
    name,
    requires: ['omega_m', 'h0', 'omega_b_h2'],
    observed: prior.mean,
    covariance: prior.covariance,
    predict(p, out) {
      const omegaBaryonH2 = p.omega_b_h2;
      const parameters = cosmologyParametersFromValues(family, p, model.referenceH0KmPerSPerMpc);
      const h = parameters.h0KmPerSPerMpc / 100;
      if (!(omegaBaryonH2 > 0 && omegaBaryonH2 < p.omega_m * h * h)) return `omega_b_h2 = ${omegaBaryonH2} must lie in (0, Omega_m h^2 = ${p.omega_m * h * h})`;
      const outcome = createCosmology(parameters);
      if (!outcome.ok) return outcome.reason;
      try {
        const distances = compressedCmbDistances(outcome.cosmology, omegaBaryonH2);
        prior.quantities.forEach((quantity, i) => {
          out[i] = quantity === 'shift_parameter' ? distances.shiftParameter : quantity === 'acoustic_scale' ? distances.acousticScale : omegaBaryonH2;
        });
      } catch (error) {
        return error instanceof Error ? error.message : String(error);
      }
      return null;
    },
  });
}
