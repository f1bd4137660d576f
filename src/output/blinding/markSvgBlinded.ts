import { escapeXml } from '../figures/escapeXml.js';
import { BLINDED_MARK } from './blindingNotice.js';

/** Stamp colour: a strong red that prints dark in greyscale (common practice for warnings). */
const STAMP_COLOR = '#b00020';
/** Stamp text size and margin from the figure's top-right corner, px. */
const STAMP_FONT_PX = 11;
const STAMP_MARGIN_PX = 4;

/**
 * Stamps a figure of a blinded run: "BLINDED" in the top-right corner (also
 * in the PNG and PDF rendered from it) and in the accessible title.
 * Cost: one pass over the SVG text.
 * @param svg an SVG document as candela's figures write it (svgDocument).
 * @param parameters the blinded parameter names, listed in the stamp.
 * @returns the stamped document; a document without a root `<svg ... width="W"` or closing tag is returned unchanged.
 * @throws nothing.
 * @example markSvgBlinded(svg, ['w0']).includes('BLINDED') // true
 */
export function markSvgBlinded(svg: string, parameters: readonly string[]): string {
  const width = /<svg\b[^>]*?\swidth="([0-9.]+)"/.exec(svg);
  const close = svg.lastIndexOf('</svg>');
  if (!width || close < 0) return svg;
  const x = Number(width[1]) - STAMP_MARGIN_PX;
  const text = `${BLINDED_MARK} (${parameters.join(', ')}: true value + secret offset)`;
  const stamp = `<text class="blinding-stamp" x="${x}" y="${STAMP_MARGIN_PX + STAMP_FONT_PX}" text-anchor="end" font-size="${STAMP_FONT_PX}" font-weight="bold" fill="${STAMP_COLOR}">${escapeXml(text)}</text>\n`;
  const titled = svg.replace(/<title>([^<]*)<\/title>/, (_, title: string) => `<title>${title} (${BLINDED_MARK})</title>`);
  const at = titled.lastIndexOf('</svg>');
  return `${titled.slice(0, at)}${stamp}${titled.slice(at)}`;
}
