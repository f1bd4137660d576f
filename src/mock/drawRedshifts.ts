import { CandelaError } from '../errors.js';
import type { RandomStream } from '../math/index.js';
import type { Cosmology } from '../cosmology/index.js';
import type { MockSampleDesign } from './mockSurveyOptions.js';

/** Grid size of the tabulated redshift distribution used for inverse-CDF draws. */
export const REDSHIFT_GRID_POINTS = 2001;

/**
 * Redshifts of one sample drawn by inverse-CDF sampling of a tabulated
 * distribution (trapezoid cumulative on a uniform grid, linear inversion):
 * `uniform` is flat in z; `volume` is a constant comoving rate,
 * dN/dz ∝ D_C(z)^2 / (E(z) (1 + z)) (the comoving volume element
 * dV/dz = 4 pi D_C^2 c / (H0 E(z)) of a flat universe, Hogg 1999, eq. 28 from memory,
 * with the (1 + z) time dilation of the observed rate). Draws come in random
 * order (not sorted). Cost O(grid + count log grid).
 * @param design the sample (count and redshift range and shape).
 * @param cosmology the true cosmology (for `volume`).
 * @param random the seeded stream (one uniform per supernova).
 * @throws CandelaError `mock.redshift_range` unless 0 < min < max.
 * @example drawRedshifts(design, cosmology, createRandomStream('1')).length // design.count
 */
export function drawRedshifts(design: MockSampleDesign, cosmology: Cosmology, random: RandomStream): Float64Array {
  const { min, max, shape } = design.redshift;
  if (!(min > 0 && max > min)) {
    throw new CandelaError({ code: 'mock.redshift_range', path: `samples.${design.label}.redshift`, message: 'the redshift range must satisfy 0 < min < max', found: `[${min}, ${max}]`, fix: 'give a range such as [0.01, 0.1]' });
  }
  const grid = new Float64Array(REDSHIFT_GRID_POINTS);
  const cumulative = new Float64Array(REDSHIFT_GRID_POINTS);
  for (let i = 0; i < REDSHIFT_GRID_POINTS; i++) grid[i] = min + ((max - min) * i) / (REDSHIFT_GRID_POINTS - 1);
  const comoving = cosmology.comovingDistancesMpc(grid);
  const density = (i: number): number => {
    if (shape === 'uniform') return 1;
    const z = grid[i];
    return (comoving[i] * comoving[i]) / (cosmology.expansionRate(z) * (1 + z));
  };
  let previous = density(0);
  for (let i = 1; i < REDSHIFT_GRID_POINTS; i++) {
    const current = density(i);
    cumulative[i] = cumulative[i - 1] + 0.5 * (current + previous) * (grid[i] - grid[i - 1]);
    previous = current;
  }
  const totalMass = cumulative[REDSHIFT_GRID_POINTS - 1];
  const draws = new Float64Array(design.count);
  for (let k = 0; k < design.count; k++) {
    const target = random.uniform() * totalMass;
    let low = 0;
    let high = REDSHIFT_GRID_POINTS - 1;
    while (high - low > 1) {
      const mid = (low + high) >> 1;
      if (cumulative[mid] < target) low = mid;
      else high = mid;
    }
    const span = cumulative[high] - cumulative[low];
    const fraction = span > 0 ? (target - cumulative[low]) / span : 0;
    draws[k] = grid[low] + fraction * (grid[high] - grid[low]);
  }
  return draws;
}
