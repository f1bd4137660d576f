import type { AxisScale } from './axisScale.js';
import { drawAxes } from './drawAxes.js';
import type { LegendEntry } from './drawLegend.js';
import type { FontFace } from './figureStyle.js';
import { legendStrip } from './legendStrip.js';
import { formatTickLabel } from './formatTickLabel.js';
import { logTicks } from './logTicks.js';
import { niceTicks } from './niceTicks.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { richTextToPlain } from './richText.js';
import { svgDocument } from './svgDocument.js';

/** Layout shared by the one-panel line figures (px, except the padding fraction). */
export const LINE_FIGURE_MARGIN = { left: 66, right: 16, top: 12, bottom: 44 } as const;
/** Space under the legend strip (px). */
const BOTTOM_PAD_PX = 4;
/** y-axis padding on each side, as a fraction of the span. */
export const LINE_FIGURE_Y_PADDING_FRACTION = 0.06;

/** What a one-panel line figure (bands, curves, points) needs to become an SVG document. */
export interface FramedLineFigure {
  widthPx: number;
  heightPx: number;
  frame: PlotFrame;
  /** Drawn layers, clipped to the frame. */
  layers: string[];
  /** Legend SVG drawn on top, unclipped. */
  legendSvg: string;
  /** Text face (default sans). */
  fontFace?: FontFace;
  xKind: 'linear' | 'log';
  xDomain: [number, number];
  yDomain: [number, number];
  xScale: AxisScale;
  yScale: AxisScale;
  xLabel: string;
  yLabel: string;
}

/**
 * The shared end of the band figures: x ticks (1-2-5 on a log axis, nice
 * numbers on a linear one), y ticks, axes with labels, clip path and the
 * document with its title.
 */
export function framedLineDocument(figure: FramedLineFigure): string {
  const { frame, xScale, yScale } = figure;
  const [xLow, xHigh] = figure.xDomain;
  const yTicks = niceTicks(figure.yDomain[0], figure.yDomain[1], 5);
  let xAxis;
  if (figure.xKind === 'log') {
    const ticks = logTicks(xLow, xHigh);
    xAxis = { scale: xScale, ticks: ticks.major, minorTicks: ticks.minor, tickLabels: ticks.major.map((value) => formatTickLabel(value)), label: figure.xLabel };
  } else {
    const ticks = niceTicks(xLow, xHigh, 6);
    xAxis = { scale: xScale, ticks: ticks.values, tickLabels: ticks.values.map((value) => formatTickLabel(value, ticks.decimals)), label: figure.xLabel };
  }
  const body = [
    clippedGroup(frame, figure.layers),
    drawAxes(frame, xAxis, { scale: yScale, ticks: yTicks.values, tickLabels: yTicks.values.map((value) => formatTickLabel(value, yTicks.decimals)), label: figure.yLabel }),
    figure.legendSvg,
  ];
  return svgDocument(figure.widthPx, figure.heightPx, `${richTextToPlain(figure.yLabel)} against ${richTextToPlain(figure.xLabel)}`, [clipPathElement(frame)], body, figure.fontFace);
}

/**
 * The plot frame of a one-panel line figure and its legend, as a caption
 * strip below the x axis (candela's legend treatment, docs/style.md): the
 * panel takes the height the strip leaves.
 *
 * @param widthPx figure width (px)
 * @param heightPx figure height (px), legend included
 * @param entries legend entries
 * @param clipId id of the panel's clip path
 * @returns the frame and the legend markup
 * @example lineFigureFrame(560, 380, entries, 'band-clip').frame.topPx // 12
 */
export function lineFigureFrame(widthPx: number, heightPx: number, entries: readonly LegendEntry[], clipId: string): { frame: PlotFrame; legendSvg: string } {
  const plotWidth = widthPx - LINE_FIGURE_MARGIN.left - LINE_FIGURE_MARGIN.right;
  const stripHeight = legendStrip(entries, LINE_FIGURE_MARGIN.left, 0, plotWidth).heightPx;
  const frame: PlotFrame = { leftPx: LINE_FIGURE_MARGIN.left, topPx: LINE_FIGURE_MARGIN.top, widthPx: plotWidth, heightPx: heightPx - LINE_FIGURE_MARGIN.top - LINE_FIGURE_MARGIN.bottom - stripHeight - BOTTOM_PAD_PX, clipId };
  return { frame, legendSvg: legendStrip(entries, LINE_FIGURE_MARGIN.left, frame.topPx + frame.heightPx + LINE_FIGURE_MARGIN.bottom, plotWidth).svg };
}
