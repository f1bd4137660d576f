/** The typographic minus sign (U+2212), wider than a hyphen and the norm in printed figures. */
const MINUS_SIGN = '\u2212';

/**
 * Writes a tick value with a fixed number of decimals and a real minus sign;
 * `-0` becomes `0`. For log-axis ticks pass `decimals = undefined`, which
 * writes the shortest exact decimal (0.05, 2, 10).
 *
 * @param value tick value (data units)
 * @param decimals digits after the decimal point, or undefined for the shortest form
 * @returns the label text
 * @example formatTickLabel(-0.25, 2) // '−0.25'
 */
export function formatTickLabel(value: number, decimals?: number): string {
  const text = decimals === undefined ? String(Number(value.toPrecision(12))) : value.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? MINUS_SIGN + text.slice(1) : text;
}
