import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/**
 * SVG path data for vertical error bars from y - error to y + error at each
 * x (no caps: with hundreds of supernovae caps only add clutter). Points with
 * a non-finite value or a negative error are skipped.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units)
 * @param y central values (data units)
 * @param error one-sigma half-lengths (data units, >= 0)
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @returns path data, one `M..V..` per bar
 * @example errorBarsPathData([1], [5], [0.5], xScale, yScale) // 'M.. ..V..'
 */
export function errorBarsPathData(x: ArrayLike<number>, y: ArrayLike<number>, error: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale): string {
  let data = '';
  const count = Math.min(x.length, y.length, error.length);
  for (let index = 0; index < count; index++) {
    if (!(error[index] >= 0)) continue;
    const xPx = xScale.toPx(x[index]);
    const lowPx = yScale.toPx(y[index] - error[index]);
    const highPx = yScale.toPx(y[index] + error[index]);
    if (!Number.isFinite(xPx) || !Number.isFinite(lowPx) || !Number.isFinite(highPx)) continue;
    data += `M${formatPixels(xPx)} ${formatPixels(lowPx)}V${formatPixels(highPx)}`;
  }
  return data;
}
