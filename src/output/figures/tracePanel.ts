import type { AxisScale } from './axisScale.js';
import { createAxisScale } from './axisScale.js';
import { decimateMinMax } from './decimateMinMax.js';
import { drawAxes } from './drawAxes.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { formatPixels } from './formatPixels.js';
import { formatTickLabel } from './formatTickLabel.js';
import { linePathData } from './linePathData.js';
import { niceTicks } from './niceTicks.js';
import { seriesColor } from './palette.js';
import { clippedGroup } from './plotFrame.js';
import type { PlotFrame } from './plotFrame.js';
import { svgElement } from './svgElement.js';

/** The traces of one ensemble for one parameter. */
export interface TraceEnsemble {
  /** Legend label, e.g. 'ensemble 1'. */
  label: string;
  /** A few walkers' values (or a summary such as the walker mean), one array per line (parameter units). */
  series: readonly ArrayLike<number>[];
  /** Walker index of each series, for the record (e.g. in `data-walker`); optional. */
  walkers?: readonly number[];
  /** Positions in `series` of walkers flagged as stuck: drawn heavier, in ink, above the others. */
  stuck?: readonly number[];
  /** Step number of the first value (default 0). */
  firstStep?: number;
  /** Steps between stored values when the chain was thinned (default 1). */
  stepStride?: number;
  /** `#rrggbb`; default: the palette colour of the ensemble's position. */
  color?: string;
}

/** Points kept per series per pixel of panel width: one (a min and a max every 2 px) is all a screen or printer can show. */
const TRACE_POINTS_PER_PX = 1;
/** Line opacity of individual walkers, and of a lone line (e.g. a walker mean). */
const WALKER_OPACITY = 0.6;
const SINGLE_LINE_OPACITY = 0.85;
/** A stuck walker: ink line width (px) and dash (px). */
const STUCK_STROKE_PX = 1.1;
const STUCK_DASH = FIGURE_STYLE.referenceDash;
/** Value-axis padding on each side, as a fraction of the span. */
const VALUE_PADDING_FRACTION = 0.05;

/**
 * The step range covered by a set of ensembles: [first step, last step].
 *
 * @param ensembles traces (step numbers from firstStep and stepStride)
 * @returns [first, last] step; [0, 1] when there is no value
 * @example traceStepRange([{ label: 'a', series: [[1, 2, 3]] }]) // [0, 2]
 */
export function traceStepRange(ensembles: readonly TraceEnsemble[]): [number, number] {
  let first = Infinity;
  let last = -Infinity;
  for (const ensemble of ensembles) {
    const start = ensemble.firstStep ?? 0;
    const stride = ensemble.stepStride ?? 1;
    for (const series of ensemble.series) {
      if (series.length === 0) continue;
      first = Math.min(first, start);
      last = Math.max(last, start + (series.length - 1) * stride);
    }
  }
  return last > first ? [first, last] : [0, Math.max(1, first + 1)];
}

/**
 * Draws one trace panel: burn-in shaded up to burnInStep with a thin
 * boundary line, each series as a thin line in its ensemble's colour, walkers
 * flagged as stuck as dot-dash ink lines above the others
 * (reduced to about one point per pixel of width by decimateMinMax), a value axis with
 * the parameter label and, when asked, the step axis with its labels.
 *
 * Cost: O(total series length).
 *
 * @param frame the panel rectangle (px)
 * @param ensembles traces to draw
 * @param stepScale shared step axis (steps -> px)
 * @param burnInStep last step discarded as burn-in (steps; <= first step for none)
 * @param valueLabel value-axis label in candela's TeX subset
 * @param stepLabels whether to label the step axis
 * @returns panel markup
 * @example drawTracePanel(frame, ensembles, stepScale, 500, '\\Omega_{\\rm m}', true)
 */
export function drawTracePanel(frame: PlotFrame, ensembles: readonly TraceEnsemble[], stepScale: AxisScale, burnInStep: number, valueLabel: string, stepLabels: boolean): string {
  let low = Infinity;
  let high = -Infinity;
  for (const ensemble of ensembles) {
    for (const series of ensemble.series) {
      for (let position = 0; position < series.length; position++) {
        const value = series[position];
        if (!Number.isFinite(value)) continue;
        low = Math.min(low, value);
        high = Math.max(high, value);
      }
    }
  }
  if (!(high > low)) [low, high] = Number.isFinite(low) ? [low - 0.5, low + 0.5] : [0, 1];
  const padding = VALUE_PADDING_FRACTION * (high - low);
  const valueScale = createAxisScale('linear', [low - padding, high + padding], [frame.topPx + frame.heightPx, frame.topPx]);
  const valueTicks = niceTicks(low - padding, high + padding, 4);
  const stepTicks = niceTicks(stepScale.domain[0], stepScale.domain[1], 6);
  const layers: string[] = [];
  if (burnInStep > stepScale.domain[0]) {
    const edge = Math.min(stepScale.toPx(burnInStep), frame.leftPx + frame.widthPx);
    layers.push(svgElement('rect', { class: 'burn-in', x: frame.leftPx, y: frame.topPx, width: edge - frame.leftPx, height: frame.heightPx, fill: FIGURE_STYLE.burnInFill }));
    layers.push(svgElement('path', { class: 'burn-in-edge', fill: 'none', stroke: FIGURE_STYLE.bandFill, 'stroke-width': FIGURE_STYLE.referenceStrokePx, d: `M${formatPixels(edge)} ${formatPixels(frame.topPx)}v${formatPixels(frame.heightPx)}` }));
    layers.push(svgElement('text', { x: frame.leftPx + 6, y: frame.topPx + FIGURE_STYLE.tickFontPx + 4, 'font-size': FIGURE_STYLE.tickFontPx, fill: FIGURE_STYLE.textColor, 'fill-opacity': 0.7 }, 'burn-in'));
  }
  const stuckLayers: string[] = [];
  ensembles.forEach((ensemble, ensembleIndex) => {
    const color = ensemble.color ?? seriesColor(ensembleIndex);
    const start = ensemble.firstStep ?? 0;
    const stride = ensemble.stepStride ?? 1;
    const stuck = new Set(ensemble.stuck ?? []);
    const paths = ensemble.series.map((series) => {
      const kept = decimateMinMax(series, Math.max(2, Math.round(TRACE_POINTS_PER_PX * frame.widthPx)));
      const steps = kept.index.map((position) => start + position * stride);
      return linePathData(steps, kept.value, stepScale, valueScale);
    });
    const moving = paths.filter((_, position) => !stuck.has(position));
    const opacity = ensemble.series.length > 1 ? WALKER_OPACITY : SINGLE_LINE_OPACITY;
    if (moving.length) layers.push(svgElement('path', { class: 'trace', 'data-ensemble': ensemble.label, fill: 'none', stroke: color, 'stroke-opacity': opacity, 'stroke-width': FIGURE_STYLE.thinStrokePx, 'stroke-linejoin': 'round', d: moving.join('') }));
    for (const position of stuck) {
      if (paths[position]) stuckLayers.push(svgElement('path', { class: 'trace stuck-walker', 'data-ensemble': ensemble.label, 'data-walker': ensemble.walkers?.[position], fill: 'none', stroke: FIGURE_STYLE.axisColor, 'stroke-width': STUCK_STROKE_PX, 'stroke-dasharray': STUCK_DASH, d: paths[position] }));
    }
  });
  layers.push(...stuckLayers);
  return svgElement('g', { class: 'panel trace-panel' }, [
    clippedGroup(frame, layers),
    drawAxes(
      frame,
      { scale: stepScale, ticks: stepTicks.values, tickLabels: stepLabels ? stepTicks.values.map((value) => formatTickLabel(value, stepTicks.decimals)) : undefined, label: stepLabels ? 'step' : undefined },
      { scale: valueScale, ticks: valueTicks.values, tickLabels: valueTicks.values.map((value) => formatTickLabel(value, valueTicks.decimals)), label: valueLabel },
    ),
  ]);
}
