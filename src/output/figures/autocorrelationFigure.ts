import { CandelaError } from '../../errors.js';
import { parameterSymbol } from '../tables/parameterSymbols.js';
import { createAxisScale } from './axisScale.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { framedLineDocument, lineFigureFrame, LINE_FIGURE_Y_PADDING_FRACTION } from './framedLineDocument.js';
import { linePathData } from './linePathData.js';
import { shapedMarkersPathData } from './markerPathData.js';
import { seriesColor, seriesMarkerShape } from './palette.js';
import { svgElement } from './svgElement.js';

/** One parameter's normalized autocorrelation function and its integrated autocorrelation time. */
export interface AutocorrelationSeries {
  /** Parameter name, e.g. `omega_m` (shown by its symbol). */
  parameter: string;
  /** rho(t) at lags t = 0, 1, 2, ... steps (rho(0) = 1; dimensionless). */
  correlation: ArrayLike<number>;
  /** Integrated autocorrelation time (steps), marked on the curve; null when undefined. */
  tauSteps: number | null;
  /** Steps between consecutive entries of `correlation` (default 1; k for a chain read every k-th step). */
  lagStepSize?: number;
}

/** Optional settings of {@link autocorrelationFigure}. */
export interface AutocorrelationFigureOptions {
  /** Figure width (px; default 560); ignored when `width` is given. */
  widthPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`. */
  width?: FigureWidth;
  /** Figure height (px; default 360), legend strip included. */
  heightPx?: number;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Prefix of the clip-path id (default 'autocorrelation'). */
  idPrefix?: string;
}

/**
 * Lags shown: this many times the largest tau. Sokal's automatic window cuts
 * the sum at 5 tau (SOKAL_WINDOW_FACTOR in diagnostics), so twice that shows
 * where the sum stopped and the noise floor beyond it.
 */
const LAGS_PER_LARGEST_TAU = 10;
/** Fewest lags shown (when every tau is tiny or undefined). */
const MINIMUM_LAGS = 20;
/** Radius of the tau marker (px). */
const TAU_MARKER_RADIUS_PX = 3;

/**
 * The normalized autocorrelation function rho(t) of each parameter against
 * the lag in steps (averaged over walkers, as the diagnostics layer computes
 * it for ensemble samplers; Goodman & Weare 2010), one line per parameter in
 * the series colours of docs/style.md, with each parameter's integrated
 * autocorrelation time marked by a filled marker on its curve at t = tau and
 * a thin drop line to zero, and zero as an ink hairline. Lags run to 10 times
 * the largest tau (at least 20, at most the chain). The legend strip below
 * names each parameter with its tau.
 *
 * Cost: O(parameters x lags shown).
 *
 * @param series one entry per parameter: name, rho(t), tau (steps)
 * @param options size (px or journal width), font face, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.bad_range` when there is no series or a series has fewer than two lags
 * @example autocorrelationFigure([{ parameter: 'omega_m', correlation: rho, tauSteps: 31.2 }]).includes('class="tau-marker"') // true
 */
export function autocorrelationFigure(series: readonly AutocorrelationSeries[], options: AutocorrelationFigureOptions = {}): string {
  if (series.length === 0 || series.some((entry) => entry.correlation.length < 2)) {
    throw new CandelaError({ code: 'figure.bad_range', message: 'an autocorrelation figure needs at least one parameter with two or more lags' });
  }
  const widthPx = figureWidthPx(options.width, options.widthPx ?? 560);
  const heightPx = Math.round(options.heightPx ?? 360);
  const sizeOf = (entry: AutocorrelationSeries): number => entry.lagStepSize ?? 1;
  const longest = Math.max(...series.map((entry) => (entry.correlation.length - 1) * sizeOf(entry)));
  const taus = series.map((entry) => entry.tauSteps).filter((tau): tau is number => tau !== null && Number.isFinite(tau) && tau > 0);
  const lastLag = Math.min(longest, Math.max(MINIMUM_LAGS, Math.ceil(LAGS_PER_LARGEST_TAU * Math.max(0, ...taus))));
  const shown = series.map((entry, index) => {
    const count = Math.min(entry.correlation.length, Math.floor(lastLag / sizeOf(entry)) + 1);
    const lags = Float64Array.from({ length: count }, (_, lag) => lag * sizeOf(entry));
    const values = Float64Array.from({ length: count }, (_, lag) => entry.correlation[lag]);
    return { ...entry, lags, values, color: seriesColor(index), shape: seriesMarkerShape(index) };
  });
  const entries: LegendEntry[] = shown.map((entry) => ({
    label: `${parameterSymbol(entry.parameter).label}: τ = ${entry.tauSteps === null || !Number.isFinite(entry.tauSteps) ? 'n/a' : `${entry.tauSteps.toFixed(1)} steps`}`,
    color: entry.color, key: 'line',
  }));
  const { frame, legendSvg } = lineFigureFrame(widthPx, heightPx, entries, `${options.idPrefix ?? 'autocorrelation'}-clip`);
  let yLow = 0;
  for (const entry of shown) for (const value of entry.values) if (Number.isFinite(value)) yLow = Math.min(yLow, value);
  const padding = LINE_FIGURE_Y_PADDING_FRACTION * (1 - yLow);
  const xDomain: [number, number] = [0, lastLag];
  const yDomain: [number, number] = [yLow - padding, 1 + padding];
  const xScale = createAxisScale('linear', xDomain, [frame.leftPx, frame.leftPx + frame.widthPx]);
  const yScale = createAxisScale('linear', yDomain, [frame.topPx + frame.heightPx, frame.topPx]);
  const layers = [svgElement('path', { class: 'zero-line', fill: 'none', stroke: FIGURE_STYLE.axisColor, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: linePathData(xDomain, [0, 0], xScale, yScale) })];
  for (const entry of shown) {
    layers.push(svgElement('path', { class: 'autocorrelation', fill: 'none', stroke: entry.color, 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', 'data-parameter': entry.parameter, d: linePathData(entry.lags, entry.values, xScale, yScale) }));
  }
  for (const entry of shown) {
    const tau = entry.tauSteps;
    if (tau === null || !Number.isFinite(tau) || tau > entry.lags[entry.lags.length - 1]) continue;
    const at = valueAtLag(entry.values, tau / sizeOf(entry));
    layers.push(svgElement('path', { class: 'tau-drop', fill: 'none', stroke: entry.color, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: linePathData([tau, tau], [0, at], xScale, yScale) }));
    layers.push(svgElement('path', { class: 'tau-marker', fill: entry.color, stroke: FIGURE_STYLE.background, 'stroke-width': 0.6, 'data-parameter': entry.parameter, d: shapedMarkersPathData([tau], [at], xScale, yScale, TAU_MARKER_RADIUS_PX, entry.shape) }));
  }
  return framedLineDocument({
    widthPx, heightPx, frame, layers, legendSvg, fontFace: options.fontFace,
    xKind: 'linear', xDomain, yDomain, xScale, yScale, xLabel: 'lag [steps]', yLabel: '\\rho(lag)',
  });
}

/** rho at a fractional lag, linear between the neighbouring integer lags. */
function valueAtLag(values: Float64Array, lag: number): number {
  const below = Math.floor(lag);
  if (below >= values.length - 1) return values[values.length - 1];
  return values[below] + (lag - below) * (values[below + 1] - values[below]);
}
