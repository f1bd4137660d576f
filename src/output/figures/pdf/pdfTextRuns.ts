import { HELVETICA_WIDTHS, SYMBOL_GLYPHS, TIMES_ROMAN_WIDTHS } from './standardFontMetrics.js';
import type { LatinFontWidths } from './standardFontMetrics.js';

/** The text face of a PDF figure: Helvetica (`sans`) or Times-Roman (`serif`); Greek and mathematical signs come from Symbol. */
export type PdfTextFace = 'sans' | 'serif';

/** A stretch of text drawn in one font: which font, its bytes in that font's encoding, and its advance width (1/1000 em). */
export interface PdfTextRun {
  font: 'latin' | 'symbol';
  /** One byte per character, as a string of char codes 0..255. */
  bytes: string;
  widthPerMille: number;
}

/** Byte written for a character no standard font has: '?' in WinAnsiEncoding. */
const MISSING_BYTE = 0x3f;

const SYMBOL_BY_CODE_POINT = new Map(SYMBOL_GLYPHS.map(([codePoint, byte, width]) => [codePoint, { byte, width }]));

function latinTable(widths: LatinFontWidths): Map<number, { byte: number; width: number }> {
  const table = new Map<number, { byte: number; width: number }>();
  widths.ascii.forEach((width, offset) => table.set(32 + offset, { byte: 32 + offset, width }));
  for (const [codePoint, byte, width] of widths.extras) table.set(codePoint, { byte, width });
  return table;
}

const LATIN_TABLES: Readonly<Record<PdfTextFace, Map<number, { byte: number; width: number }>>> = {
  sans: latinTable(HELVETICA_WIDTHS),
  serif: latinTable(TIMES_ROMAN_WIDTHS),
};

/**
 * Splits text into runs a PDF can show with its standard fonts, which need
 * no embedding (ISO 32000-1, section 9.6.2.2): Latin characters in
 * WinAnsiEncoding with Helvetica or Times-Roman, Greek letters and the
 * minus, less-or-equal and similar signs with the Symbol font. Characters
 * neither has are written as '?'. Widths come from the fonts' metrics, so
 * centred and right-aligned labels land where the SVG puts them.
 *
 * Cost: O(length of the text).
 *
 * @param text the text as shown
 * @param face sans (Helvetica) or serif (Times-Roman)
 * @returns the runs in reading order
 * @example pdfTextRuns('Ωm', 'sans') // [{ font: 'symbol', bytes: 'W', widthPerMille: 768 }, { font: 'latin', bytes: 'm', widthPerMille: 833 }]
 */
export function pdfTextRuns(text: string, face: PdfTextFace): PdfTextRun[] {
  const latin = LATIN_TABLES[face];
  const runs: PdfTextRun[] = [];
  for (const character of text) {
    const codePoint = character.codePointAt(0) ?? MISSING_BYTE;
    const fromLatin = latin.get(codePoint);
    const fromSymbol = fromLatin ? undefined : SYMBOL_BY_CODE_POINT.get(codePoint);
    const font = fromSymbol ? 'symbol' : 'latin';
    const glyph = fromLatin ?? fromSymbol ?? latin.get(MISSING_BYTE) ?? { byte: MISSING_BYTE, width: 500 };
    const last = runs[runs.length - 1];
    if (last && last.font === font) {
      last.bytes += String.fromCharCode(glyph.byte);
      last.widthPerMille += glyph.width;
    } else {
      runs.push({ font, bytes: String.fromCharCode(glyph.byte), widthPerMille: glyph.width });
    }
  }
  return runs;
}
