import { svgElement } from './svgElement.js';

/** The rectangle of one plot panel inside a figure (px), with the id of its clip path. */
export interface PlotFrame {
  /** Left edge (px from the figure's left). */
  leftPx: number;
  /** Top edge (px from the figure's top). */
  topPx: number;
  /** Width (px). */
  widthPx: number;
  /** Height (px). */
  heightPx: number;
  /** Id of the `<clipPath>` that keeps data inside this rectangle (unique in the figure). */
  clipId: string;
}

/**
 * The `<clipPath>` element for a plot frame: data drawn with
 * `clip-path="url(#id)"` stays inside the panel.
 *
 * @param frame the panel rectangle (px) and its clip id
 * @returns a `<clipPath>` element to place in `<defs>`
 * @example clipPathElement({ leftPx: 0, topPx: 0, widthPx: 10, heightPx: 10, clipId: 'c0' })
 * // '<clipPath id="c0"><rect x="0" y="0" width="10" height="10"/></clipPath>'
 */
export function clipPathElement(frame: PlotFrame): string {
  return svgElement('clipPath', { id: frame.clipId }, svgElement('rect', { x: frame.leftPx, y: frame.topPx, width: frame.widthPx, height: frame.heightPx }));
}

/**
 * Wraps data markup in a group clipped to the frame.
 *
 * @param frame the panel whose clip path applies
 * @param children data markup (paths, markers)
 * @returns a `<g clip-path=...>` element, or '' when there is nothing to draw
 * @example clippedGroup(frame, ['<path d="M0 0"/>'])
 */
export function clippedGroup(frame: PlotFrame, children: readonly string[]): string {
  const content = children.filter((child) => child !== '');
  return content.length === 0 ? '' : svgElement('g', { 'clip-path': `url(#${frame.clipId})` }, content);
}
