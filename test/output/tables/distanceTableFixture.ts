import { computeDistanceTable } from '../../../src/pipeline/index.js';
import type { DistanceTable } from '../../../src/pipeline/index.js';

/**
 * A closed LambdaCDM table with radiation (Omega_m 0.3, Omega_DE 0.9, H0 70, T_CMB 2.7255 K) at z = 0.5 and 2,
 * computed by the distances conductor, whose numbers test/pipeline/distances checks against astropy.
 */
export function closedLambdaTable(): DistanceTable {
  return computeDistanceTable({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 0.9, h0KmPerSPerMpc: 70, radiation: true, redshifts: [0.5, 2] });
}
