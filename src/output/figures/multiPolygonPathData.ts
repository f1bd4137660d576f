import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/** A GeoJSON MultiPolygon (RFC 7946, section 3.1.7) in data coordinates: polygons of rings of [x, y] points. */
export interface MultiPolygonGeometry {
  type: 'MultiPolygon';
  coordinates: number[][][][];
}

/**
 * SVG path data for a GeoJSON MultiPolygon: every ring becomes one closed
 * sub-path, so one `<path>` with `fill-rule="evenodd"` fills the region and
 * leaves its holes empty whatever the ring orientation. Points with
 * non-finite coordinates are skipped; rings with fewer than three usable
 * points are dropped.
 *
 * Cost: O(total number of points).
 *
 * @param geometry the region, coordinates in data units [x, y]
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @returns path data (`M..L..Z` per ring), '' for an empty region
 * @example multiPolygonPathData({ type: 'MultiPolygon', coordinates: [[[[0, 0], [1, 0], [0, 1], [0, 0]]]] }, xs, ys)
 */
export function multiPolygonPathData(geometry: MultiPolygonGeometry, xScale: AxisScale, yScale: AxisScale): string {
  let data = '';
  for (const polygon of geometry.coordinates) {
    for (const ring of polygon) {
      const points: string[] = [];
      for (const point of ring) {
        const xPx = xScale.toPx(point[0]);
        const yPx = yScale.toPx(point[1]);
        if (Number.isFinite(xPx) && Number.isFinite(yPx)) points.push(`${formatPixels(xPx)} ${formatPixels(yPx)}`);
      }
      // GeoJSON repeats the first point at the end; Z closes the ring anyway.
      if (points.length > 1 && points[0] === points[points.length - 1]) points.pop();
      if (points.length >= 3) data += `M${points.join('L')}Z`;
    }
  }
  return data;
}
