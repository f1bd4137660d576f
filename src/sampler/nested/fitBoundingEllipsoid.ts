import { choleskyInPlace } from '../../math/index.js';
import { ellipsoidRadiusSquared, unitBallLogVolume } from './ellipsoidGeometry.js';
import type { BoundingEllipsoid } from './ellipsoidGeometry.js';

/**
 * Relative ridge added to the covariance diagonal (times its mean variance)
 * so that points lying in a lower-dimensional plane still give a positive
 * definite matrix; 1e-10 changes a well-conditioned ellipsoid's volume by a
 * relative 1e-10 per axis (common practice).
 */
const COVARIANCE_RIDGE = 1e-10;
/** Absolute floor of that ridge, for the degenerate case of identical points (unit-cube units squared). */
const COVARIANCE_FLOOR = 1e-300;

/**
 * The bounding ellipsoid of Mukherjee, Parkinson & Liddle (2006, ApJ 638, L51):
 * the ellipsoid with the shape of the points' covariance C, scaled so that its
 * boundary passes through the point of largest Mahalanobis distance d_max, then
 * enlarged by the volume factor `enlargement`:
 *   A = d_max^2 C enlargement^(2/D),  E = {x : (x - mean)^T A^-1 (x - mean) <= 1}.
 * When its volume is below `minimumLogVolume` it is scaled up to that volume,
 * in the spirit of Feroz, Hobson & Bridges (2009, MNRAS 398, 1601), whose
 * ellipsoids are kept at least as large as the prior volume their points are
 * expected to occupy.
 *
 * Cost: O(n D^2 + D^3) for n points; allocates the result only.
 * @param points Row-major unit-cube coordinates (any number of rows of D).
 * @param dimension D.
 * @param members Indices of the rows to enclose (first `memberCount` entries), at least D + 1 of them.
 * @param enlargement Volume factor >= 1.
 * @param minimumLogVolume Lower bound on the natural log of the volume (use -Infinity for none).
 * @returns The ellipsoid, or null when the covariance cannot be factorized even after the ridge.
 * @example fitBoundingEllipsoid(points, 2, members, 100, 1.5, -Infinity)!.logVolume
 */
export function fitBoundingEllipsoid(
  points: Float64Array,
  dimension: number,
  members: Int32Array,
  memberCount: number,
  enlargement: number,
  minimumLogVolume: number,
): BoundingEllipsoid | null {
  const center = new Float64Array(dimension);
  for (let m = 0; m < memberCount; m++) {
    const row = members[m] * dimension;
    for (let i = 0; i < dimension; i++) center[i] += points[row + i];
  }
  for (let i = 0; i < dimension; i++) center[i] /= memberCount;
  const factor = new Float64Array(dimension * dimension);
  const offset = new Float64Array(dimension);
  for (let m = 0; m < memberCount; m++) {
    const row = members[m] * dimension;
    for (let i = 0; i < dimension; i++) offset[i] = points[row + i] - center[i];
    for (let i = 0; i < dimension; i++) {
      for (let j = 0; j <= i; j++) factor[i * dimension + j] += offset[i] * offset[j];
    }
  }
  let meanVariance = 0;
  for (let i = 0; i < dimension; i++) meanVariance += factor[i * dimension + i] / memberCount / dimension;
  const ridge = Math.max(COVARIANCE_RIDGE * meanVariance, COVARIANCE_FLOOR);
  for (let i = 0; i < dimension; i++) {
    for (let j = 0; j <= i; j++) factor[i * dimension + j] /= memberCount;
    factor[i * dimension + i] += ridge;
  }
  if (!choleskyInPlace(factor, dimension).ok) return null;
  // Largest squared Mahalanobis distance: the same forward solve as the containment test.
  const shape: BoundingEllipsoid = { dimension, center, factor, logVolume: 0 };
  let largestSquared = 0;
  const point = new Float64Array(dimension);
  for (let m = 0; m < memberCount; m++) {
    const row = members[m] * dimension;
    for (let i = 0; i < dimension; i++) point[i] = points[row + i];
    const squared = ellipsoidRadiusSquared(shape, point, offset);
    if (squared > largestSquared) largestSquared = squared;
  }
  if (!(largestSquared > 0)) largestSquared = 1;
  let logDeterminantHalf = 0;
  for (let i = 0; i < dimension; i++) logDeterminantHalf += Math.log(factor[i * dimension + i]);
  let logScale = 0.5 * Math.log(largestSquared) + Math.log(enlargement) / dimension;
  let logVolume = unitBallLogVolume(dimension) + logDeterminantHalf + dimension * logScale;
  if (logVolume < minimumLogVolume) {
    logScale += (minimumLogVolume - logVolume) / dimension;
    logVolume = minimumLogVolume;
  }
  const scale = Math.exp(logScale);
  for (let k = 0; k < factor.length; k++) factor[k] *= scale;
  if (!Number.isFinite(logVolume)) return null;
  return { dimension, center, factor, logVolume };
}
