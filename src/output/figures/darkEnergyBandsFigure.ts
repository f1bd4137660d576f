import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import { circleMarkersPathData } from './circleMarkersPathData.js';
import type { LegendEntry } from './drawLegend.js';
import { errorBarsPathData } from './errorBarsPathData.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { linePathData } from './linePathData.js';
import { seriesColor } from './palette.js';
import { framedLineDocument, lineFigureFrame, LINE_FIGURE_Y_PADDING_FRACTION } from './framedLineDocument.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { svgElement } from './svgElement.js';

/** One model's curve: posterior median and 68% band at the shared abscissae (y-axis units). */
export interface DarkEnergyBand {
  label: string;
  median: ArrayLike<number>;
  low68: ArrayLike<number>;
  high68: ArrayLike<number>;
  /** `#rrggbb`; default: the next Okabe-Ito colour. */
  color?: string;
}

/** Several models' bands against one abscissa, with optional binned data and a reference line. */
export interface DarkEnergyBandsInput {
  /** Abscissae shared by every band, increasing (x-axis units). */
  x: ArrayLike<number>;
  bands: readonly DarkEnergyBand[];
  /** Binned data drawn as dots with one-sigma error bars (axis units). */
  points?: { x: ArrayLike<number>; y: ArrayLike<number>; error: ArrayLike<number>; label: string };
  /** A constant drawn dashed, e.g. 0 for the reference model itself. */
  referenceLine?: { y: number; label?: string };
  /** Axis titles in candela's TeX subset, with units. */
  xLabel: string;
  yLabel: string;
}

/** Optional settings of {@link darkEnergyBandsFigure}. */
export interface DarkEnergyBandsOptions {
  /** Figure width (px; default 600). */
  widthPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`; replaces widthPx. */
  width?: FigureWidth;
  /** Figure height (px; default 400), legend included. */
  heightPx?: number;
  /** `linear` (default) or `log` x axis. */
  xScale?: 'linear' | 'log';
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Prefix of the clip-path ids (default 'bands'). */
  idPrefix?: string;
}

const Y_PADDING_FRACTION = LINE_FIGURE_Y_PADDING_FRACTION;
/** Fill opacity of each 68% band: overlapping bands stay visible through each other. */
const BAND_OPACITY = 0.28;
/** Radius of the data dots (px). */
const POINT_RADIUS_PX = 2.4;

function extent(lists: readonly ArrayLike<number>[], positiveOnly: boolean): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const values of lists) {
    for (let index = 0; index < values.length; index++) {
      const value = values[index];
      if (!Number.isFinite(value) || (positiveOnly && value <= 0)) continue;
      low = Math.min(low, value);
      high = Math.max(high, value);
    }
  }
  return [low, high];
}

/**
 * Several posterior bands on one plot, the figure dark-energy comparisons
 * use for, e.g., the distance-modulus difference of each model to a
 * reference LambdaCDM: per model a median line and a translucent 68% band in
 * its own colour, optional binned data as dots with error bars, and an
 * optional dashed reference line; legend in a caption strip below.
 *
 * Cost: O(bands x points).
 * @param input abscissae, bands, points, reference line, axis titles (axis units)
 * @param options size (px), x-axis kind, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.length_mismatch` when a band's arrays differ in length from x; `figure.bad_range` when nothing finite can be drawn
 * @example darkEnergyBandsFigure({ x: z, bands: [{ label: 'wCDM', median, low68, high68 }], referenceLine: { y: 0 }, xLabel: 'redshift z', yLabel: '\\Delta\\mu (mag)' })
 */
export function darkEnergyBandsFigure(input: DarkEnergyBandsInput, options: DarkEnergyBandsOptions = {}): string {
  const count = input.x.length;
  for (const band of input.bands) {
    if ([band.median, band.low68, band.high68].some((values) => values.length !== count)) {
      throw new CandelaError({ code: 'figure.length_mismatch', message: `band ${band.label}: x, median and band arrays must have the same length`, expected: `${count} entries each`, found: [band.median.length, band.low68.length, band.high68.length].join(', ') });
    }
  }
  const widthPx = figureWidthPx(options.width, Math.round(options.widthPx ?? 600));
  const heightPx = Math.round(options.heightPx ?? 400);
  const colors = input.bands.map((band, index) => band.color ?? seriesColor(index));
  const entries: LegendEntry[] = input.bands.map((band, index) => ({ label: `${band.label} (median, 68%)`, color: colors[index], key: 'fill', opacity: 0.5 }));
  const points = input.points;
  if (points) entries.push({ label: points.label, color: FIGURE_STYLE.textColor, key: 'marker' });
  const reference = input.referenceLine;
  if (reference) entries.push({ label: reference.label ?? 'reference', color: FIGURE_STYLE.referenceColor, key: 'dashed' });
  const { frame, legendSvg } = lineFigureFrame(widthPx, heightPx, entries, `${options.idPrefix ?? 'bands'}-clip`);
  const kind = options.xScale ?? 'linear';
  const xLists: ArrayLike<number>[] = [input.x];
  if (points) xLists.push(points.x);
  const [xLow, xHigh] = extent(xLists, kind === 'log');
  const yLists: ArrayLike<number>[] = input.bands.flatMap((band) => [band.median, band.low68, band.high68]);
  if (points) {
    yLists.push(Array.from(points.y, (y, k) => y - points.error[k]), Array.from(points.y, (y, k) => y + points.error[k]));
  }
  if (reference) yLists.push([reference.y]);
  let [yLow, yHigh] = extent(yLists, false);
  if (!(xHigh > xLow) || !(yHigh >= yLow)) {
    throw new CandelaError({ code: 'figure.bad_range', message: 'a band figure needs at least two distinct finite abscissae and one finite value' });
  }
  if (yHigh === yLow) [yLow, yHigh] = [yLow - 0.5, yHigh + 0.5];
  const padding = Y_PADDING_FRACTION * (yHigh - yLow);
  const yDomain: [number, number] = [yLow - padding, yHigh + padding];
  const xScale = createAxisScale(kind, [xLow, xHigh], [frame.leftPx, frame.leftPx + frame.widthPx]);
  const yScale = createAxisScale('linear', yDomain, [frame.topPx + frame.heightPx, frame.topPx]);
  const layers: string[] = input.bands.map((band, index) => svgElement('path', { class: 'band band-68', fill: colors[index], 'fill-opacity': BAND_OPACITY, stroke: 'none', d: bandPathData(input.x, band.low68, band.high68, xScale, yScale) }));
  if (reference) {
    layers.push(svgElement('path', { class: 'reference', fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.referenceDash, d: linePathData([xLow, xHigh], [reference.y, reference.y], xScale, yScale) }));
  }
  input.bands.forEach((band, index) => {
    layers.push(svgElement('path', { class: 'median', fill: 'none', stroke: colors[index], 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', d: linePathData(input.x, band.median, xScale, yScale) }));
  });
  if (points) {
    layers.push(svgElement('path', { class: 'error-bars', fill: 'none', stroke: FIGURE_STYLE.textColor, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: errorBarsPathData(points.x, points.y, points.error, xScale, yScale) }));
    layers.push(svgElement('path', { class: 'points', fill: FIGURE_STYLE.textColor, stroke: 'none', d: circleMarkersPathData(points.x, points.y, xScale, yScale, POINT_RADIUS_PX) }));
  }
  return framedLineDocument({ widthPx, heightPx, frame, layers, legendSvg, fontFace: options.fontFace, xKind: kind, xDomain: [xLow, xHigh], yDomain, xScale, yScale, xLabel: input.xLabel, yLabel: input.yLabel });
}
