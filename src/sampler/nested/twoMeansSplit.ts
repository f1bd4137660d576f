/** Lloyd iterations after which 2-means stops even if labels still change (it converges in a few for two clusters). */
const MAX_LLOYD_ITERATIONS = 50;

/** Two groups of point indices. */
export interface TwoGroups {
  first: Int32Array;
  second: Int32Array;
}

function squaredDistance(points: Float64Array, row: number, center: Float64Array, dimension: number): number {
  let sum = 0;
  for (let i = 0; i < dimension; i++) {
    const difference = points[row + i] - center[i];
    sum += difference * difference;
  }
  return sum;
}

function farthestMember(points: Float64Array, dimension: number, members: Int32Array, count: number, from: Float64Array): number {
  let best = members[0];
  let bestDistance = -1;
  for (let m = 0; m < count; m++) {
    const distance = squaredDistance(points, members[m] * dimension, from, dimension);
    if (distance > bestDistance) {
      bestDistance = distance;
      best = members[m];
    }
  }
  return best;
}

/**
 * Splits a set of points into two clusters by 2-means (Lloyd 1982, IEEE Trans.
 * Inf. Theory 28, 129) with Euclidean distance in unit-cube coordinates, the
 * clustering step of the multi-ellipsoid bounds of Shaw, Bridges & Hobson
 * (2007) and Feroz & Hobson (2008). Deterministic start (no random draws): the
 * member farthest from the centroid, then the member farthest from it.
 *
 * Cost: O(iterations x n x D), at most 50 iterations.
 * @param points Row-major unit-cube coordinates (rows of D).
 * @param dimension D.
 * @param members Indices of the rows to split (first `count` entries).
 * @returns The two groups (either may be empty when all points coincide).
 * @example twoMeansSplit(points, 2, members, 200).first.length // points in one cluster
 */
export function twoMeansSplit(points: Float64Array, dimension: number, members: Int32Array, count: number): TwoGroups {
  const centroid = new Float64Array(dimension);
  for (let m = 0; m < count; m++) for (let i = 0; i < dimension; i++) centroid[i] += points[members[m] * dimension + i] / count;
  const centerA = new Float64Array(dimension);
  const centerB = new Float64Array(dimension);
  const seedA = farthestMember(points, dimension, members, count, centroid);
  for (let i = 0; i < dimension; i++) centerA[i] = points[seedA * dimension + i];
  const seedB = farthestMember(points, dimension, members, count, centerA);
  for (let i = 0; i < dimension; i++) centerB[i] = points[seedB * dimension + i];
  const inA = new Uint8Array(count);
  for (let iteration = 0; iteration < MAX_LLOYD_ITERATIONS; iteration++) {
    let changed = iteration === 0;
    for (let m = 0; m < count; m++) {
      const row = members[m] * dimension;
      const label = squaredDistance(points, row, centerA, dimension) <= squaredDistance(points, row, centerB, dimension) ? 1 : 0;
      if (label !== inA[m]) {
        inA[m] = label;
        changed = true;
      }
    }
    if (!changed) break;
    centerA.fill(0);
    centerB.fill(0);
    let countA = 0;
    for (let m = 0; m < count; m++) {
      const row = members[m] * dimension;
      const target = inA[m] ? centerA : centerB;
      if (inA[m]) countA++;
      for (let i = 0; i < dimension; i++) target[i] += points[row + i];
    }
    const countB = count - countA;
    if (countA === 0 || countB === 0) break;
    for (let i = 0; i < dimension; i++) {
      centerA[i] /= countA;
      centerB[i] /= countB;
    }
  }
  let countA = 0;
  for (let m = 0; m < count; m++) countA += inA[m];
  const first = new Int32Array(countA);
  const second = new Int32Array(count - countA);
  let a = 0;
  let b = 0;
  for (let m = 0; m < count; m++) {
    if (inA[m]) first[a++] = members[m];
    else second[b++] = members[m];
  }
  return { first, second };
}
