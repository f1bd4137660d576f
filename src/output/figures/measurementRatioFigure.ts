import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import { circleMarkersPathData } from './circleMarkersPathData.js';
import type { LegendEntry } from './drawLegend.js';
import { errorBarsPathData } from './errorBarsPathData.js';
import { FIGURE_STYLE, type FontFace } from './figureStyle.js';
import { figureWidthPx, type FigureWidth } from './figureWidth.js';
import { framedLineDocument, lineFigureFrame, LINE_FIGURE_Y_PADDING_FRACTION } from './framedLineDocument.js';
import { linePathData } from './linePathData.js';
import { mixWithWhite, seriesColor } from './palette.js';
import { svgElement } from './svgElement.js';

/** One measured quantity of a probe: its data points and the model's curve with a 68% band, on one ratio scale. */
export interface MeasurementGroup {
  /** Legend label, e.g. 'D_M / r_d'. */
  label: string;
  /** Measured values over the reference, with their 1-sigma errors. */
  points: { x: readonly number[]; y: readonly number[]; error: readonly number[] };
  /** The fitted model over the reference: best fit and 68% band of the posterior, at increasing x. */
  curve: { x: readonly number[]; best: readonly number[]; low68: readonly number[]; high68: readonly number[] };
}

/** What {@link measurementRatioFigure} draws. */
export interface MeasurementRatioFigureInput {
  groups: readonly MeasurementGroup[];
  /** Axis titles in candela's TeX subset. */
  xLabel: string;
  yLabel: string;
  /** Label of the dashed line at ratio 1 (the reference model). */
  referenceLabel: string;
}

/** Optional settings of {@link measurementRatioFigure}. */
export interface MeasurementRatioFigureOptions {
  width?: FigureWidth;
  /** Height (px; default 380), legend strip included. */
  heightPx?: number;
  fontFace?: FontFace;
}

/** White share of a group's 68% band fill. */
const BAND_WHITE = 0.7;
/** Horizontal offset between groups, as a fraction of the x range (drawing only; the data keep their redshifts). */
const GROUP_NUDGE_FRACTION = 0.008;
/** Marker radius, px. */
const MARKER_RADIUS_PX = 3.2;

/**
 * A probe's data against its fit, each quantity divided by a reference
 * model (so every quantity sits near 1): per group, the data with error bars
 * and the best-fit curve inside its 68% band, in the group's series colour;
 * the reference as a dashed line at 1; legend in the caption strip below
 * (docs/style.md). Used for the BAO distances (D_M, D_H, D_V over a flat
 * LambdaCDM reference).
 * Cost: O(points + curve samples).
 * @throws CandelaError `figure.bad_range` when nothing finite is given, `figure.length_mismatch` for unequal arrays.
 * @example measurementRatioFigure({ groups: [{ label: 'D_V / r_d', points, curve }], xLabel: 'redshift z', yLabel: 'ratio to reference', referenceLabel: 'flat ΛCDM, Ωm = 0.3' })
 */
export function measurementRatioFigure(input: MeasurementRatioFigureInput, options: MeasurementRatioFigureOptions = {}): string {
  for (const group of input.groups) {
    const { points, curve } = group;
    if (points.y.length !== points.x.length || points.error.length !== points.x.length
      || [curve.best, curve.low68, curve.high68].some((values) => values.length !== curve.x.length)) {
      throw new CandelaError({ code: 'figure.length_mismatch', message: `the arrays of ${group.label} differ in length`, path: group.label });
    }
  }
  const widthPx = figureWidthPx(options.width, 560);
  const heightPx = Math.round(options.heightPx ?? 380);
  const entries: LegendEntry[] = input.groups.map((group, index) => ({ label: group.label, color: seriesColor(index), key: 'marker' }));
  entries.push({ label: 'best fit with 68% band', color: FIGURE_STYLE.referenceColor, key: 'line' });
  entries.push({ label: input.referenceLabel, color: FIGURE_STYLE.referenceColor, key: 'dashed' });
  const { frame, legendSvg } = lineFigureFrame(widthPx, heightPx, entries, 'measurement-clip');
  let [xLow, xHigh, yLow, yHigh] = [Infinity, -Infinity, 1, 1];
  const widen = (x: number, y: number) => {
    if (Number.isFinite(x)) [xLow, xHigh] = [Math.min(xLow, x), Math.max(xHigh, x)];
    if (Number.isFinite(y)) [yLow, yHigh] = [Math.min(yLow, y), Math.max(yHigh, y)];
  };
  for (const { points, curve } of input.groups) {
    points.x.forEach((x, i) => { widen(x, points.y[i] - points.error[i]); widen(x, points.y[i] + points.error[i]); });
    curve.x.forEach((x, i) => { widen(x, curve.low68[i]); widen(x, curve.high68[i]); });
  }
  if (!(xHigh > xLow)) throw new CandelaError({ code: 'figure.bad_range', message: 'a measurement figure needs at least two distinct finite abscissae' });
  const pad = LINE_FIGURE_Y_PADDING_FRACTION * (yHigh - yLow || 1);
  const xPad = LINE_FIGURE_Y_PADDING_FRACTION * (xHigh - xLow);
  const xDomain: [number, number] = [Math.max(0, xLow - xPad), xHigh + xPad];
  const yDomain: [number, number] = [yLow - pad, yHigh + pad];
  const xScale = createAxisScale('linear', xDomain, [frame.leftPx, frame.leftPx + frame.widthPx]);
  const yScale = createAxisScale('linear', yDomain, [frame.topPx + frame.heightPx, frame.topPx]);
  const layers: string[] = [
    svgElement('path', { class: 'reference', fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.referenceDash, d: linePathData(xDomain, [1, 1], xScale, yScale) }),
  ];
  input.groups.forEach(({ curve }, index) => {
    layers.push(svgElement('path', { class: 'band band-68', fill: mixWithWhite(seriesColor(index), BAND_WHITE), 'fill-opacity': 0.6, stroke: 'none', d: bandPathData(curve.x, curve.low68, curve.high68, xScale, yScale) }));
  });
  // Groups measured at the same redshifts (D_M and D_H of one bin) are nudged apart so no bar hides another.
  const nudge = (index: number) => (index - (input.groups.length - 1) / 2) * GROUP_NUDGE_FRACTION * (xDomain[1] - xDomain[0]);
  input.groups.forEach(({ curve, points }, index) => {
    const color = seriesColor(index);
    const x = points.x.map((value) => value + nudge(index));
    layers.push(svgElement('path', { class: 'best-fit', fill: 'none', stroke: color, 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', d: linePathData(curve.x, curve.best, xScale, yScale) }));
    layers.push(svgElement('path', { class: 'error-bars', fill: 'none', stroke: color, 'stroke-width': 1, d: errorBarsPathData(x, points.y, points.error, xScale, yScale) }));
    layers.push(svgElement('path', { class: 'points', fill: color, stroke: 'none', d: circleMarkersPathData(x, points.y, xScale, yScale, MARKER_RADIUS_PX) }));
  });
  return framedLineDocument({ widthPx, heightPx, frame, layers, legendSvg, fontFace: options.fontFace, xKind: 'linear', xDomain, yDomain, xScale, yScale, xLabel: input.xLabel, yLabel: input.yLabel });
}
