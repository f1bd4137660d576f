import { formatPixels } from './formatPixels.js';
import type { PlotFrame } from './plotFrame.js';
import { svgElement } from './svgElement.js';

/** Hatching directions by run (degrees from the x axis, counterclockwise): each overlaid run gets its own, so overlapping regions stay apart. */
const HATCH_ANGLES_DEG = [45, -45, 0, 90, 22.5, -67.5];

/**
 * The hatching direction of a run: 45, -45, 0, 90, 22.5, -67.5 degrees from
 * the x axis (counterclockwise), repeating.
 *
 * @param runIndex 0-based run position
 * @returns angle (degrees)
 * @example hatchAngleDeg(1) // -45
 */
export function hatchAngleDeg(runIndex: number): number {
  return HATCH_ANGLES_DEG[((Math.trunc(runIndex) % HATCH_ANGLES_DEG.length) + HATCH_ANGLES_DEG.length) % HATCH_ANGLES_DEG.length];
}

/**
 * Parallel lines at an angle filling a rectangle, each cut to it (slab
 * clipping, as in Liang & Barsky 1984), as SVG path data.
 *
 * @param leftPx rectangle (px)
 * @param topPx rectangle (px)
 * @param widthPx rectangle (px)
 * @param heightPx rectangle (px)
 * @param angleDeg direction from the x axis, counterclockwise (degrees)
 * @param spacingPx distance between lines (px)
 * @returns path data
 * @example hatchLinesInRectangle(0, 0, 10, 10, 0, 5) // 'M0 0.43L10 0.43M0 5.43L10 5.43'
 */
export function hatchLinesInRectangle(leftPx: number, topPx: number, widthPx: number, heightPx: number, angleDeg: number, spacingPx: number): string {
  const angle = (angleDeg * Math.PI) / 180;
  const [dx, dy] = [Math.cos(angle), -Math.sin(angle)];
  const [nx, ny] = [-dy, dx];
  const [centreX, centreY] = [leftPx + widthPx / 2, topPx + heightPx / 2];
  const reach = Math.hypot(widthPx, heightPx) / 2;
  let data = '';
  for (let offset = -reach + spacingPx / 2; offset <= reach; offset += spacingPx) {
    const [px, py] = [centreX + offset * nx, centreY + offset * ny];
    let [enter, leave] = [-Infinity, Infinity];
    for (const [origin, direction, low, high] of [[px, dx, leftPx, leftPx + widthPx], [py, dy, topPx, topPx + heightPx]]) {
      if (Math.abs(direction) < 1e-12) {
        if (origin < low || origin > high) [enter, leave] = [1, 0];
        continue;
      }
      const [first, second] = [(low - origin) / direction, (high - origin) / direction];
      enter = Math.max(enter, Math.min(first, second));
      leave = Math.min(leave, Math.max(first, second));
    }
    if (leave > enter) data += `M${formatPixels(px + enter * dx)} ${formatPixels(py + enter * dy)}L${formatPixels(px + leave * dx)} ${formatPixels(py + leave * dy)}`;
  }
  return data;
}

/**
 * Light hatching inside a region: parallel thin lines across the panel,
 * clipped to the region's outline (even-odd, so holes stay empty). Written
 * as a clip path and a clipped group rather than an SVG pattern, so PNG and
 * PDF output draw it identically.
 *
 * Cost: O(panel diagonal / spacing).
 *
 * @param regionPathData the region's outline (SVG path data, px)
 * @param frame the panel (px); the lines span it
 * @param clipId a unique id for the region's clip path
 * @param runIndex 0-based run position (picks the angle)
 * @param color line colour
 * @param spacingPx distance between lines (px)
 * @returns the clip path (for `<defs>`) and the clipped group of lines
 * @example hatchPattern('M0 0L10 0L10 10Z', frame, 'h0', 0, '#4C32D5', 4)
 */
export function hatchPattern(regionPathData: string, frame: PlotFrame, clipId: string, runIndex: number, color: string, spacingPx: number): { definition: string; svg: string } {
  const angle = (hatchAngleDeg(runIndex) * Math.PI) / 180;
  const [dx, dy] = [Math.cos(angle), -Math.sin(angle)];
  const [nx, ny] = [-dy, dx];
  const centreX = frame.leftPx + frame.widthPx / 2;
  const centreY = frame.topPx + frame.heightPx / 2;
  const reach = Math.hypot(frame.widthPx, frame.heightPx) / 2;
  const lines: string[] = [];
  for (let offset = -reach; offset <= reach; offset += spacingPx) {
    const [px, py] = [centreX + offset * nx, centreY + offset * ny];
    lines.push(`M${formatPixels(px - reach * dx)} ${formatPixels(py - reach * dy)}L${formatPixels(px + reach * dx)} ${formatPixels(py + reach * dy)}`);
  }
  return {
    definition: svgElement('clipPath', { id: clipId }, svgElement('path', { 'clip-rule': 'evenodd', d: regionPathData })),
    svg: svgElement('g', { 'clip-path': `url(#${clipId})` }, svgElement('path', { class: 'hatching', fill: 'none', stroke: color, 'stroke-width': 0.55, 'stroke-opacity': 0.6, d: lines.join('') })),
  };
}
