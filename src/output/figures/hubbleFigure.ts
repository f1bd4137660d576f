import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import { circleMarkersPathData } from './circleMarkersPathData.js';
import { drawAxes } from './drawAxes.js';
import { drawLegend } from './drawLegend.js';
import type { LegendEntry } from './drawLegend.js';
import { errorBarsPathData } from './errorBarsPathData.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { formatTickLabel } from './formatTickLabel.js';
import { interpolateModelMu } from './hubbleResiduals.js';
import type { ModelMuCurve } from './hubbleResiduals.js';
import { linePathData } from './linePathData.js';
import { logTicks } from './logTicks.js';
import { niceTicks } from './niceTicks.js';
import { seriesColor } from './palette.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { residualRangeMag } from './residualRange.js';
import { svgDocument } from './svgDocument.js';
import { svgElement } from './svgElement.js';

/** A binned mean residual (mag) at a redshift, with its one-sigma error (mag). */
export interface BinnedResidual {
  /** Redshift of the bin (e.g. its weighted mean redshift). */
  z: number;
  /** Mean residual in the bin (mag). */
  mean: number;
  /** One-sigma error of that mean (mag). */
  err: number;
}

/** Data and model of a Hubble diagram. */
export interface HubbleFigureInput {
  /** Redshift of each supernova (> 0). */
  redshift: ArrayLike<number>;
  /** Observed (standardized) distance modulus of each supernova (mag). */
  muObsMag: ArrayLike<number>;
  /** Its one-sigma error (mag), e.g. the square root of the covariance diagonal. */
  muErrMag: ArrayLike<number>;
  /** Sample (survey) name of each supernova; colours and legend entries follow it. */
  sample?: readonly string[];
  /** Best-fit model distance modulus at each supernova (mag); default: the curve median interpolated in ln z. */
  bestFitMuMag?: ArrayLike<number>;
  /** Model curve with its 68% band, on a z grid that covers the data. */
  modelCurve: ModelMuCurve;
  /** Binned mean residuals to overlay in the lower panel. */
  binnedResiduals?: readonly BinnedResidual[];
}

/** Optional settings of {@link hubbleFigure}. */
export interface HubbleFigureOptions {
  /** Figure width (px; default 640). */
  widthPx?: number;
  /** Figure height (px; default 500), shared 70:30 by the two panels. */
  heightPx?: number;
  /** Legend label of the model curve (default 'best fit'). */
  modelLabel?: string;
  /** Fixed [low, high] range of the residual axis (mag); default from residualRangeMag. */
  residualRangeMag?: readonly [number, number];
  /** Prefix of the clip-path ids (default 'hubble'). */
  idPrefix?: string;
}

const MARGIN = { left: 66, right: 16, top: 12, bottom: 48 } as const;
/** Share of the plotting height given to the upper (distance-modulus) panel. */
const UPPER_PANEL_SHARE = 0.7;
const PANEL_GAP_PX = 8;
/** Marker radius (px) and error-bar opacity: many supernovae must stay readable. */
const MARKER_RADIUS_PX = 1.9;
const ERROR_BAR_OPACITY = 0.45;
/** Redshift axis padding factor on each side (log axis). */
const REDSHIFT_PADDING_FACTOR = 1.12;
/** Distance-modulus axis padding on each side, as a fraction of the data span. */
const MU_PADDING_FRACTION = 0.04;

/**
 * A Hubble diagram: the upper panel shows the supernovae (coloured by
 * sample, with error bars) against redshift on a log axis, the best-fit
 * model curve and its 68% band; the lower panel shows residuals (data minus
 * best fit) with the band around zero and optional binned means.
 *
 * Cost: O(n log m) for n supernovae and m model grid points.
 *
 * @param input supernovae (redshift, mag), samples, model curve (mag), binned residuals (mag)
 * @param options size (px), model label, residual range (mag), clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.length_mismatch` when per-supernova arrays differ in length; `figure.redshift_outside_model` (see interpolateModelMu)
 * @example hubbleFigure({ redshift, muObsMag, muErrMag, modelCurve })
 */
export function hubbleFigure(input: HubbleFigureInput, options: HubbleFigureOptions = {}): string {
  const count = input.redshift.length;
  const lengths = [input.muObsMag.length, input.muErrMag.length, input.sample?.length ?? count, input.bestFitMuMag?.length ?? count];
  if (lengths.some((length) => length !== count)) {
    throw new CandelaError({ code: 'figure.length_mismatch', message: 'redshift, muObsMag, muErrMag, sample and bestFitMuMag must have one entry per supernova', expected: `${count} entries each`, found: lengths.join(', ') });
  }
  const widthPx = Math.round(options.widthPx ?? 640);
  const heightPx = Math.round(options.heightPx ?? 500);
  const prefix = options.idPrefix ?? 'hubble';
  const curve = input.modelCurve;
  const bestFit = input.bestFitMuMag ?? interpolateModelMu(input.redshift, curve);
  const residual = Float64Array.from({ length: count }, (_, index) => input.muObsMag[index] - bestFit[index]);
  const plotHeight = heightPx - MARGIN.top - MARGIN.bottom - PANEL_GAP_PX;
  const upper: PlotFrame = { leftPx: MARGIN.left, topPx: MARGIN.top, widthPx: widthPx - MARGIN.left - MARGIN.right, heightPx: plotHeight * UPPER_PANEL_SHARE, clipId: `${prefix}-clip-upper` };
  const lower: PlotFrame = { ...upper, topPx: upper.topPx + upper.heightPx + PANEL_GAP_PX, heightPx: plotHeight * (1 - UPPER_PANEL_SHARE), clipId: `${prefix}-clip-lower` };

  let zLow = Infinity;
  let zHigh = -Infinity;
  let muLow = Infinity;
  let muHigh = -Infinity;
  for (let index = 0; index < count; index++) {
    const z = input.redshift[index];
    if (z > 0 && Number.isFinite(z)) {
      zLow = Math.min(zLow, z);
      zHigh = Math.max(zHigh, z);
    }
    const error = Number.isFinite(input.muErrMag[index]) ? input.muErrMag[index] : 0;
    if (Number.isFinite(input.muObsMag[index])) {
      muLow = Math.min(muLow, input.muObsMag[index] - error);
      muHigh = Math.max(muHigh, input.muObsMag[index] + error);
    }
  }
  if (!(zHigh >= zLow)) [zLow, zHigh] = [curve.z[0], curve.z[curve.z.length - 1]];
  const zDomain: [number, number] = [zLow / REDSHIFT_PADDING_FACTOR, zHigh * REDSHIFT_PADDING_FACTOR];
  for (let index = 0; index < curve.z.length; index++) {
    if (curve.z[index] < zDomain[0] || curve.z[index] > zDomain[1]) continue;
    for (const value of [curve.low68[index], curve.high68[index], curve.median[index]]) {
      if (!Number.isFinite(value)) continue;
      muLow = Math.min(muLow, value);
      muHigh = Math.max(muHigh, value);
    }
  }
  const muPadding = MU_PADDING_FRACTION * (muHigh - muLow);
  const muDomain: [number, number] = [muLow - muPadding, muHigh + muPadding];
  const muTicks = niceTicks(muDomain[0], muDomain[1], 6);
  const residualRange = options.residualRangeMag ?? residualRangeMag(residual, input.muErrMag);
  const residualTicks = niceTicks(residualRange[0], residualRange[1], 5);
  const zTicks = logTicks(zDomain[0], zDomain[1]);
  const xUpper = createAxisScale('log', zDomain, [upper.leftPx, upper.leftPx + upper.widthPx]);
  const yUpper = createAxisScale('linear', muDomain, [upper.topPx + upper.heightPx, upper.topPx]);
  const yLower = createAxisScale('linear', [residualRange[0], residualRange[1]], [lower.topPx + lower.heightPx, lower.topPx]);

  const modelColor = FIGURE_STYLE.axisColor;
  const bandColor = '#9a9a9a';
  const median = curve.median;
  const zeros = new Float64Array(curve.z.length);
  const bandLow = Float64Array.from(curve.low68, (value, index) => value - median[index]);
  const bandHigh = Float64Array.from(curve.high68, (value, index) => value - median[index]);
  const upperLayers = [
    svgElement('path', { class: 'model-band', fill: bandColor, 'fill-opacity': 0.45, stroke: 'none', d: bandPathData(curve.z, curve.low68, curve.high68, xUpper, yUpper) }),
  ];
  const lowerLayers = [
    svgElement('path', { class: 'model-band', fill: bandColor, 'fill-opacity': 0.45, stroke: 'none', d: bandPathData(curve.z, bandLow, bandHigh, xUpper, yLower) }),
  ];
  const names = input.sample ? [...new Set(input.sample)] : ['supernovae'];
  const entries: LegendEntry[] = [];
  names.forEach((name, sampleIndex) => {
    const members = input.sample ? Array.from({ length: count }, (_, index) => index).filter((index) => input.sample?.[index] === name) : Array.from({ length: count }, (_, index) => index);
    const pick = (values: ArrayLike<number>) => Float64Array.from(members, (index) => values[index]);
    const z = pick(input.redshift);
    const color = seriesColor(sampleIndex);
    const draw = (layers: string[], y: Float64Array, scale: typeof yUpper) => {
      layers.push(svgElement('path', { class: 'error-bars', fill: 'none', stroke: color, 'stroke-opacity': ERROR_BAR_OPACITY, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: errorBarsPathData(z, y, pick(input.muErrMag), xUpper, scale) }));
      layers.push(svgElement('path', { class: 'markers', fill: color, stroke: 'none', 'data-sample': name, d: circleMarkersPathData(z, y, xUpper, scale, MARKER_RADIUS_PX) }));
    };
    draw(upperLayers, pick(input.muObsMag), yUpper);
    draw(lowerLayers, pick(residual), yLower);
    entries.push({ label: `${name} (${members.length})`, color, key: 'marker' });
  });
  upperLayers.push(svgElement('path', { class: 'model-curve', fill: 'none', stroke: modelColor, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: linePathData(curve.z, median, xUpper, yUpper) }));
  lowerLayers.push(svgElement('path', { class: 'model-curve', fill: 'none', stroke: modelColor, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: linePathData(curve.z, zeros, xUpper, yLower) }));
  entries.push({ label: options.modelLabel ?? 'best fit', color: modelColor, key: 'line' }, { label: '68% band', color: bandColor, key: 'fill', opacity: 0.45 });
  const bins = input.binnedResiduals ?? [];
  if (bins.length > 0) {
    const binZ = bins.map((bin) => bin.z);
    const binMean = bins.map((bin) => bin.mean);
    lowerLayers.push(svgElement('path', { class: 'binned-error-bars', fill: 'none', stroke: '#000000', 'stroke-width': 1.2, d: errorBarsPathData(binZ, binMean, bins.map((bin) => bin.err), xUpper, yLower) }));
    lowerLayers.push(svgElement('path', { class: 'binned-markers', fill: '#ffffff', stroke: '#000000', 'stroke-width': 1.2, d: circleMarkersPathData(binZ, binMean, xUpper, yLower, 3.2) }));
    entries.push({ label: 'binned mean', color: '#000000', key: 'marker' });
  }
  const zLabels = zTicks.major.map((value) => formatTickLabel(value));
  const body = [
    clippedGroup(upper, upperLayers),
    clippedGroup(lower, lowerLayers),
    drawAxes(upper, { scale: xUpper, ticks: zTicks.major, minorTicks: zTicks.minor }, { scale: yUpper, ticks: muTicks.values, tickLabels: muTicks.values.map((value) => formatTickLabel(value, muTicks.decimals)), label: '\\mu [mag]' }),
    drawAxes(lower, { scale: xUpper, ticks: zTicks.major, minorTicks: zTicks.minor, tickLabels: zLabels, label: 'redshift z' }, { scale: yLower, ticks: residualTicks.values, tickLabels: residualTicks.values.map((value) => formatTickLabel(value, residualTicks.decimals)), label: '\\Delta\\mu [mag]' }),
    drawLegend(entries, upper.leftPx + 10, upper.topPx + 8, { boxed: true }).svg,
  ];
  return svgDocument(widthPx, heightPx, `Hubble diagram of ${count} supernovae with model residuals`, [clipPathElement(upper), clipPathElement(lower)], body);
}
