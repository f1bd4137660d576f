import { logGamma } from '../../math/index.js';
import type { RandomStream } from '../../math/index.js';

/**
 * An ellipsoid {center + factor y : |y| <= 1} in the unit cube's coordinates,
 * with `factor` a lower-triangular D x D matrix L (row major), so that the
 * ellipsoid is {x : (x - c)^T (L L^T)^-1 (x - c) <= 1}.
 */
export interface BoundingEllipsoid {
  /** Number of coordinates D. */
  dimension: number;
  /** Center c (D numbers, unit-cube coordinates). */
  center: Float64Array;
  /** Lower-triangular L with L L^T the ellipsoid's shape matrix (D x D, row major). */
  factor: Float64Array;
  /** Natural log of the volume, in unit-cube volume units. */
  logVolume: number;
}

/**
 * ln of the volume of the unit ball in D dimensions,
 * V_D = pi^(D/2) / Gamma(D/2 + 1) (V_2 = pi, V_3 = 4 pi / 3), with ln Gamma
 * from math/special/logGamma.ts (Stirling's series, about 1e-15 relative).
 *
 * Cost: O(1).
 * @param dimension D >= 1.
 * @example Math.exp(unitBallLogVolume(3)) // 4.18879... (= 4 pi / 3)
 */
export function unitBallLogVolume(dimension: number): number {
  return 0.5 * dimension * Math.log(Math.PI) - logGamma(dimension / 2 + 1);
}

/**
 * True when `point` lies inside (or on) the ellipsoid. Solves L y = x - c by
 * forward substitution into `scratch` and compares |y|^2 with 1.
 *
 * Cost: D^2 / 2 multiply-adds, no allocation.
 * @param point D unit-cube coordinates.
 * @param scratch Work array of length >= D (overwritten).
 * @example ellipsoidContains(unitDisk, Float64Array.of(0.5, 0), scratch) // true
 */
export function ellipsoidContains(ellipsoid: BoundingEllipsoid, point: Float64Array, scratch: Float64Array): boolean {
  return ellipsoidRadiusSquared(ellipsoid, point, scratch, 1) <= 1;
}

/**
 * Squared scaled distance |y|^2 of `point` from the center, with L y = x - c:
 * below 1 inside the ellipsoid, 1 on its surface (the squared Mahalanobis
 * distance when L L^T is a covariance).
 *
 * Cost: D^2 / 2 multiply-adds at most, no allocation.
 * @param point D unit-cube coordinates.
 * @param scratch Work array of length >= D (overwritten with y).
 * @param stopAbove stop as soon as the partial sum exceeds it and return that partial sum (default: never stop).
 * @example ellipsoidRadiusSquared(unitDisk, Float64Array.of(2, 0), scratch) // 4
 */
export function ellipsoidRadiusSquared(ellipsoid: BoundingEllipsoid, point: Float64Array, scratch: Float64Array, stopAbove = Infinity): number {
  const { dimension, center, factor } = ellipsoid;
  let squaredNorm = 0;
  for (let i = 0; i < dimension; i++) {
    const row = i * dimension;
    let value = point[i] - center[i];
    for (let k = 0; k < i; k++) value -= factor[row + k] * scratch[k];
    value /= factor[row + i];
    scratch[i] = value;
    squaredNorm += value * value;
    if (squaredNorm > stopAbove) return squaredNorm;
  }
  return squaredNorm;
}

/**
 * Writes into `out` a point drawn uniformly inside the ellipsoid: a direction
 * from D standard normals (Muller 1959), a radius u^(1/D) so that the draw is
 * uniform in the unit ball, then x = c + L y.
 *
 * Cost: D normal deviates, one uniform, D^2 / 2 multiply-adds; no allocation.
 * @param random Seeded stream (src/math createRandomStream).
 * @param out Receives D unit-cube coordinates (may fall outside the cube).
 * @param scratch Work array of length >= D (overwritten).
 */
export function drawInEllipsoid(ellipsoid: BoundingEllipsoid, random: RandomStream, out: Float64Array, scratch: Float64Array): void {
  const { dimension, center, factor } = ellipsoid;
  let squaredNorm = 0;
  for (let i = 0; i < dimension; i++) {
    const value = random.normal();
    scratch[i] = value;
    squaredNorm += value * value;
  }
  const scale = Math.pow(random.uniform(), 1 / dimension) / Math.sqrt(squaredNorm);
  for (let i = 0; i < dimension; i++) {
    const row = i * dimension;
    let value = center[i];
    for (let k = 0; k <= i; k++) value += factor[row + k] * scratch[k] * scale;
    out[i] = value;
  }
}
