import type { AxisScale } from './axisScale.js';
import { formatPixels } from './formatPixels.js';

/** Size of the marks drawn where a bar or point leaves the panel (px): half-width and height of a small triangle. */
const MARK_HALF_WIDTH_PX = 2.4;
const MARK_HEIGHT_PX = 3.6;
/** Share of the axis span by which a bar may pass the edge and still count as inside (floating-point rounding). */
const EDGE_SLACK_FRACTION = 1e-9;

/** Error bars cut at the panel edges, and the marks that show where. */
export interface ClippedErrorBars {
  /** Path data of the bars that stay inside the panel (px). */
  bars: string;
  /** Path data of the bars cut at a panel edge (px), to be drawn fainter than the others. */
  cutBars: string;
  /** Small outward-pointing triangles at the edge for each bar or point that goes beyond it. */
  marks: string;
  /** Number of points whose bar or value goes beyond the panel. */
  cutCount: number;
  /** 1 for each point (in input order) whose bar or value goes beyond the panel. */
  cut: Uint8Array;
}

/**
 * Error bars y ± error, with each bar cut where it leaves the panel and a
 * small triangle at the edge pointing the way it goes on, so a bar of
 * hundreds of magnitudes shows as "beyond the axis" instead of setting the
 * axis. A point whose value itself lies beyond the panel gets the mark too.
 *
 * Cost: O(n).
 *
 * @param x abscissae (data units)
 * @param y values (data units)
 * @param error one-sigma errors (data units); negative or non-finite errors draw no bar
 * @param xScale maps x to px
 * @param yScale maps y to px; its domain is the panel's range
 * @returns path data (px) of the whole bars, the cut bars and the marks, and the number of points cut
 * @example clippedErrorBars([0.1], [40], [500], xScale, yScale).cutCount // 1
 */
export function clippedErrorBars(x: ArrayLike<number>, y: ArrayLike<number>, error: ArrayLike<number>, xScale: AxisScale, yScale: AxisScale): ClippedErrorBars {
  const [domainA, domainB] = yScale.domain;
  const low = Math.min(domainA, domainB);
  const high = Math.max(domainA, domainB);
  const topPx = yScale.toPx(high);
  const bottomPx = yScale.toPx(low);
  let bars = '';
  let cutBars = '';
  let marks = '';
  let cutCount = 0;
  const count = Math.min(x.length, y.length, error.length);
  const cut = new Uint8Array(count);
  // Rounding slack: a bar ending exactly on the axis (0.1 + 0.1 = 0.2 in decimal) is not cut.
  const slack = EDGE_SLACK_FRACTION * (high - low);
  for (let index = 0; index < count; index++) {
    const xPx = xScale.toPx(x[index]);
    const value = y[index];
    if (!Number.isFinite(xPx) || !Number.isFinite(value)) continue;
    const spread = error[index] >= 0 && Number.isFinite(error[index]) ? error[index] : 0;
    const up = value + spread > high + slack;
    const down = value - spread < low - slack;
    if (spread > 0 && value + spread >= low && value - spread <= high) {
      const bar = `M${formatPixels(xPx)} ${formatPixels(yScale.toPx(Math.max(low, value - spread)))}V${formatPixels(yScale.toPx(Math.min(high, value + spread)))}`;
      if (up || down) cutBars += bar;
      else bars += bar;
    }
    if (up) marks += `M${formatPixels(xPx - MARK_HALF_WIDTH_PX)} ${formatPixels(topPx + MARK_HEIGHT_PX)}L${formatPixels(xPx)} ${formatPixels(topPx)}L${formatPixels(xPx + MARK_HALF_WIDTH_PX)} ${formatPixels(topPx + MARK_HEIGHT_PX)}Z`;
    if (down) marks += `M${formatPixels(xPx - MARK_HALF_WIDTH_PX)} ${formatPixels(bottomPx - MARK_HEIGHT_PX)}L${formatPixels(xPx)} ${formatPixels(bottomPx)}L${formatPixels(xPx + MARK_HALF_WIDTH_PX)} ${formatPixels(bottomPx - MARK_HEIGHT_PX)}Z`;
    if (up || down) {
      cutCount++;
      cut[index] = 1;
    }
  }
  return { bars, cutBars, marks, cutCount, cut };
}
