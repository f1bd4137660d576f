import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/**
 * SVG path data for a polyline through (x[i], y[i]); a point with a
 * non-finite coordinate (or a non-positive one on a log axis) breaks the
 * line instead of producing NaN.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units of the x scale)
 * @param y ordinates (data units of the y scale), same length as x
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @returns path data (`M..L..`), '' when no point can be drawn
 * @example linePathData([0, 1], [0, 1], xScale, yScale) // 'M50 200L250 20'
 */
export function linePathData(x: ArrayLike<number>, y: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale): string {
  let data = '';
  let penDown = false;
  const count = Math.min(x.length, y.length);
  for (let index = 0; index < count; index++) {
    const xPx = xScale.toPx(x[index]);
    const yPx = yScale.toPx(y[index]);
    if (!Number.isFinite(xPx) || !Number.isFinite(yPx)) {
      penDown = false;
      continue;
    }
    data += `${penDown ? 'L' : 'M'}${formatPixels(xPx)} ${formatPixels(yPx)}`;
    penDown = true;
  }
  return data;
}
