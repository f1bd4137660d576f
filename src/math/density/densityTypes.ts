/**
 * Types of kernel density estimates on regular grids (math/density). All
 * coordinates are in the parameters' own units; densities are per unit of
 * the parameter (1-D) or per unit x-parameter per unit y-parameter (2-D).
 */

/** A 1-D marginal posterior density on a regular grid. */
export interface MarginalDensity1D {
  parameter: string;
  /** Grid points, ascending, equally spaced (parameter unit). */
  x: Float64Array;
  /** Density at each grid point (1 / parameter unit); integrates to the mass inside the grid. */
  density: Float64Array;
  /** Gaussian kernel standard deviation used (parameter unit). */
  bandwidth: number;
}

/** A 2-D marginal posterior density on a regular grid. */
export interface DensityGrid2D {
  xParameter: string;
  yParameter: string;
  /** Grid points along x, ascending, equally spaced. */
  x: Float64Array;
  /** Grid points along y, ascending, equally spaced. */
  y: Float64Array;
  /** Row-major: index = iy * x.length + ix. */
  density: Float64Array;
  /** Kernel standard deviation along x (x unit). */
  bandwidthX: number;
  /** Kernel standard deviation along y (y unit). */
  bandwidthY: number;
}

/** Bandwidth rule: Scott (1992) or Silverman (1986). */
export type BandwidthRule = 'scott' | 'silverman';

/** Hard prior edges of a parameter (either may be missing); samples near them are reflected. */
export interface HardBounds {
  lower?: number;
  upper?: number;
}

/** Options of marginalDensity1D. */
export interface MarginalDensityOptions {
  /** Non-negative sample weights; unit weights when omitted. */
  weights?: ArrayLike<number>;
  /** Hard prior edges: the density is reflected there and is zero outside. */
  bounds?: HardBounds;
  /** Grid range [low, high] (parameter unit); default: sample range padded by 3 bandwidths, cut at the bounds. */
  range?: [number, number];
  /** Number of grid points (>= 2); default 256. */
  gridPoints?: number;
  /** Default 'scott'. */
  bandwidthRule?: BandwidthRule;
  /** Multiplies the rule's bandwidth; default 1. */
  bandwidthFactor?: number;
  /** Kernel standard deviation to use instead of the rule (parameter unit). */
  bandwidth?: number;
}

/** Options of densityGrid2D. */
export interface DensityGridOptions {
  weights?: ArrayLike<number>;
  xBounds?: HardBounds;
  yBounds?: HardBounds;
  xRange?: [number, number];
  yRange?: [number, number];
  /** Grid points per axis, or [nx, ny]; default 128. */
  gridPoints?: number | [number, number];
  /** Default 'scott'. */
  bandwidthRule?: BandwidthRule;
  /** Multiplies both rule bandwidths; default 1. */
  bandwidthFactor?: number;
  /** Kernel standard deviations to use instead of the rule. */
  bandwidthX?: number;
  bandwidthY?: number;
}
