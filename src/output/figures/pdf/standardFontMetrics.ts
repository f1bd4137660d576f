/**
 * Advance widths (1/1000 em) of the PDF standard Type 1 fonts Helvetica,
 * Times-Roman and Symbol, which every PDF reader provides (ISO 32000-1,
 * section 9.6.2.2), so candela's PDF figures embed no font. Read from the
 * AFM files of the URW base-35 fonts (Nimbus Sans, Nimbus Roman, Standard
 * Symbols PS), whose metrics match Adobe's core fonts glyph for glyph.
 * Used to place centred and right-aligned text exactly.
 */

/** Widths of the printable ASCII characters 32..126, in code order (1/1000 em). */
export interface LatinFontWidths {
  ascii: readonly number[];
  /** [Unicode code point, WinAnsiEncoding byte, width] for the non-ASCII characters candela writes. */
  extras: readonly (readonly [number, number, number])[];
}

/** Helvetica (sans serif). */
export const HELVETICA_WIDTHS: LatinFontWidths = {
  ascii: [278, 278, 355, 556, 556, 889, 667, 222, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556, 556, 556, 556, 556, 556, 556, 556, 278, 278, 584, 584, 584, 556, 1015, 667, 667, 722, 722, 667, 611, 778, 722, 278, 500, 667, 556, 833, 722, 778, 667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469, 556, 222, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500, 222, 833, 556, 556, 556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584],
  extras: [[0xb7, 0xb7, 278], [0xb1, 0xb1, 584], [0xd7, 0xd7, 584], [0x2013, 0x96, 556], [0x2014, 0x97, 1000], [0xb0, 0xb0, 400], [0xb2, 0xb2, 333], [0xb3, 0xb3, 333], [0xe9, 0xe9, 556], [0xfc, 0xfc, 556], [0xf6, 0xf6, 556], [0xe4, 0xe4, 556], [0x2019, 0x92, 222], [0x2018, 0x91, 222], [0x201c, 0x93, 333], [0x201d, 0x94, 333], [0x2026, 0x85, 1000], [0xa0, 0xa0, 278]],
};

/** Times-Roman (serif). */
export const TIMES_ROMAN_WIDTHS: LatinFontWidths = {
  ascii: [250, 333, 408, 500, 500, 833, 778, 333, 333, 333, 500, 564, 250, 333, 250, 278, 500, 500, 500, 500, 500, 500, 500, 500, 500, 500, 278, 278, 564, 564, 564, 444, 921, 722, 667, 667, 722, 611, 556, 722, 722, 333, 389, 722, 611, 889, 722, 722, 556, 722, 667, 556, 611, 722, 722, 944, 722, 722, 611, 333, 278, 333, 469, 500, 333, 444, 500, 444, 500, 444, 333, 500, 500, 278, 278, 500, 278, 778, 500, 500, 500, 500, 333, 389, 278, 500, 500, 722, 500, 500, 444, 480, 200, 480, 541],
  extras: [[0xb7, 0xb7, 250], [0xb1, 0xb1, 564], [0xd7, 0xd7, 564], [0x2013, 0x96, 500], [0x2014, 0x97, 1000], [0xb0, 0xb0, 400], [0xb2, 0xb2, 300], [0xb3, 0xb3, 300], [0xe9, 0xe9, 444], [0xfc, 0xfc, 500], [0xf6, 0xf6, 500], [0xe4, 0xe4, 444], [0x2019, 0x92, 333], [0x2018, 0x91, 333], [0x201c, 0x93, 444], [0x201d, 0x94, 444], [0x2026, 0x85, 1000], [0xa0, 0xa0, 250]],
};

/** Symbol font: [Unicode code point, Symbol byte, width] for Greek letters and mathematical signs. */
export const SYMBOL_GLYPHS: readonly (readonly [number, number, number])[] = [
  [0x391, 0x41, 722], [0x392, 0x42, 667], [0x393, 0x47, 603], [0x394, 0x44, 612], [0x395, 0x45, 611], [0x396, 0x5a, 611], [0x397, 0x48, 722], [0x398, 0x51, 741], [0x399, 0x49, 333], [0x39a, 0x4b, 722], [0x39b, 0x4c, 686], [0x39c, 0x4d, 889], [0x39d, 0x4e, 722], [0x39e, 0x58, 645], [0x39f, 0x4f, 722], [0x3a0, 0x50, 768], [0x3a1, 0x52, 556], [0x3a3, 0x53, 592], [0x3a4, 0x54, 611], [0x3a5, 0x55, 690], [0x3a6, 0x46, 763], [0x3a7, 0x43, 722], [0x3a8, 0x59, 795], [0x3a9, 0x57, 768], [0x3b1, 0x61, 631], [0x3b2, 0x62, 549], [0x3b3, 0x67, 411], [0x3b4, 0x64, 494], [0x3b5, 0x65, 439], [0x3b6, 0x7a, 494], [0x3b7, 0x68, 603], [0x3b8, 0x71, 521], [0x3b9, 0x69, 329], [0x3ba, 0x6b, 549], [0x3bb, 0x6c, 549], [0x3bc, 0x6d, 576], [0x3bd, 0x6e, 521], [0x3be, 0x78, 493], [0x3bf, 0x6f, 549], [0x3c0, 0x70, 549], [0x3c1, 0x72, 549], [0x3c2, 0x56, 439], [0x3c3, 0x73, 603], [0x3c4, 0x74, 439], [0x3c5, 0x75, 576], [0x3c6, 0x66, 521], [0x3c7, 0x63, 549], [0x3c8, 0x79, 686], [0x3c9, 0x77, 686], [0x2190, 0xac, 987], [0x2191, 0xad, 603], [0x2192, 0xae, 987], [0x2193, 0xaf, 603], [0x2202, 0xb6, 494], [0x2208, 0xce, 713], [0x2211, 0xe5, 713], [0x2212, 0x2d, 549], [0x221a, 0xd6, 549], [0x221d, 0xb5, 713], [0x221e, 0xa5, 713], [0x223c, 0x7e, 549], [0x2248, 0xbb, 549], [0x2260, 0xb9, 549], [0x2264, 0xa3, 549], [0x2265, 0xb3, 549], [0x2282, 0xcc, 713],
];
