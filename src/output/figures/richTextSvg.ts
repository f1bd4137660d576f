import { escapeXml } from './escapeXml.js';
import { parseRichText } from './richText.js';

/** Sub- and superscripts are drawn at this fraction of the surrounding font size (common typographic practice). */
const SCRIPT_SIZE_FRACTION = 0.72;
/** Subscript baseline drop, as a fraction of the surrounding font size. */
const SUBSCRIPT_DROP_FRACTION = 0.22;
/** Superscript baseline rise, as a fraction of the surrounding font size. */
const SUPERSCRIPT_RISE_FRACTION = 0.36;
/** Average advance width of a sans-serif glyph, as a fraction of the font size (for layout estimates only). */
const AVERAGE_GLYPH_WIDTH_FRACTION = 0.56;

/**
 * Turns a label in candela's TeX subset (see {@link parseRichText}) into the
 * content of an SVG `<text>` element: escaped base text, and `<tspan>`s with
 * a numeric `baseline-shift` and a smaller font for sub- and superscripts,
 * so `\Omega_{\rm m}` is drawn as a real Ω with a subscript m.
 *
 * @param source label text
 * @param fontSizePx font size of the surrounding `<text>` (px)
 * @returns markup to place inside `<text>...</text>`
 * @example richTextToSvg('\\Omega_m', 12) // 'Ω<tspan baseline-shift="-2.64" font-size="8.64">m</tspan>'
 */
export function richTextToSvg(source: string, fontSizePx: number): string {
  const scriptSize = Number((fontSizePx * SCRIPT_SIZE_FRACTION).toFixed(2));
  return parseRichText(source)
    .map((segment) => {
      const text = escapeXml(segment.text);
      if (segment.shift === 'base') return text;
      const shift = segment.shift === 'sub' ? -SUBSCRIPT_DROP_FRACTION * fontSizePx : SUPERSCRIPT_RISE_FRACTION * fontSizePx;
      return `<tspan baseline-shift="${Number(shift.toFixed(2))}" font-size="${scriptSize}">${text}</tspan>`;
    })
    .join('');
}

/**
 * Rough width of a rendered label, for placing legends and margins (the real
 * width depends on the font the viewer picks).
 *
 * @param source label text in candela's TeX subset
 * @param fontSizePx font size (px)
 * @returns estimated width (px)
 * @example estimateTextWidthPx('Pantheon', 10) // 44.8
 */
export function estimateTextWidthPx(source: string, fontSizePx: number): number {
  let width = 0;
  for (const segment of parseRichText(source)) {
    const size = segment.shift === 'base' ? fontSizePx : fontSizePx * SCRIPT_SIZE_FRACTION;
    width += [...segment.text].length * size * AVERAGE_GLYPH_WIDTH_FRACTION;
  }
  return Number(width.toFixed(2));
}

/**
 * Rough width of plain text (no markup), for layout only.
 *
 * @param text the text as it will be shown
 * @param fontSizePx font size (px)
 * @returns estimated width (px)
 * @example estimatePlainTextWidthPx('low_z', 10) // 28
 */
export function estimatePlainTextWidthPx(text: string, fontSizePx: number): number {
  return Number(([...text].length * fontSizePx * AVERAGE_GLYPH_WIDTH_FRACTION).toFixed(2));
}
