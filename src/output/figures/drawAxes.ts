import type { AxisScale } from './axisScale.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { formatPixels } from './formatPixels.js';
import type { PlotFrame } from './plotFrame.js';
import { estimateTextWidthPx, richTextToSvg } from './richTextSvg.js';
import { svgElement } from './svgElement.js';

/** One axis of a panel: its scale, ticks and labels. */
export interface AxisSpec {
  scale: AxisScale;
  /** Major tick positions (data units); ticks outside the domain are skipped. */
  ticks: readonly number[];
  /** Tick label texts, one per tick; omit to draw the ticks without labels. */
  tickLabels?: readonly string[];
  /** Short unlabelled ticks (data units). */
  minorTicks?: readonly number[];
  /** Axis title in candela's TeX subset (see parseRichText), e.g. `\Omega_{\rm m}`. */
  label?: string;
}

/** Fraction of the domain width by which a tick may sit outside it and still be drawn (rounding slack). */
const TICK_DOMAIN_SLACK = 1e-9;
/** Height of digits and capitals as a share of the font size, typical of sans-serif faces (common practice). */
const CAP_HEIGHT_FRACTION = 0.72;
/** Share of the font size between the baseline and the visual middle of digits (for vertical centring). */
const DIGIT_MIDDLE_FRACTION = 0.35;

function inside(scale: AxisScale, value: number): boolean {
  const [a, b] = scale.domain;
  const low = Math.min(a, b);
  const high = Math.max(a, b);
  const slack = scale.kind === 'log' ? TICK_DOMAIN_SLACK * low : TICK_DOMAIN_SLACK * (high - low);
  return Number.isFinite(value) && value >= low - slack && value <= high + slack;
}

/**
 * Draws the left and bottom axes of a panel: axis lines, outward tick marks,
 * tick labels (typographic minus), and axis titles (x centred below, y
 * rotated and centred on the left, placed clear of the widest tick label).
 * Either axis may be omitted (e.g. the density axis of a 1-D marginal).
 *
 * Cost: O(number of ticks).
 *
 * @param frame the panel rectangle (px)
 * @param x bottom axis, or undefined for none
 * @param y left axis, or undefined for none
 * @returns a `<g class="axes">` element
 * @example drawAxes(frame, { scale, ticks: [0, 1], tickLabels: ['0', '1'], label: 'z' }, undefined)
 */
export function drawAxes(frame: PlotFrame, x: AxisSpec | undefined, y: AxisSpec | undefined): string {
  const style = FIGURE_STYLE;
  const bottom = frame.topPx + frame.heightPx;
  const left = frame.leftPx;
  const lines: string[] = [];
  const tickPath: string[] = [];
  const labels: string[] = [];
  const textAttributes = { 'font-size': style.tickFontPx, fill: style.textColor, class: 'tick-label' };
  if (x) {
    lines.push(`M${formatPixels(left)} ${formatPixels(bottom)}H${formatPixels(left + frame.widthPx)}`);
    x.ticks.forEach((tick, index) => {
      if (!inside(x.scale, tick)) return;
      const position = x.scale.toPx(tick);
      tickPath.push(`M${formatPixels(position)} ${formatPixels(bottom)}v${style.tickLengthPx}`);
      const text = x.tickLabels?.[index];
      if (text !== undefined) {
        const baseline = bottom + style.tickLengthPx + style.tickLabelGapPx + CAP_HEIGHT_FRACTION * style.tickFontPx;
        labels.push(svgElement('text', { ...textAttributes, x: position, y: baseline, 'text-anchor': 'middle' }, richTextToSvg(text, style.tickFontPx)));
      }
    });
    for (const tick of x.minorTicks ?? []) {
      if (inside(x.scale, tick)) tickPath.push(`M${formatPixels(x.scale.toPx(tick))} ${formatPixels(bottom)}v${style.minorTickLengthPx}`);
    }
    if (x.label) {
      const baseline = bottom + style.tickLengthPx + style.tickLabelGapPx * 2 + style.tickFontPx + style.labelFontPx;
      labels.push(svgElement('text', { x: left + frame.widthPx / 2, y: baseline, 'text-anchor': 'middle', 'font-size': style.labelFontPx, fill: style.textColor, class: 'axis-label' }, richTextToSvg(x.label, style.labelFontPx)));
    }
  }
  if (y) {
    lines.push(`M${formatPixels(left)} ${formatPixels(frame.topPx)}V${formatPixels(bottom)}`);
    let widestLabelPx = 0;
    y.ticks.forEach((tick, index) => {
      if (!inside(y.scale, tick)) return;
      const position = y.scale.toPx(tick);
      tickPath.push(`M${formatPixels(left)} ${formatPixels(position)}h${-style.tickLengthPx}`);
      const text = y.tickLabels?.[index];
      if (text !== undefined) {
        widestLabelPx = Math.max(widestLabelPx, estimateTextWidthPx(text, style.tickFontPx));
        const anchorX = left - style.tickLengthPx - style.tickLabelGapPx;
        labels.push(svgElement('text', { ...textAttributes, x: anchorX, y: position + DIGIT_MIDDLE_FRACTION * style.tickFontPx, 'text-anchor': 'end' }, richTextToSvg(text, style.tickFontPx)));
      }
    });
    for (const tick of y.minorTicks ?? []) {
      if (inside(y.scale, tick)) tickPath.push(`M${formatPixels(left)} ${formatPixels(y.scale.toPx(tick))}h${-style.minorTickLengthPx}`);
    }
    if (y.label) {
      const centreY = frame.topPx + frame.heightPx / 2;
      const anchorX = left - style.tickLengthPx - style.tickLabelGapPx * 2 - widestLabelPx - style.labelFontPx * 0.3;
      labels.push(svgElement('text', { x: anchorX, y: centreY, transform: `rotate(-90 ${formatPixels(anchorX)} ${formatPixels(centreY)})`, 'text-anchor': 'middle', 'font-size': style.labelFontPx, fill: style.textColor, class: 'axis-label' }, richTextToSvg(y.label, style.labelFontPx)));
    }
  }
  const stroke = { fill: 'none', stroke: style.axisColor, 'stroke-width': style.axisStrokePx, 'stroke-linecap': 'square' };
  return svgElement('g', { class: 'axes' }, [
    lines.length ? svgElement('path', { ...stroke, d: lines.join('') }) : '',
    tickPath.length ? svgElement('path', { ...stroke, 'stroke-linecap': 'butt', d: tickPath.join('') }) : '',
    ...labels,
  ]);
}
