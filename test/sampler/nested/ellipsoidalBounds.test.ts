import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { buildEllipsoidalBound } from '../../../src/sampler/nested/buildEllipsoidalBound.js';
import { drawFromBound } from '../../../src/sampler/nested/drawFromBound.js';
import { drawInEllipsoid, ellipsoidContains, ellipsoidRadiusSquared, unitBallLogVolume } from '../../../src/sampler/nested/ellipsoidGeometry.js';
import type { BoundingEllipsoid } from '../../../src/sampler/nested/ellipsoidGeometry.js';
import { fitBoundingEllipsoid } from '../../../src/sampler/nested/fitBoundingEllipsoid.js';
import { twoMeansSplit } from '../../../src/sampler/nested/twoMeansSplit.js';

function allMembers(count: number): Int32Array {
  return Int32Array.from({ length: count }, (_, k) => k);
}

function gaussianBlob(seed: string, count: number, center: number[], width: number): Float64Array {
  const random = createRandomStream(seed);
  const points = new Float64Array(count * center.length);
  for (let k = 0; k < count; k++) for (let i = 0; i < center.length; i++) points[k * center.length + i] = center[i] + width * random.normal();
  return points;
}

function disk(centerX: number, centerY: number, radius: number): BoundingEllipsoid {
  return { dimension: 2, center: Float64Array.of(centerX, centerY), factor: Float64Array.of(radius, 0, 0, radius), logVolume: Math.log(Math.PI * radius * radius) };
}

describe('unitBallLogVolume', () => {
  it('equals pi^(D/2) / Gamma(D/2 + 1) for D = 1..6 (DLMF eq. 5.19.4: 2, pi, 4pi/3, pi^2/2, 8pi^2/15, pi^3/6)', () => {
    const expected = [2, Math.PI, (4 * Math.PI) / 3, Math.PI ** 2 / 2, (8 * Math.PI ** 2) / 15, Math.PI ** 3 / 6];
    expected.forEach((volume, k) => expect(Math.exp(unitBallLogVolume(k + 1))).toBeCloseTo(volume, 13));
  });
});

describe('fitBoundingEllipsoid', () => {
  it('encloses points on a circle with the circle enlarged by the volume factor (area pi r^2 x 1.5)', () => {
    // 360 points on a circle of radius 0.2 about (0.5, 0.5): covariance r^2/2 I, every point at
    // Mahalanobis distance sqrt(2), so the bound is the circle itself before enlargement (geometry).
    const points = new Float64Array(720);
    for (let k = 0; k < 360; k++) {
      points[2 * k] = 0.5 + 0.2 * Math.cos((k * Math.PI) / 180);
      points[2 * k + 1] = 0.5 + 0.2 * Math.sin((k * Math.PI) / 180);
    }
    const ellipsoid = fitBoundingEllipsoid(points, 2, allMembers(360), 360, 1.5, -Infinity)!;
    expect(Math.exp(ellipsoid.logVolume)).toBeCloseTo(Math.PI * 0.04 * 1.5, 8);
    const scratch = new Float64Array(2);
    for (let k = 0; k < 360; k++) expect(ellipsoidRadiusSquared(ellipsoid, points.subarray(2 * k, 2 * k + 2), scratch)).toBeCloseTo(1 / 1.5, 8);
  });

  it('contains every point of a correlated 4-D cloud, the outermost exactly at radius enlargement^(-1/D)', () => {
    const base = gaussianBlob('cloud', 300, [0, 0, 0, 0], 1);
    for (let k = 0; k < 300; k++) base[4 * k + 1] = 0.9 * base[4 * k] + 0.1 * base[4 * k + 1];
    const ellipsoid = fitBoundingEllipsoid(base, 4, allMembers(300), 300, 1.3, -Infinity)!;
    const scratch = new Float64Array(4);
    let largest = 0;
    for (let k = 0; k < 300; k++) largest = Math.max(largest, ellipsoidRadiusSquared(ellipsoid, base.subarray(4 * k, 4 * k + 4), scratch));
    expect(largest).toBeCloseTo(Math.pow(1.3, -2 / 4), 10);
  });

  it('grows an ellipsoid to the minimum volume it is given', () => {
    const points = gaussianBlob('small', 50, [0.5, 0.5], 0.001);
    const ellipsoid = fitBoundingEllipsoid(points, 2, allMembers(50), 50, 1, Math.log(0.01))!;
    expect(ellipsoid.logVolume).toBeCloseTo(Math.log(0.01), 12);
    expect(ellipsoidContains(ellipsoid, points.subarray(0, 2), new Float64Array(2))).toBe(true);
  });
});

describe('drawInEllipsoid', () => {
  it('draws uniformly: the share inside the half-size ellipsoid is 2^-D (volume ratio, geometry) for D = 3', () => {
    const ellipsoid: BoundingEllipsoid = { dimension: 3, center: Float64Array.of(1, 2, 3), factor: Float64Array.of(2, 0, 0, 0.5, 1, 0, -0.3, 0.2, 0.4), logVolume: 0 };
    const random = createRandomStream('uniform-ball');
    const out = new Float64Array(3);
    const scratch = new Float64Array(3);
    const draws = 40_000;
    let inner = 0;
    let largest = 0;
    for (let k = 0; k < draws; k++) {
      drawInEllipsoid(ellipsoid, random, out, scratch);
      const radiusSquared = ellipsoidRadiusSquared(ellipsoid, out, scratch);
      largest = Math.max(largest, radiusSquared);
      if (radiusSquared <= 0.25) inner++;
    }
    expect(largest).toBeLessThanOrEqual(1 + 1e-12);
    // Binomial standard error sqrt(0.125 x 0.875 / 40000) = 0.0017; 4 standard errors allowed.
    expect(Math.abs(inner / draws - 0.125)).toBeLessThan(4 * 0.0017);
  });
});

describe('twoMeansSplit and buildEllipsoidalBound', () => {
  const lower = gaussianBlob('lower', 150, [0.25, 0.3], 0.03);
  const upper = gaussianBlob('upper', 150, [0.75, 0.7], 0.03);
  const both = new Float64Array(600);
  both.set(lower);
  both.set(upper, 300);

  it('separates two distant clusters exactly', () => {
    const { first, second } = twoMeansSplit(both, 2, allMembers(300), 300);
    const groups = [Array.from(first).sort((a, b) => a - b), Array.from(second).sort((a, b) => a - b)].sort((a, b) => a[0] - b[0]);
    expect(groups[0]).toEqual(Array.from({ length: 150 }, (_, k) => k));
    expect(groups[1]).toEqual(Array.from({ length: 150 }, (_, k) => k + 150));
  });

  it('uses one ellipsoid per cluster, and one for a single cluster', () => {
    expect(buildEllipsoidalBound(both, 2, 300, 1.5, Math.log(0.05)).ellipsoids.length).toBe(2);
    expect(buildEllipsoidalBound(lower, 2, 150, 1.5, Math.log(0.05)).ellipsoids.length).toBe(1);
  });

  it('falls back to the whole cube when the points fill it', () => {
    const random = createRandomStream('fill');
    const filling = Float64Array.from({ length: 600 }, () => random.uniform());
    expect(buildEllipsoidalBound(filling, 2, 300, 1.5, 0).wholeCube).toBe(true);
  });
});

describe('drawFromBound', () => {
  it('is uniform on a union of two overlapping disks (overlap share = lens area / union area)', () => {
    // Two disks of radius r = 0.2 with centres d = 0.2 apart. Lens area
    // 2 r^2 acos(d / 2r) - (d/2) sqrt(4 r^2 - d^2) (circle-circle intersection, geometry).
    const r = 0.2;
    const d = 0.2;
    const lens = 2 * r * r * Math.acos(d / (2 * r)) - (d / 2) * Math.sqrt(4 * r * r - d * d);
    const union = 2 * Math.PI * r * r - lens;
    const ellipsoids = [disk(0.4, 0.5, r), disk(0.6, 0.5, r)];
    const bound = { wholeCube: false, ellipsoids, cumulativeShare: Float64Array.of(0.5, 1), logVolume: Math.log(2 * Math.PI * r * r) };
    const random = createRandomStream('lens');
    const out = new Float64Array(2);
    const scratch = new Float64Array(2);
    const draws = 40_000;
    let inLens = 0;
    for (let k = 0; k < draws; k++) {
      drawFromBound(bound, random, out, scratch);
      if (ellipsoidContains(ellipsoids[0], out, scratch) && ellipsoidContains(ellipsoids[1], out, scratch)) inLens++;
    }
    const expected = lens / union; // 0.2434; without the 1/q correction it would be 0.3910
    const standardError = Math.sqrt((expected * (1 - expected)) / draws);
    expect(Math.abs(inLens / draws - expected)).toBeLessThan(4 * standardError);
  });
});
