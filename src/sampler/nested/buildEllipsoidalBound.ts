import { fitBoundingEllipsoid } from './fitBoundingEllipsoid.js';
import type { BoundingEllipsoid } from './ellipsoidGeometry.js';
import { logAddExp } from './logAddExp.js';
import { twoMeansSplit } from './twoMeansSplit.js';

/**
 * A split is kept when the two child ellipsoids together have less than this
 * share of the parent's volume. Shaw, Bridges & Hobson (2007) and Feroz &
 * Hobson (2008) split whenever the children are smaller than the parent; a
 * factor 2 margin avoids splitting a single convex mode on noise (common practice).
 */
export const SPLIT_VOLUME_SHARE = 0.5;
/** Depth limit of the recursive splitting: at most 2^8 = 256 ellipsoids. */
const MAX_SPLIT_DEPTH = 8;

/** Ellipsoids whose union bounds the live points, or the whole unit cube. */
export interface EllipsoidalBound {
  /** True when the ellipsoids would be larger than the cube itself: draw from the cube. */
  wholeCube: boolean;
  /** The ellipsoids (empty when `wholeCube`). */
  ellipsoids: BoundingEllipsoid[];
  /** Cumulative volume shares (last entry 1), to pick an ellipsoid with probability proportional to its volume. */
  cumulativeShare: Float64Array;
  /** ln of the summed ellipsoid volumes (0 for the whole cube). */
  logVolume: number;
}

/** Smallest cluster worth its own ellipsoid: 2 (D + 1) points, so that its covariance is well determined (common practice). */
function minimumClusterSize(dimension: number): number {
  return 2 * (dimension + 1);
}

/**
 * Bounds the live points (unit-cube coordinates) by one or several enlarged
 * ellipsoids (Mukherjee, Parkinson & Liddle 2006; multi-ellipsoid splitting in
 * the spirit of Shaw, Bridges & Hobson 2007, MNRAS 378, 1365, and Feroz &
 * Hobson 2008, MNRAS 384, 449): fit one ellipsoid, split its points by 2-means,
 * fit one to each half, and keep the split (recursively) when the children's
 * volumes add up to less than {@link SPLIT_VOLUME_SHARE} of the parent's.
 * Each ellipsoid is kept at least as large as the prior volume its k points
 * are expected to fill, X k / N (Feroz, Hobson & Bridges 2009).
 *
 * Cost: O(N D^2 log N + D^3 x ellipsoids); allocates the ellipsoids.
 * @param points Row-major unit-cube coordinates of the N live points.
 * @param dimension D.
 * @param count N.
 * @param enlargement Volume factor >= 1 of every ellipsoid.
 * @param logPriorVolume ln X, the expected prior volume still enclosed by the live points (<= 0).
 * @returns The bound; `wholeCube` when the ellipsoids add up to more than the cube or cannot be fitted.
 * @example buildEllipsoidalBound(live, 2, 400, 1.5, -3).ellipsoids.length // 1 for one Gaussian mode
 */
export function buildEllipsoidalBound(points: Float64Array, dimension: number, count: number, enlargement: number, logPriorVolume: number): EllipsoidalBound {
  const minimumSize = minimumClusterSize(dimension);
  const floor = (size: number): number => logPriorVolume + Math.log(size / count);
  const ellipsoids: BoundingEllipsoid[] = [];
  let failed = false;
  const partition = (members: Int32Array, parent: BoundingEllipsoid, depth: number): void => {
    if (members.length >= 2 * minimumSize && depth < MAX_SPLIT_DEPTH) {
      const { first, second } = twoMeansSplit(points, dimension, members, members.length);
      if (first.length >= minimumSize && second.length >= minimumSize) {
        const childA = fitBoundingEllipsoid(points, dimension, first, first.length, enlargement, floor(first.length));
        const childB = fitBoundingEllipsoid(points, dimension, second, second.length, enlargement, floor(second.length));
        if (childA && childB && logAddExp(childA.logVolume, childB.logVolume) < parent.logVolume + Math.log(SPLIT_VOLUME_SHARE)) {
          partition(first, childA, depth + 1);
          partition(second, childB, depth + 1);
          return;
        }
      }
    }
    ellipsoids.push(parent);
  };
  const all = new Int32Array(count);
  for (let m = 0; m < count; m++) all[m] = m;
  const root = fitBoundingEllipsoid(points, dimension, all, count, enlargement, floor(count));
  if (root) partition(all, root, 0);
  else failed = true;
  let logVolume = -Infinity;
  for (const ellipsoid of ellipsoids) logVolume = logAddExp(logVolume, ellipsoid.logVolume);
  if (failed || !(logVolume < 0)) {
    return { wholeCube: true, ellipsoids: [], cumulativeShare: Float64Array.of(1), logVolume: 0 };
  }
  const cumulativeShare = new Float64Array(ellipsoids.length);
  let running = 0;
  ellipsoids.forEach((ellipsoid, k) => {
    running += Math.exp(ellipsoid.logVolume - logVolume);
    cumulativeShare[k] = running;
  });
  cumulativeShare[ellipsoids.length - 1] = 1;
  return { wholeCube: false, ellipsoids, cumulativeShare, logVolume };
}
