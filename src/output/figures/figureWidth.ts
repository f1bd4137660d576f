/** CSS pixels per inch: figure sizes are in px of 1/96 inch (CSS Values 3, section 6.2). */
export const PX_PER_INCH = 96;

/**
 * Width of a journal column (inches): about 3.4 in for one column of a
 * two-column page and 7 in across both (common practice; e.g. the AAS
 * journals print 3.5 in and 7.1 in, MNRAS 84 mm and 174 mm, from memory).
 */
export const COLUMN_WIDTH_INCHES = { single: 3.4, double: 7.0 } as const;

/** A figure width: one journal column, both columns, or a width in inches. */
export type FigureWidth = 'single' | 'double' | { inches: number };

/**
 * The width of a figure in px (1/96 inch) for a journal column or a width in inches.
 *
 * @param width `single`, `double` or `{ inches }`; undefined keeps the figure's own default
 * @param defaultPx the figure's default width (px)
 * @returns width (px)
 * @example figureWidthPx('single', 640) // 326.4
 */
export function figureWidthPx(width: FigureWidth | undefined, defaultPx: number): number {
  if (width === undefined) return defaultPx;
  const inches = typeof width === 'string' ? COLUMN_WIDTH_INCHES[width] : width.inches;
  return Number.isFinite(inches) && inches > 0 ? Number((inches * PX_PER_INCH).toFixed(2)) : defaultPx;
}
