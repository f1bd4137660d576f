import { crc32 } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { svgDocument, svgElement, svgToPng, triangleFigure } from '../../../src/output/figures/index.js';
import { gaussianContours, gaussianMarginals } from './gaussianPosterior.js';
import { countDarkPixels, decodePng, pngSize } from './pngImage.js';

const spec = { parameters: ['omega_m', 'w0'], means: [0.3, -1], sigmas: [0.03, 0.1] };

describe('svgToPng', () => {
  it('writes a PNG of the requested width whose IHDR keeps the aspect ratio (W3C PNG spec, section 11.2.2)', () => {
    const svg = triangleFigure([{ label: 'run', marginals: gaussianMarginals(spec), contours: gaussianContours(spec) }], spec.parameters, { panelPx: 120 });
    const [width, height] = [/ width="([\d.]+)"/, / height="([\d.]+)"/].map((pattern) => Number(pattern.exec(svg)?.[1]));
    const png = svgToPng(svg, 2 * width);
    const header = pngSize(png);
    // Twice as wide, so twice as high (rounded to a whole pixel).
    expect(header.width).toBe(2 * width);
    expect(Math.abs(header.height - 2 * height)).toBeLessThanOrEqual(1);
  });

  it('renders text: a label in the figure font stack leaves dark pixels, and so does an unknown font family', () => {
    for (const family of ["'Helvetica Neue', Helvetica, Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif", 'NoSuchFontFamily']) {
      const text = svgElement('text', { x: 10, y: 40, 'font-size': 32, 'font-family': family, fill: '#000000' }, 'Ωm 0.3');
      const image = decodePng(svgToPng(svgDocument(200, 60, 'text', [], [text]), 200));
      // Glyphs of 32 px cover hundreds of pixels; an empty page has none darker than 100/255.
      expect(countDarkPixels(image, 100)).toBeGreaterThan(200);
    }
    const blank = decodePng(svgToPng(svgDocument(200, 60, 'blank', [], []), 200));
    expect(countDarkPixels(blank, 100)).toBe(0);
  });

  it('records the print resolution in a pHYs chunk right after IHDR, with a valid CRC (PNG spec ISO/IEC 15948, 11.3.5.3; CRC checked with node:zlib)', () => {
    // A 326.4 px (3.4 in) wide figure rendered at 300 dpi is 1020 px wide.
    const png = svgToPng(svgDocument(326.4, 200, 'single column', [], []), { dotsPerInch: 300 });
    expect(pngSize(png).width).toBe(1020);
    const ihdrLength = png.readUInt32BE(8);
    const offset = 8 + 12 + ihdrLength;
    expect(png.toString('latin1', offset + 4, offset + 8)).toBe('pHYs');
    expect(png.readUInt32BE(offset)).toBe(9);
    // 300 / 0.0254 = 11811.02 pixels per metre, rounded (unit specifier 1 = metre).
    expect(png.readUInt32BE(offset + 8)).toBe(11811);
    expect(png.readUInt32BE(offset + 12)).toBe(11811);
    expect(png.readUInt8(offset + 16)).toBe(1);
    expect(png.readUInt32BE(offset + 17)).toBe(crc32(png.subarray(offset + 4, offset + 17)));
    expect(png.toString('latin1').split('pHYs').length - 1).toBe(1);
    decodePng(png);
  });

  it('records the resolution implied by a pixel width: 1200 px for a 600 px (6.25 in) figure is 192 dpi', () => {
    const png = svgToPng(svgDocument(600, 100, 'wide', [], []), 1200);
    const offset = 8 + 12 + png.readUInt32BE(8);
    expect(png.readUInt32BE(offset + 8)).toBe(Math.round(192 / 0.0254));
  });

  it('throws figure.bad_png_width for a width that is not a whole number of pixels in range', () => {
    expect(() => svgToPng(svgDocument(10, 10, 'x', [], []), 0)).toThrow(/whole number/);
    expect(() => svgToPng(svgDocument(10, 10, 'x', [], []), 10.5)).toThrow(/whole number/);
  });

  it('throws figure.bad_svg for text that is not SVG', () => {
    expect(() => svgToPng('<html></html>', 100)).toThrow(/could not be rendered/);
  });
});
