import type { Cosmology } from './cosmology.js';

/** Quantities derived from a cosmology that a sampler may record per sample. */
export interface DerivedCosmologyQuantities {
  omegaCurvature: number;
  omegaDarkEnergy: number;
  /** Age today, Gyr (Infinity without a Big Bang). */
  ageTodayGyr: number;
  q0: number;
  /** Start of acceleration, or null. */
  accelerationRedshift: number | null;
}

/**
 * Collects the derived quantities of a cosmology in one object.
 * Cost: one age integral (~200 E evaluations) and the acceleration scan (~700 q evaluations).
 * @param cosmology a cosmology from createCosmology.
 * @throws nothing.
 * @example derivedCosmologyQuantities((createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }) as { cosmology: Cosmology }).cosmology)
 *   // => { omegaCurvature: 0, omegaDarkEnergy: 0.7, ageTodayGyr: 13.467, q0: -0.55, accelerationRedshift: 0.6710 }
 */
export function derivedCosmologyQuantities(cosmology: Cosmology): DerivedCosmologyQuantities {
  return {
    omegaCurvature: cosmology.omegaCurvature,
    omegaDarkEnergy: cosmology.omegaDarkEnergy,
    ageTodayGyr: cosmology.ageTodayGyr,
    q0: cosmology.q0,
    accelerationRedshift: cosmology.accelerationRedshift(),
  };
}
