import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/**
 * SVG path data for the closed region between a lower and an upper curve
 * sampled at the same abscissae (a credible band). Points where any value is
 * not finite split the band into separate closed pieces.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units), increasing
 * @param low lower curve (data units of the y scale)
 * @param high upper curve (data units of the y scale)
 * @param xScale maps x to px
 * @param yScale maps y to px
 * @returns path data of one or more closed polygons, '' when nothing can be drawn
 * @example bandPathData([0, 1], [0, 0], [1, 1], xScale, yScale) // 'M.. L.. L.. L..Z'
 */
export function bandPathData(x: ArrayLike<number>, low: ArrayLike<number>, high: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale): string {
  const count = Math.min(x.length, low.length, high.length);
  const pieces: string[] = [];
  let upper: string[] = [];
  let lower: string[] = [];
  const close = () => {
    if (upper.length >= 2) pieces.push(`M${upper.join('L')}L${lower.reverse().join('L')}Z`);
    upper = [];
    lower = [];
  };
  for (let index = 0; index < count; index++) {
    const xPx = xScale.toPx(x[index]);
    const lowPx = yScale.toPx(low[index]);
    const highPx = yScale.toPx(high[index]);
    if (!Number.isFinite(xPx) || !Number.isFinite(lowPx) || !Number.isFinite(highPx)) {
      close();
      continue;
    }
    upper.push(`${formatPixels(xPx)} ${formatPixels(highPx)}`);
    lower.push(`${formatPixels(xPx)} ${formatPixels(lowPx)}`);
  }
  close();
  return pieces.join('');
}
