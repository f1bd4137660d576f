import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import { drawAxes } from './drawAxes.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { formatTickLabel } from './formatTickLabel.js';
import { interpolateModelMu } from './hubbleResiduals.js';
import type { ModelMuCurve } from './hubbleResiduals.js';
import { linePathData } from './linePathData.js';
import { logTicks } from './logTicks.js';
import { niceTicks } from './niceTicks.js';
import { legendStrip } from './legendStrip.js';
import { LANTERN_COLORS } from './palette.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { residualRangeMag } from './residualRange.js';
import { robustDataRange } from './robustDataRange.js';
import { svgDocument } from './svgDocument.js';
import { svgElement } from './svgElement.js';
import { binnedMeanLayers, drawnSamples, sampleMarks, SUPERNOVA_MARKS } from './supernovaMarks.js';

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
  /** Sample (survey) code or name of each supernova; colours, marker shapes and legend entries follow it. */
  sample?: readonly string[];
  /** Best-fit model distance modulus at each supernova (mag); default: the curve median interpolated in ln z. */
  bestFitMuMag?: ArrayLike<number>;
  /** Model curve with its 68% band, on a z grid that covers the data. */
  modelCurve: ModelMuCurve;
  /** Binned mean residuals to overlay in the lower panel (ignored when the options say the data are already binned). */
  binnedResiduals?: readonly BinnedResidual[];
}

/** Optional settings of {@link hubbleFigure}. */
export interface HubbleFigureOptions {
  /** Figure width (px; default 640); ignored when `width` is given. */
  widthPx?: number;
  /** Figure height (px; default 500, or for a journal width 0.7 x the width for the panels plus the legend strip), legend strip included. */
  heightPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`. */
  width?: FigureWidth;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Legend label of the model curve (default 'best fit'). */
  modelLabel?: string;
  /** Names to show for sample codes, e.g. { '10': 'DES', '150': 'Foundation' }; codes without a name are shown as they are. */
  sampleNames?: Readonly<Record<string, string>>;
  /** The data are already binned (e.g. a compressed compilation): no binned means are drawn over them, markers are larger. */
  dataAreBinned?: boolean;
  /** Fixed [low, high] range of the residual axis (mag); default from residualRangeMag. */
  residualRangeMag?: readonly [number, number];
  /** Prefix of the clip-path ids (default 'hubble'). */
  idPrefix?: string;
}

const MARGIN = { left: 62, right: 12, top: 10 } as const;
/** Space below the lower panel for the redshift tick labels and title (px). */
const X_AXIS_SPACE_PX = 40;
/** Space under the legend strip (px). */
const BOTTOM_PAD_PX = 4;
/** Height of the two panels of a journal-width figure as a share of its width. */
const JOURNAL_PANEL_ASPECT = 0.7;
/** Share of the plotting height given to the upper (distance-modulus) panel. */
const UPPER_PANEL_SHARE = 0.68;
const PANEL_GAP_PX = 0;
/** Share of the residual half-range within which residual ticks are placed. */
const EDGE_FREE_SHARE = 0.9;
/** Redshift axis padding factor on each side (log axis). */
const REDSHIFT_PADDING_FACTOR = 1.12;
/** Quantiles of the distance moduli that set the upper panel's range (the extreme 0.5% on each side may be cut). */
const MU_RANGE_QUANTILES = [0.005, 0.995] as const;
/** Distance-modulus axis padding on each side, as a fraction of the span. */
const MU_PADDING_FRACTION = 0.05;

/**
 * A Hubble diagram in candela's house style (docs/style.md): the upper
 * panel shows the supernovae against redshift on a log axis, each sample in
 * its own colour (and, past six samples, marker shape), under its given
 * name; the model curve in ink with its 68% band in haze (colours no sample
 * takes); the lower panel shows residuals (data minus best fit) with the
 * band around zero and binned means as open circles. Both ranges come from
 * the data (robust quantiles that ignore strongly down-weighted points), not
 * from the largest error bar: bars beyond an axis are cut there and marked
 * with a small triangle, and the legend counts them. The legend sits in a
 * caption strip below the panels, so it hides no data.
 *
 * Cost: O(n log n) for n supernovae (range quantiles) plus O(n log m) for m model grid points.
 *
 * @param input supernovae (redshift, mag), samples, model curve (mag), binned residuals (mag)
 * @param options size (px or journal width), font face, model label, sample names, binned-data flag, residual range (mag), clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.length_mismatch` when per-supernova arrays differ in length; `figure.redshift_outside_model` (see interpolateModelMu)
 * @example hubbleFigure({ redshift, muObsMag, muErrMag, sample, modelCurve }, { width: 'single', sampleNames: { '10': 'DES' } })
 */
export function hubbleFigure(input: HubbleFigureInput, options: HubbleFigureOptions = {}): string {
  const count = input.redshift.length;
  const lengths = [input.muObsMag.length, input.muErrMag.length, input.sample?.length ?? count, input.bestFitMuMag?.length ?? count];
  if (lengths.some((length) => length !== count)) {
    throw new CandelaError({ code: 'figure.length_mismatch', message: 'redshift, muObsMag, muErrMag, sample and bestFitMuMag must have one entry per supernova', expected: `${count} entries each`, found: lengths.join(', ') });
  }
  const widthPx = figureWidthPx(options.width, options.widthPx ?? 640);
  const prefix = options.idPrefix ?? 'hubble';
  const curve = input.modelCurve;
  const bestFit = input.bestFitMuMag ?? interpolateModelMu(input.redshift, curve);
  const residual = Float64Array.from({ length: count }, (_, index) => input.muObsMag[index] - bestFit[index]);
  const binnedData = options.dataAreBinned === true;
  const markerRadius = (binnedData ? SUPERNOVA_MARKS.binnedDataMarkerRadiusPx : SUPERNOVA_MARKS.markerRadiusPx) * Math.sqrt(Math.min(1, widthPx / SUPERNOVA_MARKS.fullMarkerWidthPx));
  const plotWidth = widthPx - MARGIN.left - MARGIN.right;

  // Samples in order of first appearance, each with its members, colour, marker shape and shown name.
  const samples = drawnSamples(count, input.sample, options.sampleNames);

  let zLow = Infinity;
  let zHigh = -Infinity;
  for (let index = 0; index < count; index++) {
    const z = input.redshift[index];
    if (z > 0 && Number.isFinite(z)) {
      zLow = Math.min(zLow, z);
      zHigh = Math.max(zHigh, z);
    }
  }
  if (!(zHigh >= zLow)) [zLow, zHigh] = [curve.z[0], curve.z[curve.z.length - 1]];
  const zDomain: [number, number] = [zLow / REDSHIFT_PADDING_FACTOR, zHigh * REDSHIFT_PADDING_FACTOR];
  const muRange = robustDataRange(input.muObsMag, input.muErrMag, MU_RANGE_QUANTILES[0], MU_RANGE_QUANTILES[1]);
  let muLow = Number.isFinite(muRange.low) ? muRange.low : Infinity;
  let muHigh = Number.isFinite(muRange.high) ? muRange.high : -Infinity;
  for (let index = 0; index < curve.z.length; index++) {
    if (curve.z[index] < zDomain[0] || curve.z[index] > zDomain[1]) continue;
    for (const value of [curve.low68[index], curve.high68[index], curve.median[index]]) {
      if (!Number.isFinite(value)) continue;
      muLow = Math.min(muLow, value);
      muHigh = Math.max(muHigh, value);
    }
  }
  if (!(muHigh > muLow)) [muLow, muHigh] = Number.isFinite(muLow) ? [muLow - 1, muLow + 1] : [30, 46];
  const muPadding = MU_PADDING_FRACTION * (muHigh - muLow) + muRange.typicalError;
  const muDomain: [number, number] = [muLow - muPadding, muHigh + muPadding];
  const muTicks = niceTicks(muDomain[0], muDomain[1], 6);
  const residualRange = options.residualRangeMag ?? residualRangeMag(residual, input.muErrMag);
  // The panels touch: ticks keep clear of the shared edge, where labels of the two panels would meet.
  const residualTicks = niceTicks(residualRange[0] * EDGE_FREE_SHARE, residualRange[1] * EDGE_FREE_SHARE, 5);
  const zTicks = logTicks(zDomain[0], zDomain[1]);

  // The legend strip is measured first: the panels take the height left above it.
  const modelColor = LANTERN_COLORS.ink;
  const bandColor = FIGURE_STYLE.bandFill;
  const bins = binnedData ? [] : input.binnedResiduals ?? [];
  const entries: LegendEntry[] = samples.map((sample) => ({ label: `${sample.name} (${sample.members.length})`, color: sample.color, key: 'marker', shape: sample.shape }));
  entries.push({ label: options.modelLabel ?? 'best fit', color: modelColor, key: 'line' }, { label: 'model 68% band', color: bandColor, key: 'fill', opacity: 1 });
  if (bins.length > 0) entries.push({ label: 'binned mean residual', color: modelColor, key: 'open-marker' });
  const stripHeight = (cutLabel: string | undefined) => legendStrip(cutLabel ? [...entries, { label: cutLabel, color: modelColor, key: 'cut' }] : entries, MARGIN.left, 0, plotWidth).heightPx;
  const provisional = stripHeight('error bar beyond the axis (000)');
  // A journal-width figure keeps its panels' proportions and grows downwards to hold the legend.
  const heightPx = Math.round(options.heightPx ?? (options.width ? MARGIN.top + widthPx * JOURNAL_PANEL_ASPECT + X_AXIS_SPACE_PX + provisional + BOTTOM_PAD_PX : 500));
  const plotHeight = heightPx - MARGIN.top - PANEL_GAP_PX - X_AXIS_SPACE_PX - provisional - BOTTOM_PAD_PX;
  const upper: PlotFrame = { leftPx: MARGIN.left, topPx: MARGIN.top, widthPx: plotWidth, heightPx: plotHeight * UPPER_PANEL_SHARE, clipId: `${prefix}-clip-upper` };
  const lower: PlotFrame = { ...upper, topPx: upper.topPx + upper.heightPx + PANEL_GAP_PX, heightPx: plotHeight * (1 - UPPER_PANEL_SHARE), clipId: `${prefix}-clip-lower` };
  const xScale = createAxisScale('log', zDomain, [upper.leftPx, upper.leftPx + upper.widthPx]);
  const yUpper = createAxisScale('linear', muDomain, [upper.topPx + upper.heightPx, upper.topPx]);
  const yLower = createAxisScale('linear', [residualRange[0], residualRange[1]], [lower.topPx + lower.heightPx, lower.topPx]);

  const median = curve.median;
  const zeros = new Float64Array(curve.z.length);
  const bandLow = Float64Array.from(curve.low68, (value, index) => value - median[index]);
  const bandHigh = Float64Array.from(curve.high68, (value, index) => value - median[index]);
  const upperLayers = [svgElement('path', { class: 'model-band', fill: bandColor, stroke: 'none', d: bandPathData(curve.z, curve.low68, curve.high68, xScale, yUpper) })];
  const lowerLayers = [svgElement('path', { class: 'model-band', fill: bandColor, stroke: 'none', d: bandPathData(curve.z, bandLow, bandHigh, xScale, yLower) })];
  const upperMarks: string[] = [];
  const lowerMarks: string[] = [];
  const cutPoints = new Set<number>();
  for (const sample of samples) {
    const pick = (values: ArrayLike<number>) => Float64Array.from(sample.members, (index) => values[index]);
    const z = pick(input.redshift);
    const errors = pick(input.muErrMag);
    const draw = (layers: string[], marks: string[], y: Float64Array, scale: typeof yUpper) => {
      const drawn = sampleMarks(sample, z, y, errors, xScale, scale, markerRadius);
      layers.push(...drawn.layers);
      marks.push(...drawn.marks);
      sample.members.forEach((member, position) => {
        if (drawn.cut[position]) cutPoints.add(member);
      });
    };
    draw(upperLayers, upperMarks, pick(input.muObsMag), yUpper);
    draw(lowerLayers, lowerMarks, pick(residual), yLower);
  }
  upperLayers.push(svgElement('path', { class: 'model-curve', fill: 'none', stroke: modelColor, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: linePathData(curve.z, median, xScale, yUpper) }));
  lowerLayers.push(svgElement('path', { class: 'model-curve', fill: 'none', stroke: modelColor, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: linePathData(curve.z, zeros, xScale, yLower) }));
  if (bins.length > 0) lowerLayers.push(...binnedMeanLayers(bins, xScale, yLower));
  if (cutPoints.size > 0) entries.push({ label: `error bar beyond the axis (${cutPoints.size})`, color: modelColor, key: 'cut' });
  const zLabels = zTicks.major.map((value) => formatTickLabel(value));
  const stripTop = lower.topPx + lower.heightPx + X_AXIS_SPACE_PX;
  // Marks sit on the panel edges, drawn after (above) the clipped data so they stay whole.
  const body = [
    clippedGroup(upper, upperLayers),
    clippedGroup(lower, lowerLayers),
    drawAxes(upper, { scale: xScale, ticks: zTicks.major, minorTicks: zTicks.minor }, { scale: yUpper, ticks: muTicks.values, tickLabels: muTicks.values.map((value) => formatTickLabel(value, muTicks.decimals)), label: '\\mu [mag]' }),
    drawAxes(lower, { scale: xScale, ticks: zTicks.major, minorTicks: zTicks.minor, tickLabels: zLabels, label: 'redshift z' }, { scale: yLower, ticks: residualTicks.values, tickLabels: residualTicks.values.map((value) => formatTickLabel(value, residualTicks.decimals)), label: '\\Delta\\mu [mag]' }),
    ...upperMarks,
    ...lowerMarks,
    legendStrip(entries, MARGIN.left, stripTop, plotWidth).svg,
  ];
  return svgDocument(widthPx, heightPx, `Hubble diagram of ${count} supernovae with model residuals`, [clipPathElement(upper), clipPathElement(lower)], body, options.fontFace);
}
