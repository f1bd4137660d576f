import type { AxisScale } from './axisScale.js';
import { circleMarkersPathData } from './circleMarkersPathData.js';
import { clippedErrorBars } from './clippedErrorBars.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { BinnedResidual } from './hubbleFigure.js';
import { shapedMarkersPathData } from './markerPathData.js';
import { LANTERN_COLORS, seriesColor, seriesMarkerShape } from './palette.js';
import { svgElement } from './svgElement.js';

/**
 * How supernovae and binned means look in every figure that shows them (the
 * Hubble diagram and the residual figure; docs/style.md): marker radius (px)
 * at full width, error-bar opacity, faint dotted bars cut at an axis, open
 * circles for binned means (radius and stroke, px).
 */
export const SUPERNOVA_MARKS = {
  markerRadiusPx: 1.8,
  binnedDataMarkerRadiusPx: 2.8,
  /** Figure width (px) at which markers have their full size; narrower figures get smaller markers (square-root scaling). */
  fullMarkerWidthPx: 640,
  errorBarOpacity: 0.45,
  cutBarOpacity: 0.3,
  cutBarDash: '1 2',
  binnedMeanRadiusPx: 3.2,
  binnedMeanStrokePx: 1.2,
} as const;

/** One sample of supernovae as drawn: code, shown name, member indices, colour and marker shape. */
export interface DrawnSample {
  code: string;
  name: string;
  members: number[];
  color: string;
  shape: 'circle' | 'square' | 'diamond';
}

/**
 * The samples in order of first appearance, each with its members, series
 * colour, marker shape (past six samples) and shown name.
 * Cost: O(n x samples).
 * @param count number of supernovae.
 * @param sample sample code of each supernova (absent: one sample called `supernovae`).
 * @param sampleNames names to show for codes; codes without a name are shown as they are.
 * @returns the samples.
 * @example drawnSamples(3, ['a', 'b', 'a'])[0].members // [0, 2]
 */
export function drawnSamples(count: number, sample?: readonly string[], sampleNames?: Readonly<Record<string, string>>): DrawnSample[] {
  const codes = sample ? [...new Set(sample)] : ['supernovae'];
  return codes.map((code, sampleIndex) => ({
    code,
    name: sampleNames?.[code] ?? code,
    members: Array.from({ length: count }, (_, index) => index).filter((index) => !sample || sample[index] === code),
    color: seriesColor(sampleIndex),
    shape: seriesMarkerShape(sampleIndex),
  }));
}

/**
 * One sample's points with error bars in a panel: bars that leave the panel
 * are cut there and drawn faint and dotted, with a small open triangle at the
 * edge (clippedErrorBars).
 * Cost: O(members).
 * @param drawn the sample.
 * @param z abscissae of its members (redshift).
 * @param y values of its members (panel units, e.g. mag).
 * @param errors one-sigma errors of its members (panel units).
 * @param xScale,yScale the panel's scales.
 * @param markerRadiusPx marker radius (px).
 * @returns clipped layers, unclipped edge marks, and 1 for each member that was cut.
 * @example sampleMarks(drawn, z, mu, sigma, xScale, yScale, 1.8).layers.length // 2 or 3
 */
export function sampleMarks(drawn: DrawnSample, z: Float64Array, y: Float64Array, errors: Float64Array, xScale: AxisScale, yScale: AxisScale, markerRadiusPx: number): { layers: string[]; marks: string[]; cut: Uint8Array } {
  const cut = clippedErrorBars(z, y, errors, xScale, yScale);
  const layers = [svgElement('path', { class: 'error-bars', fill: 'none', stroke: drawn.color, 'stroke-opacity': SUPERNOVA_MARKS.errorBarOpacity, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: cut.bars })];
  if (cut.cutBars) layers.push(svgElement('path', { class: 'cut-error-bars', fill: 'none', stroke: drawn.color, 'stroke-opacity': SUPERNOVA_MARKS.cutBarOpacity, 'stroke-width': FIGURE_STYLE.thinStrokePx, 'stroke-dasharray': SUPERNOVA_MARKS.cutBarDash, d: cut.cutBars }));
  layers.push(svgElement('path', { class: 'markers', fill: drawn.color, stroke: 'none', 'data-sample': drawn.code, d: shapedMarkersPathData(z, y, xScale, yScale, markerRadiusPx, drawn.shape) }));
  const marks = cut.marks ? [svgElement('path', { class: 'cut-marks', fill: FIGURE_STYLE.background, stroke: drawn.color, 'stroke-width': 0.8, 'data-sample': drawn.code, d: cut.marks })] : [];
  return { layers, marks, cut: cut.cut };
}

/**
 * Binned mean residuals as open ink circles with ink error bars.
 * Cost: O(bins).
 * @param bins the binned means (mag).
 * @param xScale,yScale the panel's scales.
 * @returns two clipped layers (bars, circles).
 * @example binnedMeanLayers([{ z: 0.1, mean: 0.02, err: 0.01 }], xScale, yScale).length // 2
 */
export function binnedMeanLayers(bins: readonly BinnedResidual[], xScale: AxisScale, yScale: AxisScale): string[] {
  const ink = LANTERN_COLORS.ink;
  const binZ = bins.map((bin) => bin.z);
  const binMean = bins.map((bin) => bin.mean);
  const binBars = clippedErrorBars(binZ, binMean, bins.map((bin) => bin.err), xScale, yScale);
  return [
    svgElement('path', { class: 'binned-error-bars', fill: 'none', stroke: ink, 'stroke-width': SUPERNOVA_MARKS.binnedMeanStrokePx, d: binBars.bars + binBars.cutBars }),
    svgElement('path', { class: 'binned-markers', fill: FIGURE_STYLE.background, stroke: ink, 'stroke-width': SUPERNOVA_MARKS.binnedMeanStrokePx, d: circleMarkersPathData(binZ, binMean, xScale, yScale, SUPERNOVA_MARKS.binnedMeanRadiusPx) }),
  ];
}
