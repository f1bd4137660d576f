import type { CredibleRegion } from './densityTypes.js';

/**
 * Area of a credible region in parameter units (x unit x y unit): the
 * shoelace formula on every ring, exterior areas minus hole areas. For the
 * w0-wa plane this is the area behind figures of merit (common practice).
 *
 * Cost: O(number of vertices).
 * @param region a region from credibleContours.
 * @returns area >= 0 in x unit * y unit.
 * @example credibleRegionArea({ mass: 0.5, threshold: 1, geometry: { type: 'MultiPolygon', coordinates: [[[[0, 0], [2, 0], [2, 1], [0, 1], [0, 0]]]] } }) // 2
 */
export function credibleRegionArea(region: CredibleRegion): number {
  let area = 0;
  for (const polygon of region.geometry.coordinates) {
    polygon.forEach((ring, index) => {
      let twice = 0;
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
      area += (index === 0 ? 1 : -1) * Math.abs(twice) / 2;
    });
  }
  return area;
}

/**
 * Whether a point lies inside a credible region (even-odd rule over every
 * ring, so holes are outside; ray casting, Shimrat 1962, "Algorithm 112:
 * position of point relative to polygon", Comm. ACM 5, 434).
 *
 * Cost: O(number of vertices).
 * @param region a region from credibleContours.
 * @param x point x (x unit).
 * @param y point y (y unit).
 * @example credibleRegionContains(region68, 0.3, -1) // true when (0.3, -1) is inside
 */
export function credibleRegionContains(region: CredibleRegion, x: number, y: number): boolean {
  let inside = false;
  for (const polygon of region.geometry.coordinates) {
    for (const ring of polygon) {
      for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        const xi = ring[i][0];
        const yi = ring[i][1];
        const xj = ring[j][0];
        const yj = ring[j][1];
        if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
      }
    }
  }
  return inside;
}
