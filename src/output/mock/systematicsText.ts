import { csvField } from '../density/csvField.js';
import { significantDigits } from './mockNumberText.js';

/** Systematic modes U: N rows (supernovae) of K shifts, mag, row major (the data layer's SystematicModes has this shape). */
export interface ModeColumns {
  count: number;
  modeCount: number;
  values: Float64Array;
}

/**
 * A covariance matrix as text: the first line N, then one row of N values
 * (7 significant digits, space-separated) per line, the form
 * readCovarianceMatrix reads. Cost O(N^2).
 * @param values N x N, row major, mag^2.
 * @param n the size N.
 * @returns the text, ending in a line break.
 * @throws nothing.
 * @example covarianceMatrixText(Float64Array.of(1, 0, 0, 2), 2) // '2\n1.000000e+0 0\n0 2.000000e+0\n'
 */
export function covarianceMatrixText(values: Float64Array, n: number): string {
  const lines = [String(n)];
  const row: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) row[j] = significantDigits(values[i * n + j]);
    lines.push(row.join(' '));
  }
  return `${lines.join('\n')}\n`;
}

/**
 * Modes U as CSV (RFC 4180): a header of mode names, then one row of K
 * shifts (mag, 7 significant digits) per supernova, the form
 * readSystematicModes reads. Cost O(N K).
 * @param modes U.
 * @param names the K mode names.
 * @returns the CSV text, ending in a line break.
 * @throws nothing.
 * @example systematicModesCsv({ count: 1, modeCount: 1, values: Float64Array.of(0.01) }, ['drift']) // 'drift\n1.000000e-2\n'
 */
export function systematicModesCsv(modes: ModeColumns, names: readonly string[]): string {
  const k = modes.modeCount;
  const lines = [names.map(csvField).join(',')];
  const row: string[] = new Array(k);
  for (let i = 0; i < modes.count; i++) {
    for (let j = 0; j < k; j++) row[j] = significantDigits(modes.values[i * k + j]);
    lines.push(row.join(','));
  }
  return `${lines.join('\n')}\n`;
}
