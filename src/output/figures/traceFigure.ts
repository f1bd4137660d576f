import { CandelaError } from '../../errors.js';
import { createAxisScale } from './axisScale.js';
import { drawLegend } from './drawLegend.js';
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
  /** Figure width (px; default 640). */
  widthPx?: number;
  /** Height of each panel (px; default 150 for one panel, 96 when stacked). */
  panelHeightPx?: number;
  /** Parameter symbols replacing the output layer's parameterSymbols table. */
  symbols?: Readonly<Record<string, ParameterSymbol>>;
  /** Prefix of the clip-path ids (default 'trace'). */
  idPrefix?: string;
}

const MARGIN = { left: 72, right: 16, bottom: 46 } as const;
/** Space between the legend above the panels and the first panel (px). */
const LEGEND_GAP_PX = 6;
/** Smallest space above the plot (px), room for the top tick label when there is no legend. */
const MIN_TOP_PX = 12;
const STACK_GAP_PX = 8;

/**
 * Trace plots of several parameters stacked on a shared step axis (labelled
 * on the bottom panel only), burn-in shaded, one colour per ensemble with a
 * legend above the panels. Use it to see at a glance whether every ensemble
 * has forgotten its start and mixes (compare the diagnostics of Vehtari et
 * al. 2021 and the autocorrelation times of Goodman & Weare 2010).
 *
 * Cost: O(total series length); each line is reduced to about one point per pixel of width.
 *
 * @param panels one entry per parameter, each with its ensembles' traces (parameter units)
 * @param burnInStep last burn-in step (steps)
 * @param options width and panel height (px), symbols, clip id prefix
 * @returns the SVG document
 * @throws CandelaError `figure.no_parameters` when panels is empty
 * @example traceStackFigure([{ parameter: 'omega_m', ensembles }, { parameter: 'w0', ensembles: other }], 400)
 */
export function traceStackFigure(panels: readonly TraceParameterPanel[], burnInStep: number, options: TraceFigureOptions = {}): string {
  if (panels.length === 0) throw new CandelaError({ code: 'figure.no_parameters', message: 'a trace figure needs at least one parameter' });
  const widthPx = Math.round(options.widthPx ?? 640);
  const panelHeightPx = options.panelHeightPx ?? (panels.length === 1 ? 150 : 96);
  const prefix = options.idPrefix ?? 'trace';
  const symbols = options.symbols;
  // Ensembles are matched across panels by position; the legend follows the panel with the most.
  const widest = panels.reduce((best, panel) => (panel.ensembles.length > best.ensembles.length ? panel : best), panels[0]);
  const entries = widest.ensembles.map((ensemble, index) => ({ label: ensemble.label, color: ensemble.color ?? seriesColor(index), key: 'line' as const }));
  const legend = drawLegend(entries, MARGIN.left - 5, 2, { direction: 'row', maxWidthPx: widthPx - MARGIN.left - MARGIN.right + 5 });
  const top = Math.max(MIN_TOP_PX, legend.heightPx + LEGEND_GAP_PX);
  const heightPx = Math.round(top + panels.length * panelHeightPx + (panels.length - 1) * STACK_GAP_PX + MARGIN.bottom);
  const allEnsembles = panels.flatMap((panel) => panel.ensembles);
  const stepScale = createAxisScale('linear', traceStepRange(allEnsembles), [MARGIN.left, widthPx - MARGIN.right]);
  const definitions: string[] = [];
  const body: string[] = [legend.svg];
  panels.forEach((panel, index) => {
    const frame: PlotFrame = { leftPx: MARGIN.left, topPx: top + index * (panelHeightPx + STACK_GAP_PX), widthPx: widthPx - MARGIN.left - MARGIN.right, heightPx: panelHeightPx, clipId: `${prefix}-clip-${index}` };
    definitions.push(clipPathElement(frame));
    body.push(drawTracePanel(frame, panel.ensembles, stepScale, burnInStep, parameterLabel(panel.parameter, symbols), index === panels.length - 1));
  });
  return svgDocument(widthPx, heightPx, `Trace plots of ${panels.map((panel) => panel.parameter).join(', ')}`, definitions, body);
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
