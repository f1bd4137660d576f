import { escapeXml, parseRichText } from '../figures/index.js';

/**
 * Turns a label in candela's TeX subset (see parseRichText) into inline HTML:
 * escaped text with `<sub>` and `<sup>` for scripts, so `\Omega_{\rm m}`
 * shows as Ω with a subscript m in the report.
 *
 * @param source label text
 * @returns inline HTML
 * @example richTextToHtml('H_0') // 'H<sub>0</sub>'
 */
export function richTextToHtml(source: string): string {
  return parseRichText(source)
    .map((segment) => {
      const text = escapeXml(segment.text);
      return segment.shift === 'sub' ? `<sub>${text}</sub>` : segment.shift === 'super' ? `<sup>${text}</sup>` : text;
    })
    .join('');
}
