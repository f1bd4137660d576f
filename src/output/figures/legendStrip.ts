import { drawLegend } from './drawLegend.js';
import type { LegendEntry } from './drawLegend.js';
import { FIGURE_STYLE } from './figureStyle.js';
import { formatPixels } from './formatPixels.js';
import { svgElement } from './svgElement.js';

/** Space between the rule and the legend entries (px). */
const RULE_GAP_PX = 3;

/**
 * The legend as a caption strip below the panels, candela's legend
 * treatment (docs/style.md): a hairline rule across the plotting width,
 * then the entries side by side, wrapping into more rows when needed. The
 * strip never covers data, whatever the data look like.
 *
 * Cost: O(entries).
 *
 * @param entries legend entries in display order
 * @param leftPx left end of the strip (px)
 * @param topPx top of the strip (px)
 * @param widthPx width of the strip (px)
 * @returns the markup and the strip's height (px); empty with height 0 for no entries
 * @example legendStrip([{ label: 'run', color: '#4C32D5', key: 'region' }], 60, 400, 500).heightPx // 28
 */
export function legendStrip(entries: readonly LegendEntry[], leftPx: number, topPx: number, widthPx: number): { svg: string; heightPx: number } {
  if (entries.length === 0) return { svg: '', heightPx: 0 };
  const legend = drawLegend(entries, leftPx - 5, topPx + RULE_GAP_PX, { direction: 'row', maxWidthPx: widthPx + 5 });
  const rule = svgElement('path', { class: 'caption-rule', fill: 'none', stroke: FIGURE_STYLE.captionRuleColor, 'stroke-width': FIGURE_STYLE.captionRuleStrokePx, d: `M${formatPixels(leftPx)} ${formatPixels(topPx)}h${formatPixels(widthPx)}` });
  return { svg: svgElement('g', { class: 'caption-strip' }, [rule, legend.svg]), heightPx: RULE_GAP_PX + legend.heightPx };
}
