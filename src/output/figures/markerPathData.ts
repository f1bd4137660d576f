import type { AxisScale } from './axisScale.js';
import { circleMarkersPathData } from './circleMarkersPathData.js';
import { formatPixels } from './formatPixels.js';

/** A marker shape: circles first, then squares and diamonds when series outnumber the palette. */
export type MarkerShape = 'circle' | 'square' | 'diamond';

/** Half-side of a square of the same area as a circle of radius 1: sqrt(pi) / 2 (geometry). */
const SQUARE_HALF_SIDE_PER_RADIUS = Math.sqrt(Math.PI) / 2;
/** Half-diagonal of a diamond of the same area as a circle of radius 1: sqrt(pi / 2) (geometry). */
const DIAMOND_HALF_DIAGONAL_PER_RADIUS = Math.sqrt(Math.PI / 2);
/** Arm length and central gap of the truth cross (px). */
const TRUTH_ARM_PX = 4.5;
const TRUTH_GAP_PX = 1.8;

/**
 * Path data of one filled marker centred at a point (px); squares and
 * diamonds have the area of the circle of the given radius, so no shape looks heavier.
 *
 * @param shape circle, square or diamond
 * @param xPx centre (px)
 * @param yPx centre (px)
 * @param radiusPx radius of the equivalent circle (px)
 * @returns path data
 * @example markerPathData('square', 10, 10, 2) // 'M8.23 8.23h3.54v3.54h-3.54Z'
 */
export function markerPathData(shape: MarkerShape, xPx: number, yPx: number, radiusPx: number): string {
  if (shape === 'circle') {
    return `M${formatPixels(xPx - radiusPx)} ${formatPixels(yPx)}a${formatPixels(radiusPx)} ${formatPixels(radiusPx)} 0 1 0 ${formatPixels(2 * radiusPx)} 0a${formatPixels(radiusPx)} ${formatPixels(radiusPx)} 0 1 0 ${formatPixels(-2 * radiusPx)} 0`;
  }
  if (shape === 'square') {
    const half = SQUARE_HALF_SIDE_PER_RADIUS * radiusPx;
    return `M${formatPixels(xPx - half)} ${formatPixels(yPx - half)}h${formatPixels(2 * half)}v${formatPixels(2 * half)}h${formatPixels(-2 * half)}Z`;
  }
  const half = DIAMOND_HALF_DIAGONAL_PER_RADIUS * radiusPx;
  return `M${formatPixels(xPx)} ${formatPixels(yPx - half)}L${formatPixels(xPx + half)} ${formatPixels(yPx)}L${formatPixels(xPx)} ${formatPixels(yPx + half)}L${formatPixels(xPx - half)} ${formatPixels(yPx)}Z`;
}

/**
 * Path data of markers of one shape at many points (one path for all, so
 * thousands of supernovae stay small); non-finite points are skipped.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units)
 * @param y ordinates (data units)
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @param radiusPx radius of the equivalent circle (px)
 * @param shape marker shape (default circle)
 * @returns path data
 * @example shapedMarkersPathData([1], [5], xScale, yScale, 2, 'diamond')
 */
export function shapedMarkersPathData(x: ArrayLike<number>, y: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale, radiusPx: number, shape: MarkerShape = 'circle'): string {
  if (shape === 'circle') return circleMarkersPathData(x, y, xScale, yScale, radiusPx);
  let data = '';
  const count = Math.min(x.length, y.length);
  for (let index = 0; index < count; index++) {
    const xPx = xScale.toPx(x[index]);
    const yPx = yScale.toPx(y[index]);
    if (Number.isFinite(xPx) && Number.isFinite(yPx)) data += markerPathData(shape, xPx, yPx, radiusPx);
  }
  return data;
}

/**
 * Path data of the truth marker: four short arms pointing at the point
 * with a gap in the middle, so the marker never hides what lies under it.
 *
 * @param xPx the point (px)
 * @param yPx the point (px)
 * @returns path data (stroke it; it has no area)
 * @example truthMarkerPathData(10, 10) // 'M3.7 10h4.5M12.3 10h...'
 */
export function truthMarkerPathData(xPx: number, yPx: number): string {
  const reach = TRUTH_GAP_PX + TRUTH_ARM_PX;
  return [
    `M${formatPixels(xPx - reach)} ${formatPixels(yPx)}h${TRUTH_ARM_PX}`,
    `M${formatPixels(xPx + TRUTH_GAP_PX)} ${formatPixels(yPx)}h${TRUTH_ARM_PX}`,
    `M${formatPixels(xPx)} ${formatPixels(yPx - reach)}v${TRUTH_ARM_PX}`,
    `M${formatPixels(xPx)} ${formatPixels(yPx + TRUTH_GAP_PX)}v${TRUTH_ARM_PX}`,
  ].join('');
}
