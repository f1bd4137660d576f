import { csvField } from './csvField.js';
import type { DensityGrid2D, MarginalDensity1D } from './densityTypes.js';

/**
 * A 1-D marginal as CSV text: header `<parameter>,density`, then one row per
 * grid point (parameter unit, density per parameter unit). Numbers are the
 * shortest decimals that read back as the same doubles.
 *
 * Cost: O(grid points).
 * @param marginal from marginalDensity1D.
 * @returns CSV text ending in a newline.
 * @example marginalDensityCsv(m).split('\n')[0] // 'omega_m,density'
 */
export function marginalDensityCsv(marginal: MarginalDensity1D): string {
  const lines = [`${csvField(marginal.parameter)},density`];
  for (let i = 0; i < marginal.x.length; i++) lines.push(`${marginal.x[i]},${marginal.density[i]}`);
  return lines.join('\n') + '\n';
}

/**
 * A 2-D density grid as CSV text: header `<x parameter>,<y parameter>,density`,
 * one row per node, x running fastest (the row-major order of the grid).
 *
 * Cost: O(nx ny).
 * @param grid from densityGrid2D.
 * @returns CSV text ending in a newline.
 * @example densityGridCsv(g).split('\n')[0] // 'omega_m,w0,density'
 */
export function densityGridCsv(grid: DensityGrid2D): string {
  const nx = grid.x.length;
  const lines = [`${csvField(grid.xParameter)},${csvField(grid.yParameter)},density`];
  for (let iy = 0; iy < grid.y.length; iy++) {
    for (let ix = 0; ix < nx; ix++) lines.push(`${grid.x[ix]},${grid.y[iy]},${grid.density[iy * nx + ix]}`);
  }
  return lines.join('\n') + '\n';
}
