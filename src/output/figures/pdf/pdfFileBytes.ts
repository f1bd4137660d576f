import { deflateSync } from 'node:zlib';

/** What goes on the single page of a figure PDF. */
export interface PdfPageContent {
  /** Page size (PostScript points, 1/72 inch). */
  widthPt: number;
  heightPt: number;
  /** The page's content stream (PDF operators, one byte per character). */
  content: string;
  /** Graphics states by resource name, e.g. `A0` -> fill and stroke opacity (0..1). */
  opacityStates: ReadonlyMap<string, { fill: number; stroke: number }>;
  /** Base font of the resource `/FL` (Helvetica or Times-Roman); `/FS` is always Symbol. */
  latinFont: 'Helvetica' | 'Times-Roman';
  /** Document title (document information dictionary). */
  title: string;
}

function pdfString(text: string): string {
  // Literal string with escapes (ISO 32000-1, 7.3.4.2); non-Latin-1 characters become '?'.
  return `(${[...text].map((character) => (character.charCodeAt(0) > 255 ? '?' : character)).join('').replace(/[\\()]/g, (match) => `\\${match}`)})`;
}

/**
 * Assembles a one-page PDF 1.4 file (ISO 32000-1): catalog, page tree, one
 * page with a Flate-compressed content stream, the standard fonts it uses
 * (not embedded; every reader has them), graphics states for opacity, an
 * information dictionary with title and producer, the cross-reference table
 * and trailer. No date is written, so the same figure gives the same bytes.
 *
 * Cost: O(content length) plus the compression.
 *
 * @param page page size (pt), content stream, resources and title
 * @returns the PDF file bytes
 * @example pdfFileBytes({ widthPt: 100, heightPt: 50, content: '0 0 m 10 10 l S', opacityStates: new Map(), latinFont: 'Helvetica', title: 'line' })
 */
export function pdfFileBytes(page: PdfPageContent): Buffer {
  const stream = deflateSync(Buffer.from(page.content, 'latin1'));
  const states = [...page.opacityStates].map(([name, { fill, stroke }]) => `/${name} << /Type /ExtGState /ca ${fill} /CA ${stroke} >>`).join(' ');
  const number = (value: number) => String(Number(value.toFixed(3)));
  const objects: (string | Buffer)[] = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${number(page.widthPt)} ${number(page.heightPt)}] /Resources << /Font << /FL 4 0 R /FS 5 0 R >> /ExtGState << ${states} >> >> /Contents 6 0 R >>`,
    `<< /Type /Font /Subtype /Type1 /BaseFont /${page.latinFont} /Encoding /WinAnsiEncoding >>`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Symbol >>',
    Buffer.concat([Buffer.from(`<< /Length ${stream.length} /Filter /FlateDecode >>\nstream\n`, 'latin1'), stream, Buffer.from('\nendstream', 'latin1')]),
    `<< /Title ${pdfString(page.title)} /Producer (candela) >>`,
  ];
  // The binary comment line marks the file as binary for transfer programs (ISO 32000-1, 7.5.2).
  const parts: Buffer[] = [Buffer.from('%PDF-1.4\n%\xe2\xe3\xcf\xd3\n', 'latin1')];
  let offset = parts[0].length;
  const offsets: number[] = [];
  objects.forEach((body, index) => {
    offsets.push(offset);
    const chunk = Buffer.concat([Buffer.from(`${index + 1} 0 obj\n`, 'latin1'), typeof body === 'string' ? Buffer.from(body, 'latin1') : body, Buffer.from('\nendobj\n', 'latin1')]);
    parts.push(chunk);
    offset += chunk.length;
  });
  // Cross-reference entries are exactly 20 bytes: 10-digit offset, 5-digit generation, type, space + LF (ISO 32000-1, 7.5.4).
  const xref = [`xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`, ...offsets.map((value) => `${String(value).padStart(10, '0')} 00000 n \n`)].join('');
  parts.push(Buffer.from(`${xref}trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Info ${objects.length} 0 R >>\nstartxref\n${offset}\n%%EOF\n`, 'latin1'));
  return Buffer.concat(parts);
}
