import { escapeXml } from './escapeXml.js';
import { FIGURE_STYLE } from './figureStyle.js';
import type { FontFace } from './figureStyle.js';
import { svgElement } from './svgElement.js';

/** The SVG namespace (W3C SVG 1.1, section 5.1.1). */
const SVG_NAMESPACE = 'http://www.w3.org/2000/svg';

/**
 * Wraps figure content in a standalone SVG document: namespace, size in px
 * with a matching viewBox (so it scales when embedded), the figure font
 * stack of the chosen face, an accessible `<title>`, `<defs>` (clip paths) and a white page.
 *
 * @param widthPx figure width (px)
 * @param heightPx figure height (px)
 * @param title short description read by screen readers and shown as a tooltip
 * @param definitions elements for `<defs>` (clip paths), may be empty
 * @param body the drawing, back to front
 * @param fontFace `sans` (default) or `serif`
 * @returns the SVG document text, ending with a newline
 * @example svgDocument(100, 50, 'empty', [], []) // '<svg xmlns=... width="100" height="50" ...>...</svg>\n'
 */
export function svgDocument(widthPx: number, heightPx: number, title: string, definitions: readonly string[], body: readonly string[], fontFace: FontFace = 'sans'): string {
  const content = [
    svgElement('title', {}, escapeXml(title)),
    definitions.length ? svgElement('defs', {}, definitions.join('\n')) : '',
    svgElement('rect', { class: 'page', x: 0, y: 0, width: widthPx, height: heightPx, fill: FIGURE_STYLE.background }),
    ...body,
  ].filter((part) => part !== '');
  const root = svgElement('svg', {
    xmlns: SVG_NAMESPACE,
    width: widthPx,
    height: heightPx,
    viewBox: `0 0 ${widthPx} ${heightPx}`,
    'font-family': FIGURE_STYLE.fontFamilies[fontFace],
    role: 'img',
  }, `\n${content.join('\n')}\n`);
  return `${root}\n`;
}
