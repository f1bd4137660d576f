import { densityGrid2D, marginalDensity1D, weightedMoments, type BandwidthRule, type HardBounds } from '../math/index.js';

/** How the kernel width is chosen when none is given: the rule and a factor (as `output.smoothing` sets them for the plots). */
export interface KernelWidthChoice {
  /** Default 'scott'. */
  bandwidthRule?: BandwidthRule;
  /** Multiplies the rule's bandwidth; default 1. */
  bandwidthFactor?: number;
}

/** Just the kernel-width choice of a larger input object. */
export function widthChoice(input: KernelWidthChoice): KernelWidthChoice {
  return { bandwidthRule: input.bandwidthRule, bandwidthFactor: input.bandwidthFactor };
}

/**
 * The kernel density of posterior draws at one point, from the same
 * estimator as the plotted marginals (math/density: Gaussian kernel, Scott's
 * rule on the Kish effective count unless a bandwidth is given, reflection at
 * hard prior edges), evaluated on a two-node grid whose first node is the
 * point (the last when the point is the upper edge). Private helpers of the
 * compare layer.
 */

/**
 * Grid range of two nodes with the point exactly on one of them (the grid
 * keeps both ends exact), one bandwidth wide, or one standard deviation of
 * the draws before the bandwidth is known (the fine binning grid then still
 * has a spacing of h / 8).
 */
function rangeAt(point: number, bandwidth: number | undefined, bounds: HardBounds, values: ArrayLike<number>, weights: ArrayLike<number> | undefined): { range: [number, number]; node: 0 | 1 } {
  const lower = bounds.lower ?? -Infinity;
  const upper = bounds.upper ?? Infinity;
  const width = bandwidth ?? weightedMoments(values, weights).sd;
  if (point < upper) return { range: [point, Math.min(upper, point + width)], node: 0 };
  return { range: [Math.max(lower, point - width), point], node: 1 };
}

/** Weights of a bootstrap resample: each draw's weight times the number of times it was drawn. */
export function resampledWeights(weights: ArrayLike<number> | undefined, count: number, indices: Int32Array): Float64Array {
  const result = new Float64Array(count);
  for (let m = 0; m < indices.length; m++) result[indices[m]] += weights ? weights[indices[m]] : 1;
  return result;
}

/** 1-D kernel density at `point` (1 / parameter units) and the bandwidth used (given, or by the chosen rule). */
export function kernelDensityAtPoint1D(
  samples: ArrayLike<number>, weights: ArrayLike<number> | undefined, point: number, bounds: HardBounds, bandwidth?: number, choice: KernelWidthChoice = {},
): { density: number; bandwidth: number } {
  const { range, node } = rangeAt(point, bandwidth, bounds, samples, weights);
  const marginal = marginalDensity1D('samples', samples, { weights, bounds, range, gridPoints: 2, ...choice, ...(bandwidth !== undefined ? { bandwidth } : {}) });
  return { density: marginal.density[node], bandwidth: marginal.bandwidth };
}

/**
 * 2-D kernel density at `point` (1 / (x units x y units)) and the bandwidths
 * used (product kernel, one bandwidth per axis, given or by the chosen rule,
 * as the plotted contours).
 */
export function kernelDensityAtPoint2D(
  xs: ArrayLike<number>, ys: ArrayLike<number>, weights: ArrayLike<number> | undefined, point: readonly [number, number],
  bounds: readonly [HardBounds, HardBounds], bandwidths?: readonly [number, number], choice: KernelWidthChoice = {},
): { density: number; bandwidths: [number, number] } {
  const x = rangeAt(point[0], bandwidths?.[0], bounds[0], xs, weights);
  const y = rangeAt(point[1], bandwidths?.[1], bounds[1], ys, weights);
  const grid = densityGrid2D('xs', xs, 'ys', ys, {
    weights, xBounds: bounds[0], yBounds: bounds[1], xRange: x.range, yRange: y.range, gridPoints: [2, 2], ...choice,
    ...(bandwidths ? { bandwidthX: bandwidths[0], bandwidthY: bandwidths[1] } : {}),
  });
  return { density: grid.density[y.node * 2 + x.node], bandwidths: [grid.bandwidthX, grid.bandwidthY] };
}
