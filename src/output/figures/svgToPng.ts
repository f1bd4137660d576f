import { Resvg } from '@resvg/resvg-js';
import { CandelaError } from '../../errors.js';
import { withPngResolution } from './pngResolution.js';

/** Width of a figure's PNG when no print resolution is configured, px: print quality for a figure of about 640 px design width. */
export const DEFAULT_PNG_WIDTH_PX = 1600;
/** Largest PNG width accepted (px): 8000 px is 67 cm at 300 dpi, far more than any journal column. */
const MAX_PNG_WIDTH_PX = 8000;
/** Family used for any text whose font stack resolves to nothing on this machine. */
const FALLBACK_FONT_FAMILY = 'DejaVu Sans';
/** Family used for the generic `serif` when no named serif face is installed. */
const FALLBACK_SERIF_FAMILY = 'DejaVu Serif';
/** CSS pixels per inch: SVG lengths in px are 1/96 inch (CSS Values 3, section 6.2). */
const CSS_PX_PER_INCH = 96;

/** The design width of an SVG figure (px, from the root's width attribute), or NaN. */
function svgWidthPx(svg: string): number {
  return Number.parseFloat(/<svg\b[^>]*?\swidth="([\d.]+)(px)?"/.exec(svg)?.[1] ?? '');
}

/**
 * Rasterizes an SVG figure to PNG with the resvg renderer on a white
 * background, either at a given width in pixels (height follows the aspect
 * ratio) or at a print resolution: `{ dotsPerInch: 300 }` renders a
 * 3.4 in wide figure 1020 px wide. Either way the file records its
 * resolution (a pHYs chunk, see withPngResolution) so that it prints at the
 * figure's design size (1 SVG px = 1/96 in).
 * System fonts are loaded; text whose families are all missing falls back to
 * DejaVu Sans, then to whatever face the system has.
 *
 * Cost: proportional to the number of output pixels; tens of milliseconds for a 1200 px figure.
 *
 * @param svg an SVG document (e.g. from triangleFigure)
 * @param size output width (px, integer 1..8000), or the resolution (pixels per inch)
 * @returns the PNG file bytes
 * @throws CandelaError `figure.bad_png_width` for a width out of range; `figure.bad_svg` when the renderer rejects the SVG
 * @example svgToPng(triangleFigure(runs, ['omega_m', 'w0']), 1200) // Buffer starting with 0x89 'PNG'
 */
export function svgToPng(svg: string, size: number | { dotsPerInch: number }): Buffer {
  const designWidthPx = svgWidthPx(svg);
  const widthPx = typeof size === 'number' ? size : Math.round((designWidthPx / CSS_PX_PER_INCH) * size.dotsPerInch);
  if (!Number.isInteger(widthPx) || widthPx < 1 || widthPx > MAX_PNG_WIDTH_PX) {
    throw new CandelaError({
      code: 'figure.bad_png_width',
      message: 'the PNG width must be a whole number of pixels',
      expected: `an integer from 1 to ${MAX_PNG_WIDTH_PX}`,
      found: String(widthPx),
    });
  }
  try {
    const renderer = new Resvg(svg, {
      background: '#ffffff',
      fitTo: { mode: 'width', value: widthPx },
      font: { loadSystemFonts: true, defaultFontFamily: FALLBACK_FONT_FAMILY, sansSerifFamily: FALLBACK_FONT_FAMILY, serifFamily: FALLBACK_SERIF_FAMILY },
    });
    const png = renderer.render().asPng();
    return designWidthPx > 0 ? withPngResolution(png, (widthPx / designWidthPx) * CSS_PX_PER_INCH) : png;
  } catch (error) {
    if (error instanceof CandelaError) throw error;
    throw new CandelaError({
      code: 'figure.bad_svg',
      message: `the SVG could not be rendered: ${error instanceof Error ? error.message : String(error)}`,
    });
  }
}
