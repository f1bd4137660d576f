/**
 * Text of the numbers in comparison tables (private helper of the table
 * writers). Fixed decimals, explicit sign on differences, null as a dash.
 */
import type { ModelComparisonRow } from './modelComparison.js';

/** Decimals of chi-square, criteria and log evidences in tables (0.01 is far below any meaningful difference). */
export const TABLE_DECIMALS = 2;
/** p-values below this are printed in exponent form. */
const EXPONENT_BELOW = 1e-3;

/** A number with fixed decimals, or null when absent. */
export function fixedText(value: number | null): string | null {
  return value === null ? null : value.toFixed(TABLE_DECIMALS);
}

/** A difference with an explicit sign (+0.00 for zero). */
export function signedText(value: number | null): string | null {
  if (value === null) return null;
  const text = Math.abs(value).toFixed(TABLE_DECIMALS);
  return `${value < 0 && Number(text) !== 0 ? '-' : '+'}${text}`;
}

/** "value +- error" parts, or null. */
export function valueAndError(value: number | null, error: number | null): [string, string] | null {
  return value === null ? null : [value.toFixed(TABLE_DECIMALS), (error ?? 0).toFixed(TABLE_DECIMALS)];
}

/** A p-value with three significant digits; exponent form when small. */
export function pValueText(value: number): string {
  return value < EXPONENT_BELOW ? value.toExponential(2) : value.toPrecision(3);
}

/** Short reading for the table column: "strong for wCDM", "negligible" or "base". */
export function shortReading(row: ModelComparisonRow, baseLabel: string): string | null {
  if (row.isBase) return 'base';
  if (row.strength === null) return null;
  if (row.favours === 'neither') return row.strength;
  return `${row.strength} for ${row.favours === 'model' ? row.label : baseLabel}`;
}
