import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import type { AxisScale } from './axisScale.js';
import type { ContourSet2D, MarginalDensity1D } from '../density/densityTypes.js';
import { drawAxes } from './drawAxes.js';
import { drawLegend } from './drawLegend.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { formatPixels } from './formatPixels.js';
import { formatTickLabel } from './formatTickLabel.js';
import { linePathData } from './linePathData.js';
import { multiPolygonPathData } from './multiPolygonPathData.js';
import { niceTicks } from './niceTicks.js';
import { mixWithWhite, seriesColor } from './palette.js';
import { parameterLabel } from './parameterLabel.js';
import type { ParameterSymbol } from './parameterLabel.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { svgDocument } from './svgDocument.js';
import { svgElement } from './svgElement.js';
import { parameterRanges } from './triangleRanges.js';

/** One posterior to draw: its legend label, colour and densities. */
export interface TriangleRun {
  label: string;
  /** `#rrggbb`; default: the next Okabe-Ito colour. */
  color?: string;
  marginals: readonly MarginalDensity1D[];
  contours: readonly ContourSet2D[];
}

/** Optional settings of {@link triangleFigure}. */
export interface TriangleOptions {
  /** Side of each square panel (px; default 132). */
  panelPx?: number;
  /** Fixed axis ranges by parameter name (parameter units). */
  ranges?: Readonly<Record<string, readonly [number, number]>>;
  /** Reference values drawn as dashed lines (e.g. the input cosmology of a mock), by parameter name. */
  reference?: Readonly<Record<string, number>>;
  /** Label of the reference lines in the legend (default 'reference'). */
  referenceLabel?: string;
  /** Parameter symbols replacing the output layer's parameterSymbols table. */
  symbols?: Readonly<Record<string, ParameterSymbol>>;
  /** Prefix of the clip-path ids (default 'triangle'); make it unique when several figures share a page. */
  idPrefix?: string;
}

const GAP_PX = 6;
const MARGIN = { left: 64, bottom: 50, top: 10, right: 14 } as const;
/** Headroom above the marginal's peak (peak drawn at 1 on a 0..1.08 axis). */
const MARGINAL_HEADROOM = 1.08;
/** Panels narrower than this get three ticks instead of four, so tick labels do not collide. */
const NARROW_PANEL_PX = 115;
/** Share of each panel side, at both ends, kept free of ticks so that labels of adjacent panels never touch. */
const TICK_EDGE_FRACTION = 0.07;
/** White share of the lightest (outermost) and darkest (innermost) credible-region fill. */
const OUTER_REGION_WHITE = 0.62;
const INNER_REGION_WHITE = 0.12;
/** Fill opacity of credible regions: low enough to see an earlier run through a later one. */
const REGION_FILL_OPACITY = 0.6;
/** Width of credible-region outlines (px). */
const OUTLINE_STROKE_PX = 0.8;

function regionWhiteShare(rank: number, count: number): number {
  return count <= 1 ? INNER_REGION_WHITE : OUTER_REGION_WHITE + (INNER_REGION_WHITE - OUTER_REGION_WHITE) * (rank / (count - 1));
}

function pairRegions(run: TriangleRun, xParameter: string, yParameter: string) {
  for (const contour of run.contours) {
    const { grid } = contour;
    if (grid.xParameter === xParameter && grid.yParameter === yParameter) return { contour, swapped: false };
    if (grid.xParameter === yParameter && grid.yParameter === xParameter) return { contour, swapped: true };
  }
  return undefined;
}

/**
 * A triangle ("corner") figure of one or more posteriors: the 1-D marginal
 * of each parameter on the diagonal (rescaled to peak 1), filled credible
 * regions of each pair below it (highest-density regions, e.g. 68% darker
 * and 95% lighter, one `<path class="region">` each, even-odd fill so holes
 * stay open), runs overlaid in Okabe-Ito colours with a legend in the empty
 * upper triangle, one shared axis range per parameter across runs and panels.
 *
 * Cost: O(total grid and outline points).
 *
 * @param runs posteriors to overlay (at least one); contours may be given for (x, y) or (y, x)
 * @param parameters parameter names in figure order (at least one)
 * @param options panel size (px), fixed ranges and reference values (parameter units), symbols, id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.no_runs` / `figure.no_parameters` for empty input, `figure.no_density` when a parameter has nothing to draw
 * @example triangleFigure([{ label: 'mock survey', marginals, contours }], ['omega_m', 'w0'])
 */
export function triangleFigure(runs: readonly TriangleRun[], parameters: readonly string[], options: TriangleOptions = {}): string {
  if (runs.length === 0 || parameters.length === 0) {
    throw new CandelaError({
      code: runs.length === 0 ? 'figure.no_runs' : 'figure.no_parameters',
      message: `a triangle figure needs at least one ${runs.length === 0 ? 'run' : 'parameter'}`,
    });
  }
  const panelPx = options.panelPx ?? 132;
  const prefix = options.idPrefix ?? 'triangle';
  const symbols = options.symbols;
  const count = parameters.length;
  const ranges = parameterRanges(runs, parameters, options.ranges);
  const colors = runs.map((run, index) => run.color ?? seriesColor(index));
  // Ticks keep clear of panel edges, where labels of neighbouring panels would collide.
  const ticks = ranges.map(([low, high]) => {
    const margin = TICK_EDGE_FRACTION * (high - low);
    return niceTicks(low + margin, high - margin, panelPx < NARROW_PANEL_PX ? 3 : 4);
  });
  const widthPx = Math.round(MARGIN.left + count * panelPx + (count - 1) * GAP_PX + MARGIN.right);
  const heightPx = Math.round(MARGIN.top + count * panelPx + (count - 1) * GAP_PX + MARGIN.bottom);
  const frameAt = (row: number, column: number): PlotFrame => ({
    leftPx: MARGIN.left + column * (panelPx + GAP_PX),
    topPx: MARGIN.top + row * (panelPx + GAP_PX),
    widthPx: panelPx,
    heightPx: panelPx,
    clipId: `${prefix}-clip-${row}-${column}`,
  });
  const axisOf = (index: number, scale: AxisScale, labelled: boolean) => ({
    scale,
    ticks: ticks[index].values,
    tickLabels: labelled ? ticks[index].values.map((value) => formatTickLabel(value, ticks[index].decimals)) : undefined,
    label: labelled ? parameterLabel(parameters[index], symbols) : undefined,
  });
  const definitions: string[] = [];
  const body: string[] = [];
  const reference = options.reference ?? {};
  const referenceStroke = { fill: 'none', stroke: FIGURE_STYLE.referenceColor, 'stroke-width': FIGURE_STYLE.referenceStrokePx, 'stroke-dasharray': FIGURE_STYLE.referenceDash, class: 'reference' };
  for (let row = 0; row < count; row++) {
    for (let column = 0; column <= row; column++) {
      const frame = frameAt(row, column);
      definitions.push(clipPathElement(frame));
      const xScale = createAxisScale('linear', ranges[column], [frame.leftPx, frame.leftPx + panelPx]);
      const layers: string[] = [];
      const referenceX = reference[parameters[column]];
      let yAxis;
      if (row === column) {
        const yScale = createAxisScale('linear', [0, MARGINAL_HEADROOM], [frame.topPx + panelPx, frame.topPx]);
        runs.forEach((run, runIndex) => {
          const marginal = run.marginals.find((candidate) => candidate.parameter === parameters[column]);
          if (!marginal) return;
          let peak = 0;
          for (const value of marginal.density) if (value > peak) peak = value;
          if (!(peak > 0 && Number.isFinite(peak))) return;
          const scaled = Float64Array.from(marginal.density, (value) => value / peak);
          layers.push(svgElement('path', { class: 'marginal', fill: 'none', stroke: colors[runIndex], 'stroke-width': FIGURE_STYLE.lineStrokePx, 'stroke-linejoin': 'round', d: linePathData(marginal.x, scaled, xScale, yScale) }));
        });
        if (Number.isFinite(referenceX)) layers.unshift(svgElement('path', { ...referenceStroke, d: `M${formatPixels(xScale.toPx(referenceX))} ${frame.topPx}v${panelPx}` }));
      } else {
        const yScale = createAxisScale('linear', ranges[row], [frame.topPx + panelPx, frame.topPx]);
        // Fills of every run first, then every outline on top, so an earlier run stays visible under a later one.
        const outlines: string[] = [];
        runs.forEach((run, runIndex) => {
          const found = pairRegions(run, parameters[column], parameters[row]);
          if (!found) return;
          const regions = [...found.contour.regions].sort((a, b) => b.mass - a.mass);
          regions.forEach((region, rank) => {
            const geometry = found.swapped
              ? { type: 'MultiPolygon' as const, coordinates: region.geometry.coordinates.map((polygon) => polygon.map((ring) => ring.map((point) => [point[1], point[0]]))) }
              : region.geometry;
            const data = multiPolygonPathData(geometry, xScale, yScale);
            if (data === '') return;
            const fill = mixWithWhite(colors[runIndex], regionWhiteShare(rank, regions.length));
            layers.push(svgElement('path', { class: 'region', 'data-mass': String(region.mass), fill, 'fill-opacity': REGION_FILL_OPACITY, 'fill-rule': 'evenodd', stroke: 'none', d: data }));
            outlines.push(svgElement('path', { class: 'region-outline', fill: 'none', stroke: colors[runIndex], 'stroke-width': OUTLINE_STROKE_PX, 'stroke-linejoin': 'round', d: data }));
          });
        });
        layers.push(...outlines);
        const referenceY = reference[parameters[row]];
        const lines = `${Number.isFinite(referenceX) ? `M${formatPixels(xScale.toPx(referenceX))} ${frame.topPx}v${panelPx}` : ''}${Number.isFinite(referenceY) ? `M${frame.leftPx} ${formatPixels(yScale.toPx(referenceY))}h${panelPx}` : ''}`;
        if (lines) layers.push(svgElement('path', { ...referenceStroke, d: lines }));
        yAxis = axisOf(row, yScale, column === 0);
      }
      body.push(svgElement('g', { class: row === column ? 'panel marginal-panel' : 'panel pair-panel' }, [
        clippedGroup(frame, layers),
        drawAxes(frame, axisOf(column, xScale, row === count - 1), yAxis),
      ]));
    }
  }
  const entries: LegendEntry[] = runs.map((run, index) => ({ label: run.label, color: colors[index], key: 'fill' }));
  if (Object.keys(reference).some((name) => parameters.includes(name))) {
    entries.push({ label: options.referenceLabel ?? 'reference', color: FIGURE_STYLE.referenceColor, key: 'dashed' });
  }
  // With one parameter there is no empty upper triangle: the legend goes to the right of the panel and the figure widens to hold it.
  const legendX = count >= 2 ? frameAt(0, 1).leftPx + GAP_PX : MARGIN.left + panelPx + GAP_PX;
  const legend = drawLegend(entries, legendX, MARGIN.top, { boxed: count < 2 });
  body.push(legend.svg);
  const figureWidthPx = count >= 2 ? widthPx : Math.round(Math.max(widthPx, legendX + legend.widthPx + MARGIN.right));
  return svgDocument(figureWidthPx, heightPx, `Posterior triangle figure of ${parameters.join(', ')}`, definitions, body);
}
