import { escapeXml } from './escapeXml.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { estimatePlainTextWidthPx } from './richTextSvg.js';
import { formatPixels } from './formatPixels.js';
import { hatchLinesInRectangle } from './hatchPattern.js';
import { markerPathData, truthMarkerPathData } from './markerPathData.js';
import { svgElement } from './svgElement.js';

/** One legend entry: plain-text label, colour and the kind of key drawn beside it. */
export interface LegendEntry {
  label: string;
  color: string;
  /**
   * `fill`: filled swatch; `region`: a credible-region swatch as the triangle
   * figure draws it (hatched inside a heavy outline, within a light outline);
   * `line`: solid line; `dashed`: the reference dot-dash line; `dotted`: the
   * dotted line of constraints such as a flat universe; `marker`: a
   * filled marker with an error bar; `open-marker`: an open circle with an
   * error bar (binned means); `truth`: the truth cross; `cut`: the small
   * triangle that marks an error bar cut at the axis.
   */
  key: 'fill' | 'region' | 'line' | 'dashed' | 'dotted' | 'marker' | 'open-marker' | 'truth' | 'cut';
  /** Fill opacity of a `fill` key (default 0.75). */
  opacity?: number;
  /** Hatching direction of a `region` key (degrees from the x axis; default 45), the same as its run's regions. */
  hatchAngleDeg?: number;
  /** Marker shape of a `marker` key (default circle). */
  shape?: 'circle' | 'square' | 'diamond';
}

/** A drawn legend and the room it takes (px). */
export interface DrawnLegend {
  /** The legend markup ('' for no entries). */
  svg: string;
  /** Estimated width (px). */
  widthPx: number;
  /** Height (px). */
  heightPx: number;
}

/** Legend key size and spacing (px). */
const KEY_WIDTH_PX = 16;
const KEY_HEIGHT_PX = 9;
/** Credible-region keys are taller, so their hatching shows. */
const REGION_KEY_HEIGHT_PX = 11;
const KEY_TEXT_GAP_PX = 5;
const ROW_HEIGHT_PX = 15;
const ENTRY_GAP_PX = 14;
const PADDING_PX = 5;
/** Share of the font size from the baseline to the middle of lower-case letters (vertical centring on the key). */
const TEXT_MIDDLE_FRACTION = 0.35;

function drawKey(entry: LegendEntry, xPx: number, middlePx: number): string {
  const common = { stroke: entry.color, fill: 'none' };
  const centreX = xPx + KEY_WIDTH_PX / 2;
  switch (entry.key) {
    case 'region': {
      const top = middlePx - REGION_KEY_HEIGHT_PX / 2;
      const hatch = hatchLinesInRectangle(xPx + 2, top + 2, KEY_WIDTH_PX - 4, REGION_KEY_HEIGHT_PX - 4, entry.hatchAngleDeg ?? 45, 2.6);
      return svgElement('g', {}, [
        svgElement('rect', { x: xPx, y: top, width: KEY_WIDTH_PX, height: REGION_KEY_HEIGHT_PX, ...common, 'stroke-width': 0.7 }),
        svgElement('path', { ...common, 'stroke-width': 0.5, 'stroke-opacity': 0.7, d: hatch }),
        svgElement('rect', { x: xPx + 2, y: top + 2, width: KEY_WIDTH_PX - 4, height: REGION_KEY_HEIGHT_PX - 4, ...common, 'stroke-width': 1.4 }),
      ]);
    }
    case 'open-marker':
      return svgElement('g', {}, [
        svgElement('path', { ...common, 'stroke-width': 1, d: `M${centreX} ${middlePx - 5.5}v11` }),
        svgElement('circle', { cx: centreX, cy: middlePx, r: 3, fill: FIGURE_STYLE.background, stroke: entry.color, 'stroke-width': 1.1 }),
      ]);
    case 'cut':
      return svgElement('path', { ...common, 'stroke-width': 0.8, d: `M${formatPixels(centreX - 2.4)} ${formatPixels(middlePx + 1.8)}L${formatPixels(centreX)} ${formatPixels(middlePx - 1.8)}L${formatPixels(centreX + 2.4)} ${formatPixels(middlePx + 1.8)}Z` });
    case 'truth':
      return svgElement('path', { ...common, 'stroke-width': 1.3, d: truthMarkerPathData(centreX, middlePx) });
    case 'fill':
      return svgElement('rect', { x: xPx, y: middlePx - KEY_HEIGHT_PX / 2, width: KEY_WIDTH_PX, height: KEY_HEIGHT_PX, fill: entry.color, 'fill-opacity': entry.opacity ?? 0.75, stroke: entry.color, 'stroke-width': 0.6 });
    case 'line':
      return svgElement('path', { ...common, 'stroke-width': FIGURE_STYLE.lineStrokePx, d: `M${xPx} ${middlePx}h${KEY_WIDTH_PX}` });
    case 'dashed':
    case 'dotted':
      return svgElement('path', { ...common, 'stroke-width': FIGURE_STYLE.referenceStrokePx * 1.2, 'stroke-dasharray': entry.key === 'dashed' ? FIGURE_STYLE.referenceDash : FIGURE_STYLE.constraintDash, d: `M${xPx} ${middlePx}h${KEY_WIDTH_PX}` });
    case 'marker':
      return svgElement('g', {}, [
        svgElement('path', { ...common, 'stroke-width': FIGURE_STYLE.thinStrokePx, d: `M${centreX} ${middlePx - 5}v10` }),
        svgElement('path', { fill: entry.color, stroke: 'none', d: markerPathData(entry.shape ?? 'circle', centreX, middlePx, 2.4) }),
      ]);
  }
}

/** Layout of a legend. */
export interface LegendLayout {
  /** `column` (default): one entry per line; `row`: entries side by side, wrapping at maxWidthPx. */
  direction?: 'column' | 'row';
  /** Widest a row may get before it wraps (px; default: no limit). */
  maxWidthPx?: number;
  /** Draw a white box with a thin grey border behind the entries (default false). */
  boxed?: boolean;
}

/**
 * Draws a legend with its top-left corner at (xPx, yPx): entries stacked in
 * a column, or side by side in rows that wrap at a maximum width, optionally
 * on a white box so it stays readable over data. Labels are plain text
 * (escaped, no markup); widths are estimates (see estimatePlainTextWidthPx).
 *
 * Cost: O(entries).
 *
 * @param entries keys and labels, in display order
 * @param xPx left edge (px)
 * @param yPx top edge (px)
 * @param layout direction, wrapping width (px) and box
 * @returns the legend markup (`<g class="legend">`, one `<g class="legend-entry">` per entry) and its size (px); empty for no entries
 * @example drawLegend([{ label: 'run A', color: '#0072B2', key: 'fill' }], 10, 10).heightPx // 25
 */
export function drawLegend(entries: readonly LegendEntry[], xPx: number, yPx: number, layout: LegendLayout = {}): DrawnLegend {
  if (entries.length === 0) return { svg: '', widthPx: 0, heightPx: 0 };
  const fontPx = FIGURE_STYLE.legendFontPx;
  const direction = layout.direction ?? 'column';
  const maxWidth = layout.maxWidthPx ?? Infinity;
  const items: string[] = [];
  let column = 0;
  let row = 0;
  let widest = 0;
  for (const entry of entries) {
    const entryWidth = KEY_WIDTH_PX + KEY_TEXT_GAP_PX + estimatePlainTextWidthPx(entry.label, fontPx);
    if (direction === 'row' && column > 0 && column + entryWidth + 2 * PADDING_PX > maxWidth) {
      column = 0;
      row++;
    }
    const left = xPx + PADDING_PX + column;
    const middle = yPx + PADDING_PX + row * ROW_HEIGHT_PX + ROW_HEIGHT_PX / 2;
    items.push(svgElement('g', { class: 'legend-entry' }, [
      drawKey(entry, left, middle),
      svgElement('text', { x: left + KEY_WIDTH_PX + KEY_TEXT_GAP_PX, y: middle + TEXT_MIDDLE_FRACTION * fontPx, 'font-size': fontPx, fill: FIGURE_STYLE.textColor }, escapeXml(entry.label)),
    ]));
    widest = Math.max(widest, column + entryWidth);
    if (direction === 'row') column += entryWidth + ENTRY_GAP_PX;
    else row++;
  }
  const rows = direction === 'row' ? row + 1 : row;
  const widthPx = widest + 2 * PADDING_PX;
  const heightPx = rows * ROW_HEIGHT_PX + 2 * PADDING_PX;
  const box = layout.boxed
    ? svgElement('rect', { x: xPx, y: yPx, width: widthPx, height: heightPx, fill: FIGURE_STYLE.background, 'fill-opacity': 0.88, stroke: '#bbbbbb', 'stroke-width': 0.6 })
    : '';
  return { svg: svgElement('g', { class: 'legend' }, [box, ...items]), widthPx, heightPx };
}
