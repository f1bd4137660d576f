import { escapeXml } from '../figures/escapeXml.js';
import { BLINDED_MARK } from './blindingNotice.js';

/** Stamp colour: a strong red that prints dark in greyscale (common practice for warnings). */
const STAMP_COLOR = '#b00020';
/** Stamp text size, px, and the height of the strip added below the figure for it, px. */
const STAMP_FONT_PX = 10;
const STAMP_STRIP_PX = 16;
/** Margin from the figure's left and right edges, px. */
const STAMP_MARGIN_PX = 4;
/** Mean advance of a bold sans character at STAMP_FONT_PX, px (a generous estimate; common practice is ~0.55 em). */
const STAMP_CHARACTER_PX = 6;

/**
 * Stamps a figure of a blinded run: a strip added below the drawing (the
 * figure grows by STAMP_STRIP_PX, nothing drawn is covered) says "BLINDED"
 * and names the blinded parameters, also in the PNG and PDF rendered from
 * it; the accessible title says it too. A stamp wider than the figure is
 * squeezed to fit (SVG textLength).
 * Cost: one pass over the SVG text.
 * @param svg an SVG document as candela's figures write it (svgDocument: root with width, height and viewBox "0 0 W H").
 * @param parameters the blinded parameter names, listed in the stamp.
 * @returns the stamped document; a document without that root or a closing tag is returned unchanged.
 * @throws nothing.
 * @example markSvgBlinded(svg, ['w0']).includes('BLINDED (w0)') // true
 */
export function markSvgBlinded(svg: string, parameters: readonly string[]): string {
  const root = /<svg\b[^>]*>/.exec(svg);
  const width = root ? /\swidth="([0-9.]+)"/.exec(root[0]) : null;
  const height = root ? /\sheight="([0-9.]+)"/.exec(root[0]) : null;
  const close = svg.lastIndexOf('</svg>');
  if (!root || !width || !height || close < 0) return svg;
  const widthPx = Number(width[1]);
  const heightPx = Number(height[1]);
  const grown = heightPx + STAMP_STRIP_PX;
  const newRoot = root[0]
    .replace(/\sheight="[0-9.]+"/, ` height="${grown}"`)
    .replace(/\sviewBox="0 0 ([0-9.]+) [0-9.]+"/, ` viewBox="0 0 $1 ${grown}"`);
  const text = `${BLINDED_MARK} (${parameters.join(', ')}): true value + secret offset`;
  const room = widthPx - 2 * STAMP_MARGIN_PX;
  const squeeze = text.length * STAMP_CHARACTER_PX > room ? ` textLength="${room}" lengthAdjust="spacingAndGlyphs"` : '';
  const stamp = `<g class="blinding-stamp"><rect x="0" y="${heightPx}" width="${widthPx}" height="${STAMP_STRIP_PX}" fill="#ffffff"/>`
    + `<text x="${STAMP_MARGIN_PX}" y="${grown - 4}" font-size="${STAMP_FONT_PX}" font-weight="bold" fill="${STAMP_COLOR}"${squeeze}>${escapeXml(text)}</text></g>\n`;
  const body = svg.slice(root.index + root[0].length, close).replace(/<title>([^<]*)<\/title>/, (_, title: string) => `<title>${title} (${BLINDED_MARK})</title>`);
  return `${svg.slice(0, root.index)}${newRoot}${body}${stamp}${svg.slice(close)}`;
}
