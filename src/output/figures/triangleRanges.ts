import { CandelaError } from '../../errors.js';
import type { ContourSet2D, MarginalDensity1D } from '../density/densityTypes.js';

/** The densities of one run, as the triangle figure takes them. */
export interface TriangleRunDensities {
  marginals: readonly MarginalDensity1D[];
  contours: readonly ContourSet2D[];
}

/** Grid points below this fraction of the marginal's peak do not widen the axis (the KDE tails would waste the panel). */
const RANGE_DENSITY_FRACTION = 0.002;
/** Space added on each side of the data range, as a fraction of its width. */
const RANGE_PADDING_FRACTION = 0.04;

/**
 * Axis range of every parameter, shared by all panels and all runs of a
 * triangle figure: the union over runs of the part of each 1-D marginal above
 * 0.2% of its peak and of every credible-region outline, padded by 4% on each
 * side. A caller-given range wins.
 *
 * Cost: O(total grid points + outline points).
 *
 * @param runs densities of each run
 * @param parameters parameter names, in figure order
 * @param overrides fixed ranges [low, high] (parameter units) by name
 * @returns range [low, high] per parameter, in the order of `parameters`
 * @throws CandelaError `figure.no_density` when a parameter has no range and no density in any run
 * @example parameterRanges([{ marginals: [m], contours: [] }], ['omega_m'], {})
 */
export function parameterRanges(runs: readonly TriangleRunDensities[], parameters: readonly string[], overrides: Readonly<Record<string, readonly [number, number]>> = {}): [number, number][] {
  return parameters.map((parameter) => {
    const fixed = overrides[parameter];
    if (fixed && Number.isFinite(fixed[0]) && Number.isFinite(fixed[1]) && fixed[0] < fixed[1]) return [fixed[0], fixed[1]];
    let low = Infinity;
    let high = -Infinity;
    const widen = (value: number) => {
      if (!Number.isFinite(value)) return;
      low = Math.min(low, value);
      high = Math.max(high, value);
    };
    for (const run of runs) {
      for (const marginal of run.marginals) {
        if (marginal.parameter !== parameter) continue;
        let peak = 0;
        for (const value of marginal.density) if (value > peak) peak = value;
        for (let index = 0; index < marginal.x.length; index++) {
          if (marginal.density[index] >= RANGE_DENSITY_FRACTION * peak && peak > 0) widen(marginal.x[index]);
        }
      }
      for (const contour of run.contours) {
        const axis = contour.grid.xParameter === parameter ? 0 : contour.grid.yParameter === parameter ? 1 : -1;
        if (axis < 0) continue;
        for (const region of contour.regions) {
          for (const polygon of region.geometry.coordinates) for (const ring of polygon) for (const point of ring) widen(point[axis]);
        }
      }
    }
    if (!(high > low)) {
      throw new CandelaError({
        code: 'figure.no_density',
        message: `no run has a usable marginal density or credible region for ${parameter}`,
        path: parameter,
        fix: 'compute densities for this parameter, give its axis range, or leave it out of the figure',
      });
    }
    const padding = RANGE_PADDING_FRACTION * (high - low);
    return [low - padding, high + padding];
  });
}
