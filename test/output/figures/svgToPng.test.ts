import { describe, expect, it } from 'vitest';
import { svgDocument, svgElement, svgToPng, triangleFigure } from '../../../src/output/figures/index.js';
import { gaussianContours, gaussianMarginals } from './gaussianPosterior.js';
import { countDarkPixels, decodePng, pngSize } from './pngImage.js';

const spec = { parameters: ['omega_m', 'w0'], means: [0.3, -1], sigmas: [0.03, 0.1] };

describe('svgToPng', () => {
  it('writes a PNG of the requested width whose IHDR keeps the aspect ratio (W3C PNG spec, section 11.2.2)', () => {
    const svg = triangleFigure([{ label: 'run', marginals: gaussianMarginals(spec), contours: gaussianContours(spec) }], spec.parameters, { panelPx: 120 });
    const png = svgToPng(svg, 648);
    const header = pngSize(png);
    // The figure is 324 x 306 px; scaled to 648 px wide it is 612 px high (by hand).
    expect(header.width).toBe(648);
    expect(header.height).toBe(612);
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

  it('throws figure.bad_png_width for a width that is not a whole number of pixels in range', () => {
    expect(() => svgToPng(svgDocument(10, 10, 'x', [], []), 0)).toThrow(/whole number/);
    expect(() => svgToPng(svgDocument(10, 10, 'x', [], []), 10.5)).toThrow(/whole number/);
  });

  it('throws figure.bad_svg for text that is not SVG', () => {
    expect(() => svgToPng('<html></html>', 100)).toThrow(/could not be rendered/);
  });
});
