import { csvField } from './csvField.js';
import { credibleRegionArea } from './credibleRegionGeometry.js';
import type { ContourSet2D } from './densityTypes.js';

/**
 * Credible regions as a GeoJSON FeatureCollection (RFC 7946): one Feature
 * per region, a MultiPolygon in parameter coordinates, with properties
 * `mass`, `threshold`, `xParameter`, `yParameter` and `coordinateSpace`.
 * RFC 7946 means positions to be longitude/latitude; these are not, and the
 * `coordinateSpace` property says so, so that a GIS tool is not misled.
 *
 * Cost: O(number of vertices).
 * @param set from credibleContours.
 * @returns JSON text (2-space indentation, final newline).
 * @example JSON.parse(contourGeoJson(set)).features[0].properties.mass // 0.6826894921370859
 */
export function contourGeoJson(set: ContourSet2D): string {
  const { xParameter, yParameter } = set.grid;
  const collection = {
    type: 'FeatureCollection',
    features: set.regions.map((region) => ({
      type: 'Feature',
      properties: {
        mass: region.mass,
        threshold: region.threshold,
        xParameter,
        yParameter,
        coordinateSpace: `parameter coordinates [${xParameter}, ${yParameter}], not longitude/latitude`,
      },
      geometry: region.geometry,
    })),
  };
  return JSON.stringify(collection, null, 2) + '\n';
}

/**
 * Credible-region outlines as plain CSV paths, one row per vertex:
 * `mass,polygon,ring,point,<x parameter>,<y parameter>`; polygons, rings and
 * points count from 0 in each region, ring 0 is a polygon's exterior and the
 * others are holes; each ring is closed (last point = first point).
 *
 * Cost: O(number of vertices).
 * @param set from credibleContours.
 * @returns CSV text ending in a newline.
 * @example contourPathsCsv(set).split('\n')[0] // 'mass,polygon,ring,point,omega_m,w0'
 */
export function contourPathsCsv(set: ContourSet2D): string {
  const lines = [`mass,polygon,ring,point,${csvField(set.grid.xParameter)},${csvField(set.grid.yParameter)}`];
  for (const region of set.regions) {
    region.geometry.coordinates.forEach((polygon, p) => {
      polygon.forEach((ring, r) => {
        ring.forEach(([x, y], k) => lines.push(`${region.mass},${p},${r},${k},${x},${y}`));
      });
    });
  }
  return lines.join('\n') + '\n';
}

/**
 * The levels of a contour set as JSON text with snake_case keys, like every
 * JSON file candela writes: parameters (`x_parameter`, `y_parameter`),
 * bandwidths (`bandwidth_x`, `bandwidth_y`), grid size and range
 * (`grid_points`, `x_range`, `y_range`), and under `levels` each region's
 * mass, density threshold and area (parameter units).
 *
 * Cost: O(number of vertices) for the areas.
 * @param set from credibleContours.
 * @returns JSON text (2-space indentation, final newline).
 * @example JSON.parse(contourThresholdsJson(set)).levels[1].mass // 0.9544997361036416
 */
export function contourThresholdsJson(set: ContourSet2D): string {
  const { grid } = set;
  const document = {
    x_parameter: grid.xParameter,
    y_parameter: grid.yParameter,
    bandwidth_x: grid.bandwidthX,
    bandwidth_y: grid.bandwidthY,
    grid_points: [grid.x.length, grid.y.length],
    x_range: [grid.x[0], grid.x[grid.x.length - 1]],
    y_range: [grid.y[0], grid.y[grid.y.length - 1]],
    levels: set.regions.map((region) => ({ mass: region.mass, threshold: region.threshold, area: credibleRegionArea(region) })),
  };
  return JSON.stringify(document, null, 2) + '\n';
}
