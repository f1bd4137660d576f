import { CandelaError } from '../errors.js';
import { baoDistances, checkSoundHorizonMpc } from './baoDistances.js';
import type { Cosmology } from './cosmology.js';

/**
 * Which distance a BAO measurement row constrains, always divided by the
 * sound horizon at the drag epoch r_d:
 * 'transverse_comoving' D_M / r_d, 'hubble' D_H / r_d with D_H = c / H(z),
 * 'volume_averaged' D_V / r_d, 'angular_diameter' D_A / r_d.
 */
export type BaoDistanceKind = 'transverse_comoving' | 'hubble' | 'volume_averaged' | 'angular_diameter';

/** Every BaoDistanceKind, in a fixed order (for validation and messages). */
export const BAO_DISTANCE_KINDS: readonly BaoDistanceKind[] = ['transverse_comoving', 'hubble', 'volume_averaged', 'angular_diameter'];

/**
 * The model value of each row of a BAO table: row i measures the distance
 * kinds[i] at redshifts[i], divided by r_d (Eisenstein et al. 2005, ApJ 633,
 * 560, for D_V; the D_M / r_d and D_H / r_d pair as in Alam et al. 2017,
 * MNRAS 470, 2617). All rows share one cosmology and one distance sweep.
 * With r_d free, BAO alone constrain c / (H0 r_d): pass r_d = (h r_d) / h.
 * Cost: one sorted sweep of the distance integral plus one E(z) per row.
 * @param cosmology the FLRW cosmology (maxRedshift >= the largest redshift).
 * @param redshifts effective redshift of each row (z >= 0, any order, repeats allowed).
 * @param kinds the distance each row measures; same length as redshifts.
 * @param soundHorizonDragMpc r_d, comoving sound horizon at the drag epoch, Mpc (> 0).
 * @param out optional output of at least redshifts.length values (dimensionless ratios).
 * @returns out, holding D_kind(z_i) / r_d (dimensionless).
 * @throws CandelaError cosmology.sound_horizon_invalid, cosmology.bao_kind_unknown, cosmology.redshift_out_of_range;
 *   RangeError when the lengths disagree.
 * @example baoDistanceRatios(flatLambdaCdm(0.3, 70), Float64Array.of(1, 1), ['hubble', 'transverse_comoving'], 147)
 *   // => [16.5472..., 22.4750...] (D_H = 2432.44 Mpc, D_M = 3303.83 Mpc)
 */
export function baoDistanceRatios(cosmology: Cosmology, redshifts: Float64Array, kinds: readonly BaoDistanceKind[],
  soundHorizonDragMpc: number, out: Float64Array = new Float64Array(redshifts.length)): Float64Array {
  const count = redshifts.length;
  if (kinds.length !== count) throw new RangeError(`${kinds.length} distance kinds for ${count} redshifts`);
  if (out.length < count) throw new RangeError(`output holds ${out.length} values, ${count} needed`);
  checkSoundHorizonMpc(soundHorizonDragMpc);
  const distances = baoDistances(cosmology, redshifts);
  for (let i = 0; i < count; i++) {
    out[i] = distanceOfKind(distances, kinds[i], i) / soundHorizonDragMpc;
  }
  return out;
}

function distanceOfKind(distances: ReturnType<typeof baoDistances>, kind: BaoDistanceKind, row: number): number {
  switch (kind) {
    case 'transverse_comoving': return distances.transverseComovingMpc[row];
    case 'hubble': return distances.hubbleMpc[row];
    case 'volume_averaged': return distances.volumeAveragedMpc[row];
    case 'angular_diameter': return distances.angularDiameterMpc[row];
    default: throw new CandelaError({
      code: 'cosmology.bao_kind_unknown', message: `row ${row + 1} asks for an unknown BAO distance '${String(kind)}'`,
      path: 'kinds', expected: `one of ${BAO_DISTANCE_KINDS.join(', ')}`, found: String(kind),
      fix: 'name the measured distance with one of the listed kinds',
    });
  }
}
