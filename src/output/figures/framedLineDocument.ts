import type { AxisScale } from './axisScale.js';
import { drawAxes } from './drawAxes.js';
import { formatTickLabel } from './formatTickLabel.js';
import { logTicks } from './logTicks.js';
import { niceTicks } from './niceTicks.js';
import { clipPathElement, clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { richTextToPlain } from './richText.js';
import { svgDocument } from './svgDocument.js';

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
