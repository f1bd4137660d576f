import { CandelaError } from '../../errors.js';

/** A model distance-modulus curve sampled on a redshift grid, with its 68% band (mag). */
export interface ModelMuCurve {
  /** Redshifts, increasing and positive. */
  z: Float64Array;
  /** Posterior median distance modulus at each redshift (mag). */
  median: Float64Array;
  /** Lower and upper ends of the 68% band (mag). */
  low68: Float64Array;
  high68: Float64Array;
}

/** Relative slack on the ends of the model's redshift grid (rounding of redshifts read from text). */
const GRID_END_RELATIVE_SLACK = 1e-9;

/**
 * The model curve's median at each redshift, interpolated linearly in ln z,
 * the variable in which distance moduli are smooth (at low redshift
 * mu = 5 log10(cz/H0) + 25 is exactly linear in ln z: Hubble law, common practice).
 *
 * Cost: O(n + m) for n redshifts (any order) and m grid points (binary search per point: O(n log m)).
 *
 * @param redshift redshifts to evaluate (> 0)
 * @param curve model curve; its z grid must be increasing, positive and cover every redshift
 * @returns median model distance modulus at each redshift (mag)
 * @throws CandelaError `figure.redshift_outside_model` when a redshift lies outside the curve's grid or is not positive
 * @example interpolateModelMu(Float64Array.of(0.05), curve)[0] // e.g. 36.7
 */
export function interpolateModelMu(redshift: ArrayLike<number>, curve: ModelMuCurve): Float64Array {
  const grid = curve.z;
  const last = grid.length - 1;
  const result = new Float64Array(redshift.length);
  for (let index = 0; index < redshift.length; index++) {
    const z = redshift[index];
    if (!(z > 0) || last < 0 || z < grid[0] * (1 - GRID_END_RELATIVE_SLACK) || z > grid[last] * (1 + GRID_END_RELATIVE_SLACK)) {
      throw new CandelaError({
        code: 'figure.redshift_outside_model',
        message: 'a supernova redshift lies outside the redshift grid of the model curve',
        row: index + 1,
        expected: last < 0 ? 'a non-empty model curve' : `a redshift in [${grid[0]}, ${grid[last]}]`,
        found: String(z),
        fix: 'compute the model curve over the whole redshift range of the sample',
      });
    }
    if (last === 0) {
      result[index] = curve.median[0];
      continue;
    }
    let low = 0;
    let high = last;
    while (high - low > 1) {
      const middle = (low + high) >> 1;
      if (grid[middle] <= z) low = middle;
      else high = middle;
    }
    const weight = (Math.log(z) - Math.log(grid[low])) / (Math.log(grid[high]) - Math.log(grid[low]));
    const clamped = Math.min(1, Math.max(0, weight));
    result[index] = curve.median[low] + clamped * (curve.median[high] - curve.median[low]);
  }
  return result;
}
