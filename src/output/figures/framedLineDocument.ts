import type { AxisScale } from './axisScale.js';
import { drawAxes } from './drawAxes.js';
import { formatTickLabel } from './formatTickLabel.js';
import { logTicks } from './logTicks.js';
import { niceTicks } from './niceTicks.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { richTextToPlain } from './richText.js';
import { svgDocument } from './svgDocument.js';

/** Layout shared by the one-panel line figures (px, except the padding fraction). */
export const LINE_FIGURE_MARGIN = { left: 66, right: 16, bottom: 48 } as const;
/** Space between the legend above the plot and the plot (px). */
export const LINE_FIGURE_LEGEND_GAP_PX = 6;
/** Smallest space above the plot (px), room for the top tick label when there is no legend. */
export const LINE_FIGURE_MIN_TOP_PX = 12;
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
  return svgDocument(figure.widthPx, figure.heightPx, `${richTextToPlain(figure.yLabel)} against ${richTextToPlain(figure.xLabel)}`, [clipPathElement(frame)], body);
}
