import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { linePathData } from './linePathData.js';
import { mixWithWhite, seriesColor } from './palette.js';
import { framedLineDocument, lineFigureFrame, LINE_FIGURE_Y_PADDING_FRACTION } from './framedLineDocument.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { svgElement } from './svgElement.js';

/** A reference drawn as a dashed line: a constant (e.g. w = -1) or a curve (e.g. another model). */
export type ReferenceLine = { y: number; label?: string } | { x: ArrayLike<number>; y: ArrayLike<number>; label?: string };

/** A curve with credible bands, e.g. a w(z) reconstruction or the distance-modulus difference of two models. */
export interface BandFigureInput {
  /** Abscissae, increasing (x-axis units). */
  x: ArrayLike<number>;
  /** Posterior median and 68% band at each abscissa (y-axis units). */
  median: ArrayLike<number>;
  low68: ArrayLike<number>;
  high68: ArrayLike<number>;
  /** Optional 95% band (y-axis units). */
  low95?: ArrayLike<number>;
  high95?: ArrayLike<number>;
  referenceLine?: ReferenceLine;
  /** Axis titles in candela's TeX subset, with units, e.g. `redshift z` and `w(z)`. */
  xLabel: string;
  yLabel: string;
  /** Legend label of the median (default 'median'). */
  medianLabel?: string;
}

/** Optional settings of {@link bandFigure}. */
export interface BandFigureOptions {
  /** Figure width (px; default 560). */
  widthPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`; replaces widthPx. */
  width?: FigureWidth;
  /** Figure height (px; default 380), legend included. */
  heightPx?: number;
  /** `linear` (default) or `log` x axis. */
  xScale?: 'linear' | 'log';
  /** Curve colour `#rrggbb` (default Okabe-Ito blue). */
  color?: string;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Prefix of the clip-path ids (default 'band'). */
  idPrefix?: string;
}

const Y_PADDING_FRACTION = LINE_FIGURE_Y_PADDING_FRACTION;
/** White share of the 68% (darker) and 95% (lighter) band fills. */
const BAND_68_WHITE = 0.55;
const BAND_95_WHITE = 0.82;

/**
 * A curve with its 68% (darker) and optional 95% (lighter) credible bands
 * and an optional dashed reference line, legend in a caption strip below.
 *
 * Cost: O(n).
 *
 * @param input abscissae, median and bands (axis units), reference line, axis titles
 * @param options size (px), x-axis kind, colour, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.length_mismatch` when the arrays differ in length; `figure.bad_range` when no value is finite
 * @example bandFigure({ x: z, median: w, low68, high68, referenceLine: { y: -1, label: 'w = -1' }, xLabel: 'redshift z', yLabel: 'w(z)' })
 */
export function bandFigure(input: BandFigureInput, options: BandFigureOptions = {}): string {
  const count = input.x.length;
  const arrays = [input.median, input.low68, input.high68, input.low95, input.high95].filter((values): values is ArrayLike<number> => values !== undefined);
  if (arrays.some((values) => values.length !== count)) {
    throw new CandelaError({ code: 'figure.length_mismatch', message: 'x, median and band arrays must have the same length', expected: `${count} entries each`, found: arrays.map((values) => values.length).join(', ') });
  }
  const widthPx = figureWidthPx(options.width, Math.round(options.widthPx ?? 560));
  const heightPx = Math.round(options.heightPx ?? 380);
  const color = options.color ?? seriesColor(0);
  const entries: LegendEntry[] = [{ label: input.medianLabel ?? 'median', color, key: 'line' }];
  const darkFill = mixWithWhite(color, BAND_68_WHITE);
  const lightFill = mixWithWhite(color, BAND_95_WHITE);
  entries.push({ label: '68% credible band', color: darkFill, key: 'fill', opacity: 1 });
  if (input.low95 && input.high95) entries.push({ label: '95% credible band', color: lightFill, key: 'fill', opacity: 1 });
  const reference = input.referenceLine;
  if (reference) entries.push({ label: reference.label ?? 'reference', color: FIGURE_STYLE.referenceColor, key: 'dashed' });
  const { frame, legendSvg } = lineFigureFrame(widthPx, heightPx, entries, `${options.idPrefix ?? 'band'}-clip`);
  const kind = options.xScale ?? 'linear';
  const extent = (lists: readonly ArrayLike<number>[], positiveOnly: boolean) => {
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
    return [low, high] as [number, number];
  };
  const [xLow, xHigh] = extent([input.x], kind === 'log');
  const yLists = [...arrays];
  if (reference) yLists.push('x' in reference ? reference.y : [reference.y]);
  let [yLow, yHigh] = extent(yLists, false);
  if (!(xHigh > xLow) || !(yHigh >= yLow)) {
    throw new CandelaError({ code: 'figure.bad_range', message: 'a band figure needs at least two distinct finite abscissae and one finite value' });
  }
  if (yHigh === yLow) [yLow, yHigh] = [yLow - 0.5, yHigh + 0.5];
  const padding = Y_PADDING_FRACTION * (yHigh - yLow);
  const yDomain: [number, number] = [yLow - padding, yHigh + padding];
  const xScale = createAxisScale(kind, [xLow, xHigh], [frame.leftPx, frame.leftPx + frame.widthPx]);
  const yScale = createAxisScale('linear', yDomain, [frame.topPx + frame.heightPx, frame.topPx]);
  const layers: string[] = [];
  if (input.low95 && input.high95) {
    layers.push(svgElement('path', { class: 'band band-95', fill: lightFill, stroke: 'none', d: bandPathData(input.x, input.low95, input.high95, xScale, yScale) }));
  }
  layers.push(svgElement('path', { class: 'band band-68', fill: darkFill, stroke: 'none', d: bandPathData(input.x, input.low68, input.high68, xScale, yScale) }));
  if (reference) {
    const d = 'x' in reference
      ? linePathData(reference.x, reference.y, xScale, yScale)
      : linePathData([xLow, xHigh], [reference.y, reference.y], xScale, yScale);
    layers.push(svgElement('path', { class: 'reference', fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.referenceDash, d }));
  }
  layers.push(svgElement('path', { class: 'median', fill: 'none', stroke: color, 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', d: linePathData(input.x, input.median, xScale, yScale) }));
  return framedLineDocument({ widthPx, heightPx, frame, layers, legendSvg, fontFace: options.fontFace, xKind: kind, xDomain: [xLow, xHigh], yDomain, xScale, yScale, xLabel: input.xLabel, yLabel: input.yLabel });
}
