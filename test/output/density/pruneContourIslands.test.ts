import { describe, expect, it } from 'vitest';
import type { ContourSet2D } from '../../../src/output/density/densityTypes.js';
import { pruneContourIslands } from '../../../src/output/density/pruneContourIslands.js';

// A 21 x 21 grid of unit density on [0, 20] x [0, 20]: the mass of a piece is the number of grid
// nodes inside it, counted by hand.
const axis = Float64Array.from({ length: 21 }, (_, index) => index);
const grid = { xParameter: 'omega_m', yParameter: 'w0', x: axis, y: axis, density: new Float64Array(21 * 21).fill(1), bandwidthX: 1, bandwidthY: 1 };
const square = (low: number, high: number) => [[low, low], [high, low], [high, high], [low, high], [low, low]];

function setWith(polygons: number[][][][]): ContourSet2D {
  return { grid, regions: [{ mass: 0.9545, threshold: 0.5, geometry: { type: 'MultiPolygon', coordinates: polygons } }] };
}

describe('pruneContourIslands', () => {
  it('drops a piece holding less than the set share of the region mass and keeps the main region', () => {
    // Main piece: nodes 1.5..10.5 -> 2..10, 9 x 9 = 81 nodes; island around node (15, 15): 1 node; share 1/82 = 1.2%.
    const set = setWith([[square(1.5, 10.5)], [square(14.5, 15.5)]]);
    expect(pruneContourIslands(set, 0.02).regions[0].geometry.coordinates).toEqual([[square(1.5, 10.5)]]);
    expect(pruneContourIslands(set, 0.01).regions[0].geometry.coordinates).toHaveLength(2);
    expect(pruneContourIslands(set, 0).regions[0].geometry.coordinates).toHaveLength(2);
  });

  it('counts holes out of a piece (even-odd): a ring with a large hole can become the island', () => {
    // Ring: outer 0.5..12.5 (12 x 12 = 144 nodes) minus hole 1.5..11.5 (10 x 10 = 100) = 44 nodes; solid piece 14.5..19.5: 25 nodes.
    const set = setWith([[square(0.5, 12.5), square(1.5, 11.5)], [square(14.5, 19.5)]]);
    // 25 / 69 = 36% and 44 / 69 = 64%: both stay at 2%, only the ring stays at 40%.
    expect(pruneContourIslands(set, 0.02).regions[0].geometry.coordinates).toHaveLength(2);
    expect(pruneContourIslands(set, 0.4).regions[0].geometry.coordinates).toEqual([[square(0.5, 12.5), square(1.5, 11.5)]]);
  });

  it('always keeps the largest piece and leaves the grid and thresholds alone', () => {
    const set = setWith([[square(1.5, 2.5)], [square(4.5, 6.5)]]);
    const pruned = pruneContourIslands(set, 0.99);
    expect(pruned.regions[0].geometry.coordinates).toEqual([[square(4.5, 6.5)]]);
    expect(pruned.grid).toBe(set.grid);
    expect(pruned.regions[0].threshold).toBe(0.5);
    expect(set.regions[0].geometry.coordinates).toHaveLength(2);
  });
});
