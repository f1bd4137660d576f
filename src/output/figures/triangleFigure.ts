import { CandelaError } from '../../errors.js';
import { pruneContourIslands, DEFAULT_ISLAND_MASS_FRACTION } from '../density/pruneContourIslands.js';
import { createAxisScale } from './axisScale.js';
import type { AxisScale } from './axisScale.js';
import { bandPathData } from './bandPathData.js';
import type { ContourSet2D, MarginalDensity1D } from '../density/densityTypes.js';
import { drawAxes } from './drawAxes.js';
import type { AxisSpec } from './drawAxes.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { formatPixels } from './formatPixels.js';
import { formatTickLabel } from './formatTickLabel.js';
import { hatchAngleDeg, hatchPattern } from './hatchPattern.js';
import { legendStrip } from './legendStrip.js';
import { linePathData } from './linePathData.js';
import { truthMarkerPathData } from './markerPathData.js';
import { multiPolygonPathData } from './multiPolygonPathData.js';
import { niceTicks } from './niceTicks.js';
import { seriesColor } from './palette.js';
import { parameterLabel } from './parameterLabel.js';
import type { ParameterSymbol } from './parameterLabel.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { svgDocument } from './svgDocument.js';
import { svgElement } from './svgElement.js';
import { parameterRanges } from './triangleRanges.js';
import { estimateTextWidthPx } from './richTextSvg.js';

/** One posterior to draw: its legend label, colour and densities. */
export interface TriangleRun {
  label: string;
  /** `#rrggbb`; default: the next colour of candela's palette. */
  color?: string;
  marginals: readonly MarginalDensity1D[];
  contours: readonly ContourSet2D[];
}

/** Optional settings of {@link triangleFigure}. */
export interface TriangleOptions {
  /** Side of each square panel (px; default 132); ignored when `width` is given. */
  panelPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`; panels shrink or grow to fit. */
  width?: FigureWidth;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Fixed axis ranges by parameter name (parameter units). */
  ranges?: Readonly<Record<string, readonly [number, number]>>;
  /** True values (e.g. the input cosmology of a mock, from its truth file), by parameter name: a cross in each pair panel, a line on each marginal. */
  reference?: Readonly<Record<string, number>>;
  /** Legend label of the true values (default 'truth'). */
  referenceLabel?: string;
  /** Draw the flat-universe line (Omega_m + Omega_DE = 1, or Omega_k = 0) on the panels of a curved model (default true). */
  flatUniverseLine?: boolean;
  /** Separate pieces of a credible region holding less than this share of its mass are not drawn (default 0.02; 0 draws every piece). */
  islandMassFraction?: number;
  /** Parameter symbols replacing the output layer's parameterSymbols table. */
  symbols?: Readonly<Record<string, ParameterSymbol>>;
  /** Prefix of the clip-path ids (default 'triangle'); make it unique when several figures share a page. */
  idPrefix?: string;
}

const GAP_PX = 7;
const MARGIN = { left: 64, bottom: 46, top: 10, right: 30 } as const;
/** Space under the legend strip (px). */
const BOTTOM_PAD_PX = 4;
/** Headroom above the marginal's peak (peak drawn at 1 on a 0..1.1 axis). */
const MARGINAL_HEADROOM = 1.1;
/** Ticks of the relative-density axis of the marginals. */
const MARGINAL_TICKS = [0, 0.5, 1];
/** Fill opacity of the light area under a marginal. */
const MARGINAL_AREA_OPACITY = 0.13;
/** Panels narrower than this get three ticks instead of four, so tick labels do not collide. */
const NARROW_PANEL_PX = 115;
/** Share of each panel side, at both ends, kept free of ticks so that labels of adjacent panels never touch. */
const TICK_EDGE_FRACTION = 0.07;
/** Least free space between two tick labels (px), and the share of the panel width the labels and spaces may fill. */
const TICK_LABEL_SPACE_PX = 6;
const TICK_LABEL_ROOM_SHARE = 0.85;
/** Outline widths of the outermost and innermost credible region (px); levels between are graded. */
const OUTER_OUTLINE_PX = 0.8;
const INNER_OUTLINE_PX = 1.8;
/** Distance between hatch lines inside the innermost region (px). */
const HATCH_SPACING_PX = 4;

function outlineWidth(rank: number, count: number): number {
  return count <= 1 ? INNER_OUTLINE_PX : OUTER_OUTLINE_PX + (INNER_OUTLINE_PX - OUTER_OUTLINE_PX) * (rank / (count - 1));
}

function pairRegions(run: TriangleRun, xParameter: string, yParameter: string) {
  for (const contour of run.contours) {
    const { grid } = contour;
    if (grid.xParameter === xParameter && grid.yParameter === yParameter) return { contour, swapped: false };
    if (grid.xParameter === yParameter && grid.yParameter === xParameter) return { contour, swapped: true };
  }
  return undefined;
}

/** The flat-universe line on a panel, as path data (px), or '' when the panel's axes do not carry it. */
function flatLinePathData(xName: string, yName: string, xScale: AxisScale, yScale: AxisScale | undefined): string {
  const [xLow, xHigh] = xScale.domain;
  if (yScale && ((xName === 'omega_m' && yName === 'omega_de') || (xName === 'omega_de' && yName === 'omega_m'))) {
    return linePathData([xLow, xHigh], [1 - xLow, 1 - xHigh], xScale, yScale);
  }
  const parts: string[] = [];
  const top = yScale ? Math.min(...yScale.rangePx) : 0;
  const height = yScale ? Math.abs(yScale.rangePx[0] - yScale.rangePx[1]) : 0;
  if (xName === 'omega_k' && yScale) parts.push(`M${formatPixels(xScale.toPx(0))} ${formatPixels(top)}v${formatPixels(height)}`);
  if (yName === 'omega_k' && yScale) parts.push(`M${formatPixels(Math.min(...xScale.rangePx))} ${formatPixels(yScale.toPx(0))}H${formatPixels(Math.max(...xScale.rangePx))}`);
  return parts.join('');
}

/**
 * A triangle figure of one or more posteriors in candela's house style
 * (docs/style.md): framed panels with ticks inside; on the diagonal each
 * parameter's 1-D marginal as a line over a light area, with a relative
 * density axis (peak = 1) on the right; below it, for each pair, the
 * credible regions as outlines of graded weight (the outermost, e.g. 95%,
 * thin; the innermost, e.g. 68%, heavy and lightly hatched, one hatching
 * direction per run) so overlaid runs stay readable; stray islands holding
 * a tiny share of a region's mass are left out (pruneContourIslands). True
 * values of a mock are marked with a cross, a curved model's panels carry
 * the flat-universe line, and the legend sits in a caption strip below.
 *
 * Cost: O(total grid and outline points).
 *
 * @param runs posteriors to overlay (at least one); contours may be given for (x, y) or (y, x)
 * @param parameters parameter names in figure order (at least one); pass a subset to draw only those
 * @param options size (px or journal width), font face, ranges and true values (parameter units), flat line, island share, symbols, id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.no_runs` / `figure.no_parameters` for empty input, `figure.no_density` when a parameter has nothing to draw
 * @example triangleFigure([{ label: 'mock survey', marginals, contours }], ['omega_m', 'w0'], { width: 'single', reference: { omega_m: 0.3, w0: -1 } })
 */
export function triangleFigure(runs: readonly TriangleRun[], parameters: readonly string[], options: TriangleOptions = {}): string {
  if (runs.length === 0 || parameters.length === 0) {
    throw new CandelaError({
      code: runs.length === 0 ? 'figure.no_runs' : 'figure.no_parameters',
      message: `a triangle figure needs at least one ${runs.length === 0 ? 'run' : 'parameter'}`,
    });
  }
  const count = parameters.length;
  const requestedWidth = figureWidthPx(options.width, Number.NaN);
  const panelPx = Number.isFinite(requestedWidth)
    ? Math.max(24, (requestedWidth - MARGIN.left - MARGIN.right - (count - 1) * GAP_PX) / count)
    : options.panelPx ?? 132;
  const prefix = options.idPrefix ?? 'triangle';
  const symbols = options.symbols;
  const islandShare = options.islandMassFraction ?? DEFAULT_ISLAND_MASS_FRACTION;
  const ranges = parameterRanges(runs, parameters, options.ranges);
  const colors = runs.map((run, index) => run.color ?? seriesColor(index));
  // Ticks keep clear of panel edges, where labels of neighbouring panels would collide.
  // Fewer ticks when their labels would not fit side by side under a panel (e.g. -19.40 -19.35 -19.30).
  const ticks = ranges.map(([low, high]) => {
    const margin = TICK_EDGE_FRACTION * (high - low);
    let set = niceTicks(low + margin, high - margin, panelPx < NARROW_PANEL_PX ? 3 : 4);
    for (let target = set.values.length - 1; target >= 2; target--) {
      const labelsPx = set.values.reduce((total, value) => total + estimateTextWidthPx(formatTickLabel(value, set.decimals), FIGURE_STYLE.tickFontPx) + TICK_LABEL_SPACE_PX, 0);
      if (labelsPx <= TICK_LABEL_ROOM_SHARE * panelPx) break;
      set = niceTicks(low + margin, high - margin, target);
    }
    return set;
  });
  const widthPx = Number.isFinite(requestedWidth) ? requestedWidth : MARGIN.left + count * panelPx + (count - 1) * GAP_PX + MARGIN.right;
  const plotBottom = MARGIN.top + count * panelPx + (count - 1) * GAP_PX;
  const frameAt = (row: number, column: number): PlotFrame => ({
    leftPx: MARGIN.left + column * (panelPx + GAP_PX),
    topPx: MARGIN.top + row * (panelPx + GAP_PX),
    widthPx: panelPx,
    heightPx: panelPx,
    clipId: `${prefix}-clip-${row}-${column}`,
  });
  const axisOf = (index: number, scale: AxisScale, labelled: boolean): AxisSpec => ({
    scale,
    ticks: ticks[index].values,
    tickLabels: labelled ? ticks[index].values.map((value) => formatTickLabel(value, ticks[index].decimals)) : undefined,
    label: labelled ? parameterLabel(parameters[index], symbols) : undefined,
  });
  const definitions: string[] = [];
  const body: string[] = [];
  const reference = options.reference ?? {};
  const truthStroke = { fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.referenceDash, class: 'truth-line' };
  const flatStroke = { fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.constraintDash, class: 'flat-universe' };
  let flatDrawn = false;
  let truthDrawn = false;
  for (let row = 0; row < count; row++) {
    for (let column = 0; column <= row; column++) {
      const frame = frameAt(row, column);
      definitions.push(clipPathElement(frame));
      const xScale = createAxisScale('linear', ranges[column], [frame.leftPx, frame.leftPx + panelPx]);
      const layers: string[] = [];
      const truthX = reference[parameters[column]];
      const onBottomRow = row === count - 1;
      if (row === column) {
        const yScale = createAxisScale('linear', [0, MARGINAL_HEADROOM], [frame.topPx + panelPx, frame.topPx]);
        if (options.flatUniverseLine !== false && parameters[column] === 'omega_k') {
          layers.push(svgElement('path', { ...flatStroke, d: `M${formatPixels(xScale.toPx(0))} ${formatPixels(frame.topPx)}v${formatPixels(panelPx)}` }));
          flatDrawn = true;
        }
        runs.forEach((run, runIndex) => {
          const marginal = run.marginals.find((candidate) => candidate.parameter === parameters[column]);
          if (!marginal) return;
          let peak = 0;
          for (const value of marginal.density) if (value > peak) peak = value;
          if (!(peak > 0 && Number.isFinite(peak))) return;
          const scaled = Float64Array.from(marginal.density, (value) => value / peak);
          layers.push(svgElement('path', { class: 'marginal-area', fill: colors[runIndex], 'fill-opacity': MARGINAL_AREA_OPACITY, stroke: 'none', d: bandPathData(marginal.x, new Float64Array(marginal.x.length), scaled, xScale, yScale) }));
          layers.push(svgElement('path', { class: 'marginal', fill: 'none', stroke: colors[runIndex], 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', d: linePathData(marginal.x, scaled, xScale, yScale) }));
        });
        if (Number.isFinite(truthX)) {
          layers.push(svgElement('path', { ...truthStroke, d: `M${formatPixels(xScale.toPx(truthX))} ${formatPixels(frame.topPx)}v${formatPixels(panelPx)}` }));
          truthDrawn = true;
        }
        const right: AxisSpec = { scale: yScale, ticks: MARGINAL_TICKS, tickLabels: MARGINAL_TICKS.map((value) => formatTickLabel(value, value === 0.5 ? 1 : 0)) };
        body.push(svgElement('g', { class: 'panel marginal-panel' }, [
          clippedGroup(frame, layers),
          drawAxes(frame, axisOf(column, xScale, onBottomRow), undefined, { right }),
        ]));
        continue;
      }
      const yScale = createAxisScale('linear', ranges[row], [frame.topPx + panelPx, frame.topPx]);
      if (options.flatUniverseLine !== false) {
        const flat = flatLinePathData(parameters[column], parameters[row], xScale, yScale);
        if (flat) {
          layers.push(svgElement('path', { ...flatStroke, d: flat }));
          flatDrawn = true;
        }
      }
      runs.forEach((run, runIndex) => {
        const found = pairRegions(run, parameters[column], parameters[row]);
        if (!found) return;
        const contour = islandShare > 0 ? pruneContourIslands(found.contour, islandShare) : found.contour;
        const regions = [...contour.regions].sort((a, b) => b.mass - a.mass);
        regions.forEach((region, rank) => {
          const geometry = found.swapped
            ? { type: 'MultiPolygon' as const, coordinates: region.geometry.coordinates.map((polygon) => polygon.map((ring) => ring.map((point) => [point[1], point[0]]))) }
            : region.geometry;
          const data = multiPolygonPathData(geometry, xScale, yScale);
          if (data === '') return;
          if (rank === regions.length - 1) {
            const hatch = hatchPattern(data, frame, `${prefix}-hatch-${row}-${column}-${runIndex}`, runIndex, colors[runIndex], HATCH_SPACING_PX);
            definitions.push(hatch.definition);
            layers.push(hatch.svg);
          }
          layers.push(svgElement('path', { class: 'region', 'data-mass': String(region.mass), fill: 'none', 'fill-rule': 'evenodd', stroke: colors[runIndex], 'stroke-width': outlineWidth(rank, regions.length), 'stroke-linejoin': 'round', d: data }));
        });
      });
      const truthY = reference[parameters[row]];
      if (Number.isFinite(truthX) && Number.isFinite(truthY)) {
        layers.push(svgElement('path', { class: 'truth', fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': 1.3, d: truthMarkerPathData(xScale.toPx(truthX), yScale.toPx(truthY)) }));
        truthDrawn = true;
      } else if (Number.isFinite(truthX) || Number.isFinite(truthY)) {
        const d = Number.isFinite(truthX) ? `M${formatPixels(xScale.toPx(truthX))} ${formatPixels(frame.topPx)}v${formatPixels(panelPx)}` : `M${formatPixels(frame.leftPx)} ${formatPixels(yScale.toPx(truthY))}h${formatPixels(panelPx)}`;
        layers.push(svgElement('path', { ...truthStroke, d }));
        truthDrawn = true;
      }
      body.push(svgElement('g', { class: 'panel pair-panel' }, [
        clippedGroup(frame, layers),
        drawAxes(frame, axisOf(column, xScale, onBottomRow), axisOf(row, yScale, column === 0)),
      ]));
    }
  }
  const entries: LegendEntry[] = runs.map((run, index) => ({ label: count >= 2 ? `${run.label} (68% hatched, 95% outline)` : run.label, color: colors[index], key: count >= 2 ? 'region' : 'line', hatchAngleDeg: hatchAngleDeg(index) }));
  if (truthDrawn) entries.push({ label: options.referenceLabel ?? 'truth', color: FIGURE_STYLE.referenceColor, key: count >= 2 && parameters.filter((name) => Number.isFinite(reference[name])).length >= 2 ? 'truth' : 'dashed' });
  if (flatDrawn) entries.push({ label: 'flat universe (\u03a9k = 0)', color: FIGURE_STYLE.referenceColor, key: 'dotted' });
  const stripTop = plotBottom + MARGIN.bottom;
  const strip = legendStrip(entries, MARGIN.left, stripTop, widthPx - MARGIN.left - MARGIN.right);
  body.push(strip.svg);
  const heightPx = Math.round(stripTop + strip.heightPx + BOTTOM_PAD_PX);
  return svgDocument(Math.round(widthPx * 100) / 100, heightPx, `Posterior triangle figure of ${parameters.join(', ')}`, definitions, body, options.fontFace);
}
