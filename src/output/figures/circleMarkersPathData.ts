import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/**
 * SVG path data drawing a small circle at each point, all in one path (two
 * half-circle arcs per marker), which keeps figures with thousands of
 * supernovae small. Points with non-finite coordinates are skipped.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units)
 * @param y ordinates (data units)
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @param radiusPx marker radius (px, > 0)
 * @returns path data
 * @example circleMarkersPathData([1], [5], xScale, yScale, 2) // 'M.. ..a2 2 0 1 0 4 0a2 2 0 1 0 -4 0'
 */
export function circleMarkersPathData(x: ArrayLike<number>, y: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale, radiusPx: number): string {
  const radius = formatPixels(radiusPx);
  const diameter = formatPixels(2 * radiusPx);
  const arcs = `a${radius} ${radius} 0 1 0 ${diameter} 0a${radius} ${radius} 0 1 0 -${diameter} 0`;
  let data = '';
  const count = Math.min(x.length, y.length);
  for (let index = 0; index < count; index++) {
    const xPx = xScale.toPx(x[index]);
    const yPx = yScale.toPx(y[index]);
    if (!Number.isFinite(xPx) || !Number.isFinite(yPx)) continue;
    data += `M${formatPixels(xPx - radiusPx)} ${formatPixels(yPx)}${arcs}`;
  }
  return data;
}
