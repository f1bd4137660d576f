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

/** Extra parts of a panel's axes. */
export interface AxesExtras {
  /** A value axis on the right edge (e.g. the relative density of a 1-D marginal); labels sit right of the frame. */
  right?: AxisSpec;
  /** Draw the whole frame around the panel (default true); false draws only the axis lines given. */
  framed?: boolean;
}

/**
 * Draws the axes of a panel in candela's house style (docs/style.md): a
 * thin frame around the whole panel, tick marks pointing into the panel,
 * tick labels outside it (typographic minus), and axis titles (x centred
 * below, y rotated and centred on the left, clear of the widest tick label).
 * Either axis may be omitted; a right-hand value axis may be added.
 *
 * Cost: O(number of ticks).
 *
 * @param frame the panel rectangle (px)
 * @param x bottom axis, or undefined for none
 * @param y left axis, or undefined for none
 * @param extras right-hand axis and whether to frame the panel
 * @returns a `<g class="axes">` element
 * @example drawAxes(frame, { scale, ticks: [0, 1], tickLabels: ['0', '1'], label: 'z' }, undefined)
 */
export function drawAxes(frame: PlotFrame, x: AxisSpec | undefined, y: AxisSpec | undefined, extras: AxesExtras = {}): string {
  const style = FIGURE_STYLE;
  const bottom = frame.topPx + frame.heightPx;
  const left = frame.leftPx;
  const right = frame.leftPx + frame.widthPx;
  const lines: string[] = [];
  const tickPath: string[] = [];
  const labels: string[] = [];
  const textAttributes = { 'font-size': style.tickFontPx, fill: style.textColor, class: 'tick-label' };
  if (extras.framed ?? true) {
    lines.push(`M${formatPixels(left)} ${formatPixels(frame.topPx)}H${formatPixels(right)}V${formatPixels(bottom)}H${formatPixels(left)}Z`);
  }
  if (x) {
    if (extras.framed === false) lines.push(`M${formatPixels(left)} ${formatPixels(bottom)}H${formatPixels(right)}`);
    x.ticks.forEach((tick, index) => {
      if (!inside(x.scale, tick)) return;
      const position = x.scale.toPx(tick);
      tickPath.push(`M${formatPixels(position)} ${formatPixels(bottom)}v${-style.tickLengthPx}`);
      const text = x.tickLabels?.[index];
      if (text !== undefined) {
        const baseline = bottom + style.tickLabelGapPx + CAP_HEIGHT_FRACTION * style.tickFontPx;
        labels.push(svgElement('text', { ...textAttributes, x: position, y: baseline, 'text-anchor': 'middle' }, richTextToSvg(text, style.tickFontPx)));
      }
    });
    for (const tick of x.minorTicks ?? []) {
      if (inside(x.scale, tick)) tickPath.push(`M${formatPixels(x.scale.toPx(tick))} ${formatPixels(bottom)}v${-style.minorTickLengthPx}`);
    }
    if (x.label) {
      const baseline = bottom + style.tickLabelGapPx * 2 + style.tickFontPx + style.labelFontPx;
      labels.push(svgElement('text', { x: left + frame.widthPx / 2, y: baseline, 'text-anchor': 'middle', 'font-size': style.labelFontPx, fill: style.textColor, class: 'axis-label' }, richTextToSvg(x.label, style.labelFontPx)));
    }
  }
  const vertical = (axis: AxisSpec, side: 'left' | 'right') => {
    const edge = side === 'left' ? left : right;
    const inward = side === 'left' ? 1 : -1;
    if (extras.framed === false) lines.push(`M${formatPixels(edge)} ${formatPixels(frame.topPx)}V${formatPixels(bottom)}`);
    let widestLabelPx = 0;
    axis.ticks.forEach((tick, index) => {
      if (!inside(axis.scale, tick)) return;
      const position = axis.scale.toPx(tick);
      tickPath.push(`M${formatPixels(edge)} ${formatPixels(position)}h${inward * style.tickLengthPx}`);
      const text = axis.tickLabels?.[index];
      if (text !== undefined) {
        widestLabelPx = Math.max(widestLabelPx, estimateTextWidthPx(text, style.tickFontPx));
        const anchorX = edge - inward * style.tickLabelGapPx;
        labels.push(svgElement('text', { ...textAttributes, x: anchorX, y: position + DIGIT_MIDDLE_FRACTION * style.tickFontPx, 'text-anchor': side === 'left' ? 'end' : 'start' }, richTextToSvg(text, style.tickFontPx)));
      }
    });
    for (const tick of axis.minorTicks ?? []) {
      if (inside(axis.scale, tick)) tickPath.push(`M${formatPixels(edge)} ${formatPixels(axis.scale.toPx(tick))}h${inward * style.minorTickLengthPx}`);
    }
    if (axis.label) {
      const centreY = frame.topPx + frame.heightPx / 2;
      const anchorX = edge - inward * (style.tickLabelGapPx * 2 + widestLabelPx + style.labelFontPx * 0.3);
      labels.push(svgElement('text', { x: anchorX, y: centreY, transform: `rotate(${side === 'left' ? -90 : 90} ${formatPixels(anchorX)} ${formatPixels(centreY)})`, 'text-anchor': 'middle', 'font-size': style.labelFontPx, fill: style.textColor, class: 'axis-label' }, richTextToSvg(axis.label, style.labelFontPx)));
    }
  };
  if (y) vertical(y, 'left');
  if (extras.right) vertical(extras.right, 'right');
  const stroke = { fill: 'none', stroke: style.axisColor, 'stroke-width': style.axisStrokePx, 'stroke-linejoin': 'miter' };
  return svgElement('g', { class: 'axes' }, [
    lines.length ? svgElement('path', { ...stroke, class: 'frame', d: lines.join('') }) : '',
    tickPath.length ? svgElement('path', { ...stroke, 'stroke-linecap': 'butt', d: tickPath.join('') }) : '',
    ...labels,
  ]);
}
