import type { ContourSet2D, CredibleRegion } from './densityTypes.js';

/** Default smallest share of a credible region's mass that one of its separate pieces must hold to be kept. */
export const DEFAULT_ISLAND_MASS_FRACTION = 0.02;

type Ring = number[][];

/** Even-odd ray casting: is (x, y) inside the closed ring? (Shimrat 1962, "Algorithm 112: position of point relative to polygon".) */
function ringContains(ring: Ring, x: number, y: number): boolean {
  let inside = false;
  for (let index = 0, previous = ring.length - 1; index < ring.length; previous = index++) {
    const [xi, yi] = ring[index];
    const [xj, yj] = ring[previous];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/**
 * Removes the stray islands of credible regions: separate pieces (polygons
 * of a region's MultiPolygon, holes included) that hold less than a set
 * share of the region's posterior mass, e.g. a one-node blob drawn around a
 * small cluster of samples far out in a tail. The mass of a piece is the
 * grid density summed over the grid nodes inside it (outer ring minus holes,
 * even-odd rule) times the cell area, relative to the mass of all pieces of
 * that region. The largest piece is always kept. The grid and thresholds
 * are unchanged, so the contour files still describe the smoothed density;
 * only the drawn outline loses its specks.
 *
 * Cost: O(pieces x grid nodes in each piece's bounding box x ring points).
 *
 * @param set a 2-D density and its credible regions
 * @param minMassFraction smallest share (0..1) of a region's mass a piece must hold (default 0.02)
 * @returns the set with pruned regions (a new object; the input is not changed)
 * @example pruneContourIslands(set, 0.02).regions[1].geometry.coordinates.length // 1 when the 95% region had one island
 */
export function pruneContourIslands(set: ContourSet2D, minMassFraction = DEFAULT_ISLAND_MASS_FRACTION): ContourSet2D {
  const { x, y, density } = set.grid;
  const columns = x.length;
  const pieceMass = (polygon: Ring[]): number => {
    const outer = polygon[0];
    if (!outer || outer.length < 3) return 0;
    let [xLow, xHigh, yLow, yHigh] = [Infinity, -Infinity, Infinity, -Infinity];
    for (const [px, py] of outer) {
      xLow = Math.min(xLow, px);
      xHigh = Math.max(xHigh, px);
      yLow = Math.min(yLow, py);
      yHigh = Math.max(yHigh, py);
    }
    let mass = 0;
    for (let row = 0; row < y.length; row++) {
      if (y[row] < yLow || y[row] > yHigh) continue;
      for (let column = 0; column < columns; column++) {
        if (x[column] < xLow || x[column] > xHigh) continue;
        if (!ringContains(outer, x[column], y[row])) continue;
        if (polygon.slice(1).some((hole) => ringContains(hole, x[column], y[row]))) continue;
        const value = density[row * columns + column];
        if (Number.isFinite(value) && value > 0) mass += value;
      }
    }
    // The cell area is the same for every node, so shares need no area factor.
    return mass;
  };
  const regions: CredibleRegion[] = set.regions.map((region) => {
    const polygons = region.geometry.coordinates;
    if (polygons.length <= 1) return region;
    const masses = polygons.map(pieceMass);
    const total = masses.reduce((sum, value) => sum + value, 0);
    const largest = masses.indexOf(Math.max(...masses));
    const kept = polygons.filter((_, index) => index === largest || (total > 0 && masses[index] >= minMassFraction * total));
    return kept.length === polygons.length ? region : { ...region, geometry: { type: 'MultiPolygon', coordinates: kept } };
  });
  return { grid: set.grid, regions };
}
