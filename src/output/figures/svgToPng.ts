import { Resvg } from '@resvg/resvg-js';
import { CandelaError } from '../../errors.js';

/** Largest PNG width accepted (px): 8000 px is 67 cm at 300 dpi, far more than any journal column. */
const MAX_PNG_WIDTH_PX = 8000;
/** Family used for any text whose font stack resolves to nothing on this machine. */
const FALLBACK_FONT_FAMILY = 'DejaVu Sans';

/**
 * Rasterizes an SVG figure to PNG with the resvg renderer, scaled to the
 * requested width (height follows the aspect ratio) on a white background.
 * System fonts are loaded; text whose families are all missing falls back to
 * DejaVu Sans, then to whatever sans-serif face the system has.
 *
 * Cost: proportional to the number of output pixels; tens of milliseconds for a 1200 px figure.
 *
 * @param svg an SVG document (e.g. from triangleFigure)
 * @param widthPx output width (px, integer 1..8000)
 * @returns the PNG file bytes
 * @throws CandelaError `figure.bad_png_width` for a width out of range; `figure.bad_svg` when the renderer rejects the SVG
 * @example svgToPng(triangleFigure(runs, ['omega_m', 'w0']), 1200) // Buffer starting with 0x89 'PNG'
 */
export function svgToPng(svg: string, widthPx: number): Buffer {
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
      font: { loadSystemFonts: true, defaultFontFamily: FALLBACK_FONT_FAMILY, sansSerifFamily: FALLBACK_FONT_FAMILY },
    });
    return renderer.render().asPng();
  } catch (error) {
    throw new CandelaError({
      code: 'figure.bad_svg',
      message: `the SVG could not be rendered: ${error instanceof Error ? error.message : String(error)}`,
    });
  }
}
