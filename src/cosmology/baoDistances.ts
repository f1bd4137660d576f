import { CandelaError } from '../errors.js';
import type { Cosmology } from './cosmology.js';

/** The distances a baryon acoustic oscillation measurement compares with, one value per redshift, Mpc. */
export interface BaoDistances {
  /** D_M(z), transverse comoving distance, Mpc. */
  transverseComovingMpc: Float64Array;
  /** D_H(z) = c / H(z), the Hubble distance at z, Mpc. */
  hubbleMpc: Float64Array;
  /** D_V(z) = [z D_M^2 D_H]^(1/3), the volume-averaged distance, Mpc. */
  volumeAveragedMpc: Float64Array;
  /** D_A(z) = D_M / (1 + z), angular-diameter distance, Mpc. */
  angularDiameterMpc: Float64Array;
}

/**
 * The four BAO distances at many redshifts from one cosmology: D_M along the
 * line of sight's transverse direction, D_H = c / H(z) along it, their
 * isotropic combination D_V = [z D_M^2 D_H]^(1/3) (Eisenstein et al. 2005,
 * ApJ 633, 560, eq. 2) and D_A = D_M / (1 + z) (Hogg 1999, eq. 18), the
 * quantity of older compilations. Curved models are handled by the core's
 * D_M (Hogg 1999, eq. 16); radiation enters through the cosmology's E(z)
 * (create it with cmbTemperatureK > 0).
 * Cost: one sorted sweep of the distance integral plus one E(z) per redshift.
 * @param cosmology the FLRW cosmology (maxRedshift >= the largest redshift).
 * @param redshifts redshifts z >= 0, any order.
 * @returns four arrays of the input's length, Mpc, in the input's order.
 * @throws CandelaError cosmology.redshift_out_of_range for a redshift < 0, non-finite or above maxRedshift.
 * @example baoDistances(flatLambdaCdm(0.3, 70), Float64Array.of(1)).hubbleMpc[0]
 *   // => 2432.438... (c/H0 / sqrt(0.3 * 8 + 0.7), Mpc)
 */
export function baoDistances(cosmology: Cosmology, redshifts: Float64Array): BaoDistances {
  const count = redshifts.length;
  const transverseComovingMpc = cosmology.transverseComovingDistancesMpc(redshifts, new Float64Array(count));
  const hubbleMpc = new Float64Array(count);
  const volumeAveragedMpc = new Float64Array(count);
  const angularDiameterMpc = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const z = redshifts[i];
    const transverse = transverseComovingMpc[i];
    const hubble = cosmology.hubbleDistanceMpc / cosmology.expansionRate(z);
    hubbleMpc[i] = hubble;
    volumeAveragedMpc[i] = Math.cbrt(z * transverse * transverse * hubble);
    angularDiameterMpc[i] = transverse / (1 + z);
  }
  return { transverseComovingMpc, hubbleMpc, volumeAveragedMpc, angularDiameterMpc };
}

/**
 * Checks a sound horizon given in Mpc (shared by the BAO functions).
 * @throws CandelaError cosmology.sound_horizon_invalid unless finite and > 0.
 */
export function checkSoundHorizonMpc(soundHorizonMpc: number): void {
  if (Number.isFinite(soundHorizonMpc) && soundHorizonMpc > 0) return;
  throw new CandelaError({
    code: 'cosmology.sound_horizon_invalid', message: `sound horizon ${soundHorizonMpc} Mpc is not usable`,
    path: 'soundHorizonDragMpc', expected: 'a finite length > 0 Mpc (about 147 Mpc for standard physics)',
    found: String(soundHorizonMpc), fix: 'pass r_d in Mpc, free or from dragSoundHorizonFitMpc',
  });
}
