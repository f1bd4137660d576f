import type { RandomStream } from '../../math/index.js';
import type { EllipsoidalBound } from './buildEllipsoidalBound.js';
import { drawInEllipsoid, ellipsoidContains } from './ellipsoidGeometry.js';

/**
 * Attempts after which a draw falls back to the whole cube (still uniform on
 * the constrained region after the likelihood test, only slower). Never reached
 * in practice: the ellipsoids contain the live points, which lie in the cube.
 */
const MAX_BOUND_ATTEMPTS = 1_000_000;

function drawInCube(random: RandomStream, out: Float64Array): void {
  for (let i = 0; i < out.length; i++) out[i] = random.uniform();
}

/**
 * Writes into `out` a point uniform on (union of the bound's ellipsoids) ∩
 * unit cube, or on the cube when `bound.wholeCube`. Overlaps are handled as in
 * Feroz & Hobson (2008): pick ellipsoid k with probability
 * V_k / sum V, draw uniformly inside it, and accept with probability 1/q,
 * where q is the number of ellipsoids containing the point. Points outside
 * the cube are redrawn.
 *
 * Cost: per attempt one ellipsoid draw and up to (ellipsoids x D^2 / 2)
 * multiply-adds for the overlap count; no allocation. The number of attempts
 * is about (sum of volumes) / (volume of the union inside the cube).
 * @param bound From buildEllipsoidalBound.
 * @param random Seeded stream.
 * @param out Receives D unit-cube coordinates in [0, 1).
 * @param scratch Work array of length >= D.
 * @returns The number of attempts used (>= 1).
 */
export function drawFromBound(bound: EllipsoidalBound, random: RandomStream, out: Float64Array, scratch: Float64Array): number {
  const dimension = out.length;
  if (bound.wholeCube) {
    drawInCube(random, out);
    return 1;
  }
  const { ellipsoids, cumulativeShare } = bound;
  for (let attempts = 1; ; attempts++) {
    if (attempts > MAX_BOUND_ATTEMPTS) {
      drawInCube(random, out);
      return attempts;
    }
    const pick = random.uniform();
    let chosen = 0;
    while (chosen < cumulativeShare.length - 1 && pick >= cumulativeShare[chosen]) chosen++;
    drawInEllipsoid(ellipsoids[chosen], random, out, scratch);
    let inside = true;
    for (let i = 0; i < dimension; i++) {
      if (!(out[i] >= 0 && out[i] < 1)) {
        inside = false;
        break;
      }
    }
    if (!inside) continue;
    if (ellipsoids.length > 1) {
      let containing = 1;
      for (let k = 0; k < ellipsoids.length; k++) {
        if (k !== chosen && ellipsoidContains(ellipsoids[k], out, scratch)) containing++;
      }
      if (containing > 1 && random.uniform() * containing >= 1) continue;
    }
    return attempts;
  }
}
