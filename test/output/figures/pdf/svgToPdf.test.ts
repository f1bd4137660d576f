import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { svgDocument, svgElement, svgToPdf, svgToPng, triangleFigure } from '../../../../src/output/figures/index.js';
import { decodePng } from '../pngImage.js';
import type { DecodedPng } from '../pngImage.js';
import { gaussianContours, gaussianMarginals } from '../gaussianPosterior.js';

const spec = { parameters: ['omega_m', 'w0'], means: [0.3, -1], sigmas: [0.03, 0.1] };

function hasTool(name: string): boolean {
  try {
    execFileSync(name, ['-v'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

function contentStream(pdf: Buffer): string {
  const text = pdf.toString('latin1');
  const start = text.indexOf('stream\n') + 'stream\n'.length;
  const length = Number(/\/Length (\d+)/.exec(text)?.[1]);
  return inflateSync(pdf.subarray(start, start + length)).toString('latin1');
}

describe('svgToPdf', () => {
  it('writes a PDF whose cross-reference table points at every object (ISO 32000-1, section 7.5.4)', () => {
    const pdf = svgToPdf(svgDocument(200, 100, 'box', [], [svgElement('rect', { x: 10, y: 10, width: 50, height: 20, fill: '#0072b2' })]));
    const text = pdf.toString('latin1');
    expect(text.startsWith('%PDF-1.4\n')).toBe(true);
    expect(text.endsWith('%%EOF\n')).toBe(true);
    const startXref = Number(/startxref\n(\d+)\n%%EOF\n$/.exec(text)?.[1]);
    expect(text.slice(startXref, startXref + 4)).toBe('xref');
    const entries = [...text.slice(startXref).matchAll(/^(\d{10}) 00000 n $/gm)].map((match) => Number(match[1]));
    expect(entries.length).toBe(7);
    entries.forEach((offset, index) => expect(text.slice(offset, offset + `${index + 1} 0 obj`.length)).toBe(`${index + 1} 0 obj`));
  });

  it('sizes the page at 72 pt per 96 px, so a 3.4 in wide figure is a 3.4 in wide page (CSS Values 3, section 6.2)', () => {
    const pdf = svgToPdf(svgDocument(326.4, 240, 'single column', [], []));
    expect(pdf.toString('latin1')).toContain('/MediaBox [0 0 244.8 180]');
  });

  it('draws a rectangle in PDF coordinates: the SVG top-left corner maps to the page top-left through one flip', () => {
    const stream = contentStream(svgToPdf(svgDocument(200, 100, 'box', [], [svgElement('rect', { x: 10, y: 10, width: 50, height: 20, fill: '#ff0000' })])));
    expect(stream.split('\n')[0]).toBe('0.75 0 0 -0.75 0 75 cm');
    expect(stream).toContain('1 0 0 rg');
    expect(stream).toContain('10 10 50 20 re');
  });

  it('writes opacity through a graphics state with /ca and /CA (ISO 32000-1, table 58)', () => {
    const pdf = svgToPdf(svgDocument(50, 50, 'faint', [], [svgElement('path', { d: 'M0 0L10 10', stroke: '#000000', 'stroke-opacity': 0.4, fill: 'none' })]));
    expect(pdf.toString('latin1')).toContain('/A0 << /Type /ExtGState /ca 1 /CA 0.4 >>');
    expect(contentStream(pdf)).toContain('/A0 gs');
  });

  it('uses Times-Roman when the figure asks for a serif family, Helvetica otherwise, and Symbol for Greek', () => {
    const label = svgElement('text', { x: 5, y: 20, 'font-size': 12 }, 'Ω');
    const serif = svgDocument(50, 50, 'serif', [], [label]).replace(/font-family="[^"]*"/, 'font-family="Times, serif"');
    expect(svgToPdf(serif).toString('latin1')).toContain('/BaseFont /Times-Roman');
    const sans = svgToPdf(svgDocument(50, 50, 'sans', [], [label]));
    expect(sans.toString('latin1')).toContain('/BaseFont /Helvetica ');
    // Omega is the letter W in the Symbol font's encoding (Adobe Symbol encoding, from memory).
    expect(contentStream(sans)).toContain('/FS 12 Tf 0 Ts (W) Tj');
  });

  it('centres text with the Helvetica advance widths: "00" is 2 x 556/1000 em wide (Adobe Helvetica metrics, from memory)', () => {
    const stream = contentStream(svgToPdf(svgDocument(100, 50, 'centred', [], [svgElement('text', { x: 50, y: 20, 'font-size': 10, 'text-anchor': 'middle' }, '00')])));
    // width 11.12 px, so the text starts at 50 - 5.56 = 44.44 px.
    expect(stream).toContain('1 0 0 -1 44.44 20 Tm');
  });

  it('draws Unicode superscripts (km s⁻¹) as raised, smaller characters, since the standard fonts lack them', () => {
    const stream = contentStream(svgToPdf(svgDocument(100, 50, 'unit', [], [svgElement('text', { x: 5, y: 20, 'font-size': 10 }, 's⁻¹')])));
    // 0.72 of 10 px, raised by 0.36 x 10 px; the minus is byte 0x2D of the Symbol font (Adobe Symbol encoding, from memory).
    expect(stream).toContain('/FL 10 Tf 0 Ts (s) Tj\n/FS 7.2 Tf 3.6 Ts (-) Tj\n/FL 7.2 Tf 3.6 Ts (1) Tj');
  });

  it('is byte-for-byte reproducible (no date in the file)', () => {
    const svg = triangleFigure([{ label: 'run', marginals: gaussianMarginals(spec), contours: gaussianContours(spec) }], spec.parameters);
    expect(svgToPdf(svg).equals(svgToPdf(svg))).toBe(true);
  });

  it('is read by poppler: pdfinfo gives the page size and pdftotext finds the axis labels (skipped without poppler-utils)', (context) => {
    if (!hasTool('pdfinfo') || !hasTool('pdftotext')) {
      context.skip('poppler-utils (pdfinfo, pdftotext) is not installed');
      return;
    }
    const svg = triangleFigure([{ label: 'mock run', marginals: gaussianMarginals(spec), contours: gaussianContours(spec) }], spec.parameters);
    const width = Number(/width="([\d.]+)"/.exec(svg)?.[1]);
    const height = Number(/height="([\d.]+)"/.exec(svg)?.[1]);
    const folder = mkdtempSync(join(tmpdir(), 'candela-pdf-'));
    try {
      const file = join(folder, 'triangle.pdf');
      writeFileSync(file, svgToPdf(svg));
      const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' });
      const size = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
      expect(Number(size?.[1])).toBeCloseTo(width * 0.75, 1);
      expect(Number(size?.[2])).toBeCloseTo(height * 0.75, 1);
      const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
      expect(text).toContain('mock run');
      // Poppler maps the Symbol glyph Omega to U+03A9 or to the ohm sign U+2126, depending on its version.
      expect(text).toMatch(/[\u03a9\u2126]m/);
      expect(text).toContain('\u22121.0');
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('looks like the SVG: the PDF drawn by poppler and the SVG drawn by resvg agree block by block (skipped without poppler-utils)', (context) => {
    if (!hasTool('pdftoppm')) {
      context.skip('poppler-utils (pdftoppm) is not installed');
      return;
    }
    // Two independent renderers of the same figure: darkness averaged over 16 x 16 px blocks (0 white,
    // 1 black) must agree within 0.01 on average and 0.08 in the worst block (poppler widens hairlines to
    // a whole device pixel, which darkens blocks holding a 0.75 px frame line by about 0.03). Text is left
    // out (the fonts differ: Helvetica in the PDF, the system's sans in the PNG); pdftotext checks it above.
    const spec3 = { parameters: ['omega_m', 'w0', 'wa'], means: [0.3, -1, 0], sigmas: [0.03, 0.1, 0.5], correlations: { '1,2': -0.7 } };
    const svg = triangleFigure([{ label: 'mock run', marginals: gaussianMarginals(spec3), contours: gaussianContours(spec3) }], spec3.parameters, { reference: { omega_m: 0.3, w0: -1 } })
      .replace(/<text\b[^>]*>[\s\S]*?<\/text>/g, '');
    const width = Number(/width="([\d.]+)"/.exec(svg)?.[1]);
    const folder = mkdtempSync(join(tmpdir(), 'candela-pdf-'));
    try {
      writeFileSync(join(folder, 'figure.pdf'), svgToPdf(svg));
      // 96 dpi: one PDF point is 4/3 px, so the page comes out at the SVG's size in px.
      execFileSync('pdftoppm', ['-r', '96', '-png', '-singlefile', join(folder, 'figure.pdf'), join(folder, 'poppler')]);
      const fromPdf = decodePng(readFileSync(join(folder, 'poppler.png')));
      const fromSvg = decodePng(svgToPng(svg, Math.round(width)));
      expect(Math.abs(fromPdf.width - fromSvg.width)).toBeLessThanOrEqual(1);
      expect(Math.abs(fromPdf.height - fromSvg.height)).toBeLessThanOrEqual(1);
      const block = 16;
      const darkness = (image: DecodedPng, bx: number, by: number) => {
        let sum = 0;
        let count = 0;
        for (let y = by * block; y < Math.min((by + 1) * block, image.height); y++) {
          for (let x = bx * block; x < Math.min((bx + 1) * block, image.width); x++) {
            const at = (y * image.width + x) * image.channels;
            sum += 1 - (image.pixels[at] + image.pixels[at + 1] + image.pixels[at + 2]) / (3 * 255);
            count++;
          }
        }
        return sum / count;
      };
      let worst = 0;
      let total = 0;
      let inked = 0;
      const columns = Math.floor(Math.min(fromPdf.width, fromSvg.width) / block);
      const rows = Math.floor(Math.min(fromPdf.height, fromSvg.height) / block);
      for (let by = 0; by < rows; by++) {
        for (let bx = 0; bx < columns; bx++) {
          const [a, b] = [darkness(fromPdf, bx, by), darkness(fromSvg, bx, by)];
          worst = Math.max(worst, Math.abs(a - b));
          total += Math.abs(a - b);
          if (b > 0.02) inked++;
        }
      }
      expect(inked).toBeGreaterThan(50);
      expect(total / (rows * columns)).toBeLessThan(0.01);
      expect(worst).toBeLessThan(0.08);
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
