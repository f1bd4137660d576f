/** Coordinates are written with two decimals: 0.01 px is far below what a screen or printer resolves. */
const PIXEL_DECIMALS = 2;
const PIXEL_SCALE = 10 ** PIXEL_DECIMALS;

/**
 * Writes a pixel coordinate for an SVG attribute or path: rounded to 0.01 px,
 * trailing zeros dropped, never `-0`, never `NaN` (a non-finite value is
 * written as `0`; callers skip non-finite data points before drawing).
 *
 * @param valuePx coordinate in SVG user units (px)
 * @returns the shortest decimal text of the rounded value
 * @example formatPixels(12.3456) // '12.35'
 */
export function formatPixels(valuePx: number): string {
  if (!Number.isFinite(valuePx)) return '0';
  const rounded = Math.round(valuePx * PIXEL_SCALE) / PIXEL_SCALE;
  return Object.is(rounded, -0) || rounded === 0 ? '0' : String(rounded);
}
