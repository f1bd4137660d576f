import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { figureWidthPx } from './figureWidth.js';
import type { FigureWidth } from './figureWidth.js';
import { legendStrip } from './legendStrip.js';
import { seriesColor } from './palette.js';
import { parameterLabel } from './parameterLabel.js';
import type { ParameterSymbol } from './parameterLabel.js';
import { clipPathElement } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { svgDocument } from './svgDocument.js';
import { drawTracePanel, traceStepRange } from './tracePanel.js';
import type { TraceEnsemble } from './tracePanel.js';

/** The traces of one parameter for a stacked trace figure. */
export interface TraceParameterPanel {
  parameter: string;
  ensembles: readonly TraceEnsemble[];
}

/** Optional settings of {@link traceFigure} and {@link traceStackFigure}. */
export interface TraceFigureOptions {
  /** Figure width (px; default 640); ignored when `width` is given. */
  widthPx?: number;
  /** Figure width: one journal column (3.4 in), both columns (7 in) or `{ inches }`. */
  width?: FigureWidth;
  /** Text face: `sans` (default) or `serif`. */
  fontFace?: FontFace;
  /** Height of each panel (px; default 150 for one panel, 96 when stacked). */
  panelHeightPx?: number;
  /** Parameter symbols replacing the output layer's parameterSymbols table. */
  symbols?: Readonly<Record<string, ParameterSymbol>>;
  /** Prefix of the clip-path ids (default 'trace'). */
  idPrefix?: string;
}

const MARGIN = { left: 72, right: 16, top: 10, bottom: 40 } as const;
/** Space under the legend strip (px). */
const BOTTOM_PAD_PX = 4;
const STACK_GAP_PX = 8;

/**
 * Trace plots of several parameters stacked on a shared step axis (labelled
 * on the bottom panel only), burn-in shaded, individual walkers as thin
 * lines in their ensemble's colour (see sampleWalkerTraces), stuck walkers
 * as dot-dash ink lines, and the legend in a caption strip below. Use it to
 * see at a glance whether every walker has forgotten its start and mixes
 * (compare the diagnostics of Vehtari et al. 2021 and the autocorrelation
 * times of Goodman & Weare 2010).
 *
 * Cost: O(total series length); each line is reduced to about one point per pixel of width.
 *
 * @param panels one entry per parameter, each with its ensembles' traces (parameter units)
 * @param burnInStep last burn-in step (steps)
 * @param options width (px or journal width), font face, panel height (px), symbols, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.no_parameters` when panels is empty
 * @example traceStackFigure([{ parameter: 'omega_m', ensembles }, { parameter: 'w0', ensembles: other }], 400)
 */
export function traceStackFigure(panels: readonly TraceParameterPanel[], burnInStep: number, options: TraceFigureOptions = {}): string {
  if (panels.length === 0) throw new CandelaError({ code: 'figure.no_parameters', message: 'a trace figure needs at least one parameter' });
  const widthPx = figureWidthPx(options.width, options.widthPx ?? 640);
  const panelHeightPx = options.panelHeightPx ?? (panels.length === 1 ? 150 : 96);
  const prefix = options.idPrefix ?? 'trace';
  const symbols = options.symbols;
  // Ensembles are matched across panels by position; the legend follows the panel with the most.
  const widest = panels.reduce((best, panel) => (panel.ensembles.length > best.ensembles.length ? panel : best), panels[0]);
  const entries: LegendEntry[] = widest.ensembles.map((ensemble, index) => ({
    label: ensemble.series.length > 1 ? `${ensemble.label} (${ensemble.series.length} walkers)` : ensemble.label,
    color: ensemble.color ?? seriesColor(index),
    key: 'line',
  }));
  if (panels.some((panel) => panel.ensembles.some((ensemble) => (ensemble.stuck ?? []).length > 0))) {
    entries.push({ label: 'stuck walker', color: FIGURE_STYLE.axisColor, key: 'dashed' });
  }
  const top = MARGIN.top;
  const plotBottom = top + panels.length * panelHeightPx + (panels.length - 1) * STACK_GAP_PX;
  const strip = legendStrip(entries, MARGIN.left, plotBottom + MARGIN.bottom, widthPx - MARGIN.left - MARGIN.right);
  const heightPx = Math.round(plotBottom + MARGIN.bottom + strip.heightPx + BOTTOM_PAD_PX);
  const allEnsembles = panels.flatMap((panel) => panel.ensembles);
  const stepScale = createAxisScale('linear', traceStepRange(allEnsembles), [MARGIN.left, widthPx - MARGIN.right]);
  const definitions: string[] = [];
  const body: string[] = [];
  panels.forEach((panel, index) => {
    const frame: PlotFrame = { leftPx: MARGIN.left, topPx: top + index * (panelHeightPx + STACK_GAP_PX), widthPx: widthPx - MARGIN.left - MARGIN.right, heightPx: panelHeightPx, clipId: `${prefix}-clip-${index}` };
    definitions.push(clipPathElement(frame));
    body.push(drawTracePanel(frame, panel.ensembles, stepScale, burnInStep, parameterLabel(panel.parameter, symbols), index === panels.length - 1));
  });
  body.push(strip.svg);
  return svgDocument(widthPx, heightPx, `Trace plots of ${panels.map((panel) => panel.parameter).join(', ')}`, definitions, body, options.fontFace);
}

/**
 * Trace plot of one parameter: each ensemble's walkers (or walker mean)
 * against step, burn-in shaded with a dashed line at burnInStep.
 *
 * Cost: O(total series length).
 *
 * @param parameter parameter name, e.g. `omega_m`
 * @param ensembles the traces of each ensemble (parameter units)
 * @param burnInStep last burn-in step (steps)
 * @param options width and panel height (px), symbols, clip id prefix
 * @returns the SVG document
 * @example traceFigure('w0', [{ label: 'ensemble 1', series: [walker0, walker1] }], 300)
 */
export function traceFigure(parameter: string, ensembles: readonly TraceEnsemble[], burnInStep: number, options: TraceFigureOptions = {}): string {
  return traceStackFigure([{ parameter, ensembles }], burnInStep, options);
}
