import { contours } from 'd3-contour';
import { ONE_SIGMA_MASS, TWO_SIGMA_MASS } from '../summaries/credibleMass.js';
import { credibleThresholds } from './credibleThresholds.js';
import type { ContourSet2D, CredibleRegion, DensityGrid2D } from './densityTypes.js';

/**
 * Credible regions of a 2-D density grid: for each mass, the density level
 * from credibleThresholds, then its superlevel set traced by marching squares
 * with linear interpolation (d3-contour `contours().size([nx, ny])`). The
 * library works in grid-index coordinates where the value of node (ix, iy)
 * sits at (ix + 0.5, iy + 0.5); they are mapped to parameter coordinates,
 * x = x[0] + (u - 0.5) dx, clamped to the grid so that a region touching a
 * hard prior edge ends exactly on it. Rings are oriented as RFC 7946 asks
 * (exterior counterclockwise, holes clockwise) with x to the right and y up.
 *
 * Cost: O(N log N) for the levels plus O(N) per region, N = nx ny.
 * @param grid a density grid (densityGrid2D).
 * @param masses probabilities in (0, 1); default [0.6827, 0.9545].
 * @returns the grid with one region per mass, smallest mass first.
 * @throws CandelaError for masses outside (0, 1) or an all-zero grid.
 * @example credibleContours(densityGrid2D('omega_m', om, 'w0', w0)).regions.map((r) => r.mass) // [0.6827, 0.9545]
 */
export function credibleContours(grid: DensityGrid2D, masses: readonly number[] = [ONE_SIGMA_MASS, TWO_SIGMA_MASS]): ContourSet2D {
  const nx = grid.x.length;
  const ny = grid.y.length;
  const ordered = [...masses].sort((a, b) => a - b);
  const thresholds = credibleThresholds(grid.density, ordered);
  const values = Array.from(grid.density);
  const tracer = contours().size([nx, ny]);
  const dx = (grid.x[nx - 1] - grid.x[0]) / (nx - 1);
  const dy = (grid.y[ny - 1] - grid.y[0]) / (ny - 1);
  const toX = (u: number): number => grid.x[0] + Math.min(nx - 1, Math.max(0, u - 0.5)) * dx;
  const toY = (v: number): number => grid.y[0] + Math.min(ny - 1, Math.max(0, v - 0.5)) * dy;
  const regions: CredibleRegion[] = ordered.map((mass, level) => {
    const traced = tracer.contour(values, thresholds[level]);
    const coordinates = traced.coordinates.map((polygon) =>
      polygon.map((ring, index) => orient(ring.map(([u, v]) => [toX(u), toY(v)]), index === 0)));
    return { mass, threshold: thresholds[level], geometry: { type: 'MultiPolygon', coordinates } };
  });
  return { grid, regions };
}

/** Twice the signed area of a closed ring (shoelace; positive when counterclockwise). */
function twiceSignedArea(ring: number[][]): number {
  let sum = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) sum += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return sum;
}

/** Exterior rings counterclockwise, holes clockwise (RFC 7946, section 3.1.6). */
function orient(ring: number[][], exterior: boolean): number[][] {
  const counterclockwise = twiceSignedArea(ring) > 0;
  return counterclockwise === exterior ? ring : ring.reverse();
}
