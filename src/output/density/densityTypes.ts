import type { DensityGrid2D } from '../../math/index.js';

/**
 * Types of credible regions, shared by the contour code, the writers and the
 * figures. The density grids themselves are math/density's; they are
 * re-exported here for the figures and tables that draw them.
 */
export type { DensityGrid2D, MarginalDensity1D } from '../../math/index.js';

/** The region holding a given posterior mass: all grid points whose density is at least `threshold`. */
export interface CredibleRegion {
  /** Probability mass inside, e.g. 0.6827. */
  mass: number;
  /** Density level of the boundary (unit of DensityGrid2D.density). */
  threshold: number;
  /** Polygons in parameter coordinates (x, y); exterior rings counterclockwise, holes clockwise. */
  geometry: { type: 'MultiPolygon'; coordinates: number[][][][] };
}

/** A 2-D density with its credible regions, largest density level (smallest mass) first. */
export interface ContourSet2D {
  grid: DensityGrid2D;
  regions: CredibleRegion[];
}
