import {
  CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES, baoDistanceRatios, cosmologyParametersFromValues, createCosmology,
  dragSoundHorizonFitMpc,
} from '../../cosmology/index.js';
import { createMeasurementTerm, type LikelihoodTerm } from '../../likelihood/index.js';
import type { ProbeModel } from '../probeDefinition.js';
import type { BaoTable } from './readBaoTable.js';

/** How the sound horizon at the drag epoch is obtained. */
export type BaoRuler = 'free' | 'computed';

/**
 * The BAO likelihood term: a Gaussian in the measured ratios D_X(z)/r_d with
 * the table's covariance (createMeasurementTerm). Radiation (photons at
 * T_CMB = 2.7255 K, Fixsen 2009; 3.046 massless neutrino species) is always
 * in E(z), with H0 from h0 when sampled, else the model's reference H0.
 * r_d: with ruler `free` the term samples h_ruler = h r_d and uses
 * r_d = h_ruler / h, so the BAO constrain Omega_m and h r_d but not H0; with
 * `computed`, r_d follows from omega_b h^2 and omega_cb h^2 = Omega_m h^2 by
 * the fitting formula of Aubourg et al. (2015, eq. 16), massless neutrinos.
 * Cost per call: one distance sweep over the rows plus an n^2/2 solve.
 * @param table the measurements.
 * @param ruler 'free' (reads h_ruler) or 'computed' (reads h0 and omega_b_h2).
 * @param model the model's law, curvature and reference H0.
 * @param name the term's name.
 */
export function createBaoTerm(table: BaoTable, ruler: BaoRuler, model: ProbeModel, name: string): LikelihoodTerm {
  const maxRedshift = Math.max(...table.redshifts);
  const family = { darkEnergy: model.darkEnergy, flat: model.flat, cmbTemperatureK: CMB_TEMPERATURE_K, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES };
  return createMeasurementTerm({
    name,
    requires: ruler === 'free' ? ['omega_m', 'h_ruler'] : ['omega_m', 'h0', 'omega_b_h2'],
    observed: table.values,
    covariance: table.covariance,
    predict(p, out) {
      const parameters = cosmologyParametersFromValues(family, p, model.referenceH0KmPerSPerMpc);
      const outcome = createCosmology(parameters, { maxRedshift });
      if (!outcome.ok) return outcome.reason;
      const h = parameters.h0KmPerSPerMpc / 100;
      let soundHorizonMpc: number;
      if (ruler === 'free') {
        soundHorizonMpc = p.h_ruler / h;
      } else {
        const omegaMatterH2 = p.omega_m * h * h;
        if (!(p.omega_b_h2 > 0 && p.omega_b_h2 < omegaMatterH2)) return `omega_b_h2 = ${p.omega_b_h2} must lie in (0, Omega_m h^2 = ${omegaMatterH2})`;
        soundHorizonMpc = dragSoundHorizonFitMpc(omegaMatterH2, p.omega_b_h2, 0);
      }
      if (!(soundHorizonMpc > 0 && Number.isFinite(soundHorizonMpc))) return `the sound horizon r_d = ${soundHorizonMpc} Mpc is not positive`;
      try {
        baoDistanceRatios(outcome.cosmology, table.redshifts, table.kinds, soundHorizonMpc, out);
      } catch (error) {
        return error instanceof Error ? error.message : String(error);
      }
      return null;
    },
  });
}
