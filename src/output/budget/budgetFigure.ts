import { CandelaError } from '../../errors.js';
import { createAxisScale, type AxisScale } from '../figures/axisScale.js';
import { drawAxes } from '../figures/drawAxes.js';
import type { LegendEntry } from '../figures/drawLegend.js';
import { FIGURE_STYLE, type FontFace } from '../figures/figureStyle.js';
import { figureWidthPx, type FigureWidth } from '../figures/figureWidth.js';
import { formatPixels } from '../figures/formatPixels.js';
import { formatTickLabel } from '../figures/formatTickLabel.js';
import { legendStrip } from '../figures/legendStrip.js';
import { niceTicks } from '../figures/niceTicks.js';
import { seriesColor } from '../figures/palette.js';
import { clipPathElement, clippedGroup, type PlotFrame } from '../figures/plotFrame.js';
import { estimatePlainTextWidthPx } from '../figures/richTextSvg.js';
import { svgDocument } from '../figures/svgDocument.js';
import { svgElement } from '../figures/svgElement.js';
import { parameterSymbol } from '../tables/parameterSymbols.js';
import type { BudgetTable } from './budgetTable.js';

/** Optional settings of {@link budgetFigure}. */
export interface BudgetFigureOptions {
  /** Figure width: one journal column, both (default) or `{ inches }`. */
  width?: FigureWidth;
  fontFace?: FontFace;
}

/** Height of one parameter's bar (px) and the gap between systematics (px). */
const BAR_PX = 7;
const ROW_GAP_PX = 8;
/** Space between the two panels (px), the right margin (px) and the room for x tick labels and titles (px). */
const PANEL_GAP_PX = 22;
/** A tick label centred closer than this to the edge the panels share is left out, so the two panels' labels never meet (px). */
const SHARED_EDGE_CLEARANCE_PX = 16;
const RIGHT_MARGIN_PX = 14;
const TOP_MARGIN_PX = 10;
const BOTTOM_MARGIN_PX = 44;
/** Padding of each x range beyond its largest bar, as a fraction of the span. */
const X_PADDING_FRACTION = 0.08;

/**
 * The systematic budget as a bar figure in candela's house style
 * (docs/style.md): two framed panels sharing one row per systematic. Left,
 * the shift of each parameter's mean when the systematic is removed, with
 * its Monte Carlo error bar; right, its error contribution in quadrature
 * (sqrt(sd_all^2 - sd_without^2)), with its Monte Carlo error bar. Both are in units of the parameter's
 * total posterior standard deviation, so parameters share an axis; one bar
 * per parameter in the lantern series colours, zero as an ink hairline, the
 * legend strip below naming the parameters. A dagger marks a systematic
 * whose reweighting is worth fewer draws than the threshold.
 *
 * Cost O(systematics x parameters).
 * @param table the budget (at least one systematic and one parameter).
 * @param options width and font face.
 * @returns the SVG document.
 * @throws CandelaError `figure.bad_range` for a budget without systematics or parameters.
 * @example budgetFigure(table).includes('class="budget-bar"') // true
 */
export function budgetFigure(table: BudgetTable, options: BudgetFigureOptions = {}): string {
  const p = table.parameters.length;
  if (table.rows.length === 0 || p === 0) {
    throw new CandelaError({ code: 'figure.bad_range', message: 'a budget figure needs at least one systematic and one parameter' });
  }
  const widthPx = figureWidthPx(options.width ?? 'double', 672);
  const labels = table.rows.map((row) => (row.reliable ? row.name : `${row.name} †`));
  const leftPx = 16 + Math.max(...labels.map((label) => estimatePlainTextWidthPx(label, FIGURE_STYLE.tickFontPx)));
  const rowPx = p * BAR_PX + ROW_GAP_PX;
  const panelHeight = table.rows.length * rowPx;
  const panelWidth = (widthPx - leftPx - RIGHT_MARGIN_PX - PANEL_GAP_PX) / 2;
  const entries: LegendEntry[] = table.parameters.map((name, j) => ({ label: parameterSymbol(name).label, color: seriesColor(j), key: 'fill', opacity: 1 }));
  const strip = legendStrip(entries, leftPx, 0, widthPx - leftPx - RIGHT_MARGIN_PX);
  const heightPx = Math.round(TOP_MARGIN_PX + panelHeight + BOTTOM_MARGIN_PX + strip.heightPx + 4);
  const frames: PlotFrame[] = [0, 1].map((k) => ({
    leftPx: leftPx + k * (panelWidth + PANEL_GAP_PX), topPx: TOP_MARGIN_PX, widthPx: panelWidth, heightPx: panelHeight, clipId: `budget-clip-${k}`,
  }));
  const relative = (values: readonly number[], j: number) => values[j] / table.allSd[j];
  const shiftBars = table.rows.map((row) => row.shift.map((_, j) => ({ value: relative(row.shift, j), error: relative(row.shiftMcError, j) })));
  const contributionBars = table.rows.map((row) => row.contribution.map((_, j) => ({ value: relative(row.contribution, j), error: relative(row.contributionMcError, j) })));
  const yScale = createAxisScale('linear', [table.rows.length, 0], [TOP_MARGIN_PX + panelHeight, TOP_MARGIN_PX]);
  const body: string[] = [];
  const panels: Array<[PlotFrame, typeof shiftBars, string]> = [
    [frames[0], shiftBars, '\\Delta\\,mean / \\sigma_{\\rm all}'],
    [frames[1], contributionBars, '\\sigma_{k} / \\sigma_{\\rm all}'],
  ];
  panels.forEach(([frame, bars, label], k) => {
    const xScale = createAxisScale('linear', barDomain(bars), [frame.leftPx, frame.leftPx + frame.widthPx]);
    body.push(clippedGroup(frame, drawBars(bars, xScale, yScale, p)));
    const ticks = niceTicks(xScale.domain[0], xScale.domain[1], 5);
    const sharedEdge = k === 0 ? frame.leftPx + frame.widthPx : frame.leftPx;
    const shown = ticks.values.filter((value) => Math.abs(xScale.toPx(value) - sharedEdge) >= SHARED_EDGE_CLEARANCE_PX);
    const categories = table.rows.map((_, i) => i + 0.5);
    body.push(drawAxes(frame, { scale: xScale, ticks: shown, tickLabels: shown.map((v) => formatTickLabel(v, ticks.decimals)), label },
      { scale: yScale, ticks: categories, ...(k === 0 ? { tickLabels: labels.map(escapeRichText) } : {}) }));
  });
  body.push(legendStrip(entries, leftPx, TOP_MARGIN_PX + panelHeight + BOTTOM_MARGIN_PX, widthPx - leftPx - RIGHT_MARGIN_PX).svg);
  return svgDocument(widthPx, heightPx, `Systematic budget of ${table.title} (${table.model})`, frames.map(clipPathElement), body, options.fontFace);
}

/** The x range of one panel: zero and every bar with its error bar, padded. */
function barDomain(bars: Array<Array<{ value: number; error: number }>>): [number, number] {
  let low = 0;
  let high = 0;
  for (const row of bars) {
    for (const { value, error } of row) {
      if (!Number.isFinite(value)) continue;
      low = Math.min(low, value - error);
      high = Math.max(high, value + error);
    }
  }
  if (high - low === 0) high = 1;
  const pad = X_PADDING_FRACTION * (high - low);
  return [low < 0 ? low - pad : 0, high > 0 ? high + pad : 0];
}

/** One bar per parameter and systematic, from zero to the value, with a thin error bar when given; the zero line. */
function drawBars(bars: Array<Array<{ value: number; error: number }>>, xScale: AxisScale, yScale: AxisScale, p: number): string[] {
  const zero = xScale.toPx(0);
  const [top, bottom] = [yScale.toPx(0), yScale.toPx(bars.length)];
  const layers = [svgElement('path', { class: 'zero-line', fill: 'none', stroke: FIGURE_STYLE.axisColor, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: `M${formatPixels(zero)} ${formatPixels(top)}V${formatPixels(bottom)}` })];
  bars.forEach((row, i) => {
    const rowTop = yScale.toPx(i) + ROW_GAP_PX / 2;
    row.forEach(({ value, error }, j) => {
      if (!Number.isFinite(value)) return;
      const end = xScale.toPx(value);
      const y = rowTop + j * BAR_PX;
      layers.push(svgElement('rect', {
        class: 'budget-bar', fill: seriesColor(j), x: formatPixels(Math.min(zero, end)), y: formatPixels(y + 0.5),
        width: formatPixels(Math.abs(end - zero)), height: formatPixels(BAR_PX - 1),
      }));
      if (error > 0) {
        const middle = formatPixels(y + BAR_PX / 2);
        layers.push(svgElement('path', { class: 'budget-error', fill: 'none', stroke: FIGURE_STYLE.axisColor, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: `M${formatPixels(xScale.toPx(value - error))} ${middle}H${formatPixels(xScale.toPx(value + error))}` }));
      }
    });
  });
  return layers;
}

/** A name as plain text in candela's TeX subset: `_`, `^`, `\`, `{`, `}` and `$` escaped. */
function escapeRichText(text: string): string {
  return text.replace(/[\\_^{}$]/g, (character) => `\\${character}`);
}
