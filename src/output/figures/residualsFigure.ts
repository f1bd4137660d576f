import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { framedLineDocument, lineFigureFrame, LINE_FIGURE_MARGIN } from './framedLineDocument.js';
import type { BinnedResidual } from './hubbleFigure.js';
import { legendStrip } from './legendStrip.js';
import { linePathData } from './linePathData.js';
import { LANTERN_COLORS } from './palette.js';
import { residualRangeMag } from './residualRange.js';
import { svgElement } from './svgElement.js';
import { binnedMeanLayers, drawnSamples, sampleMarks, SUPERNOVA_MARKS } from './supernovaMarks.js';

/** Hubble residuals (data minus best fit) of a sample of supernovae. */
export interface ResidualsFigureInput {
  /** Redshift of each supernova (> 0; others are not drawn). */
  redshift: ArrayLike<number>;
  /** Residual mu_obs - mu_model of each supernova (mag). */
  residualMag: ArrayLike<number>;
  /** Its one-sigma error (mag). */
  errorMag: ArrayLike<number>;
  /** Sample (survey) code of each supernova; colours, marker shapes and legend entries follow it. */
  sample?: readonly string[];
  /** Binned mean residuals (mag), drawn as open ink circles with their errors. */
  binnedResiduals?: readonly BinnedResidual[];
  /** The model's 68% band relative to its best fit (mag), on an increasing positive z grid. */
  modelBand?: { z: ArrayLike<number>; low68: ArrayLike<number>; high68: ArrayLike<number> };
}

/** Optional settings of {@link residualsFigure}. */
export interface ResidualsFigureOptions {
  /** Figure width (px; default 640); ignored when `width` is given. */
  widthPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`. */
  width?: FigureWidth;
  /** Figure height (px; default 340), legend strip included. */
  heightPx?: number;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Names to show for sample codes; codes without a name are shown as they are. */
  sampleNames?: Readonly<Record<string, string>>;
  /** Legend label of the zero line (default 'best fit'). */
  modelLabel?: string;
  /** The data are already binned (a compressed compilation): larger markers, and no binned means should be passed. */
  dataAreBinned?: boolean;
  /** Prefix of the clip-path id (default 'residuals'). */
  idPrefix?: string;
}

/** Redshift axis padding factor on each side (log axis). */
const REDSHIFT_PADDING_FACTOR = 1.12;

/**
 * Hubble residuals against redshift as a figure of its own, in candela's
 * house style (docs/style.md): one framed panel with a log redshift axis,
 * each sample's supernovae as filled markers in its colour with error bars,
 * the best fit as an ink line at zero inside the model's 68% band in haze,
 * binned mean residuals as open ink circles with ink error bars. The range
 * comes from the data (residualRangeMag); bars beyond it are cut at the axis,
 * marked by a small triangle and counted in the legend strip below the panel.
 *
 * Cost: O(n log n) for n supernovae (the range quantile).
 *
 * @param input redshifts, residuals and errors (mag), samples, binned means (mag), model band (mag)
 * @param options size (px or journal width), font face, sample names, model label, binned-data flag, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.length_mismatch` when per-supernova arrays differ in length; `figure.bad_range` without a positive redshift
 * @example residualsFigure({ redshift: z, residualMag: r, errorMag: e, binnedResiduals: bins }).startsWith('<svg') // true
 */
export function residualsFigure(input: ResidualsFigureInput, options: ResidualsFigureOptions = {}): string {
  const count = input.redshift.length;
  const lengths = [input.residualMag.length, input.errorMag.length, input.sample?.length ?? count];
  if (lengths.some((length) => length !== count)) {
    throw new CandelaError({ code: 'figure.length_mismatch', message: 'redshift, residualMag, errorMag and sample must have one entry per supernova', expected: `${count} entries each`, found: lengths.join(', ') });
  }
  let zLow = Infinity;
  let zHigh = -Infinity;
  for (let index = 0; index < count; index++) {
    const z = input.redshift[index];
    if (z > 0 && Number.isFinite(z)) [zLow, zHigh] = [Math.min(zLow, z), Math.max(zHigh, z)];
  }
  if (!(zHigh >= zLow)) throw new CandelaError({ code: 'figure.bad_range', message: 'a residual figure needs at least one supernova with a positive redshift' });
  const widthPx = figureWidthPx(options.width, options.widthPx ?? 640);
  const heightPx = Math.round(options.heightPx ?? 340);
  const markerRadius = (options.dataAreBinned ? SUPERNOVA_MARKS.binnedDataMarkerRadiusPx : SUPERNOVA_MARKS.markerRadiusPx) * Math.sqrt(Math.min(1, widthPx / SUPERNOVA_MARKS.fullMarkerWidthPx));
  const samples = drawnSamples(count, input.sample, options.sampleNames);
  const ink = LANTERN_COLORS.ink;
  const bins = input.binnedResiduals ?? [];
  const entries: LegendEntry[] = samples.map((sample) => ({ label: `${sample.name} (${sample.members.length})`, color: sample.color, key: 'marker', shape: sample.shape }));
  entries.push({ label: options.modelLabel ?? 'best fit', color: ink, key: 'line' });
  if (input.modelBand) entries.push({ label: 'model 68% band', color: FIGURE_STYLE.bandFill, key: 'fill', opacity: 1 });
  if (bins.length > 0) entries.push({ label: 'binned mean residual', color: ink, key: 'open-marker' });

  const xDomain: [number, number] = [zLow / REDSHIFT_PADDING_FACTOR, zHigh * REDSHIFT_PADDING_FACTOR];
  const yDomain = residualRangeMag(input.residualMag, input.errorMag);
  // The strip is measured with the cut-bar entry it may need, so the panel does not change size when it appears.
  const provisional = lineFigureFrame(widthPx, heightPx, [...entries, { label: 'error bar beyond the axis (000)', color: ink, key: 'cut' }], `${options.idPrefix ?? 'residuals'}-clip`);
  const frame = provisional.frame;
  const xScale = createAxisScale('log', xDomain, [frame.leftPx, frame.leftPx + frame.widthPx]);
  const yScale = createAxisScale('linear', yDomain, [frame.topPx + frame.heightPx, frame.topPx]);

  const layers: string[] = [];
  const marks: string[] = [];
  if (input.modelBand) layers.push(svgElement('path', { class: 'model-band', fill: FIGURE_STYLE.bandFill, stroke: 'none', d: bandPathData(input.modelBand.z, input.modelBand.low68, input.modelBand.high68, xScale, yScale) }));
  let cutCount = 0;
  for (const sample of samples) {
    const pick = (values: ArrayLike<number>) => Float64Array.from(sample.members, (index) => values[index]);
    const z = pick(input.redshift);
    const y = pick(input.residualMag);
    const drawn = sampleMarks(sample, z, y, pick(input.errorMag), xScale, yScale, markerRadius);
    layers.push(...drawn.layers);
    marks.push(...drawn.marks);
    cutCount += drawn.cut.reduce((sum, flag) => sum + flag, 0);
  }
  layers.push(svgElement('path', { class: 'model-curve', fill: 'none', stroke: ink, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: linePathData(xDomain, [0, 0], xScale, yScale) }));
  if (bins.length > 0) layers.push(...binnedMeanLayers(bins, xScale, yScale));
  const finalEntries = cutCount > 0 ? [...entries, { label: `error bar beyond the axis (${cutCount})`, color: ink, key: 'cut' as const }] : entries;
  const legendSvg = legendStrip(finalEntries, frame.leftPx, frame.topPx + frame.heightPx + LINE_FIGURE_MARGIN.bottom, frame.widthPx).svg;
  // Cut marks sit on the panel edge, drawn unclipped above the data (with the legend) so they stay whole.
  return framedLineDocument({
    widthPx, heightPx, frame, layers, legendSvg: marks.join('') + legendSvg, fontFace: options.fontFace,
    xKind: 'log', xDomain, yDomain, xScale, yScale, xLabel: 'redshift z', yLabel: '\\Delta\\mu [mag]',
  });
}
