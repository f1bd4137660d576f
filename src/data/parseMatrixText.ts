import type { IssueList } from './issueList.js';
import { parseNumberCell } from './parseNumberCell.js';

/**
 * Largest accepted |entry| of a covariance matrix: (10^4)^2, the square of
 * the largest accepted magnitude error (MAX_MAGNITUDE_ERROR_MAG in
 * checkValueBounds.ts). No covariance of magnitudes, light-curve parameters
 * or probe distances comes near it (common practice); larger entries are a
 * unit or overflow mistake that would wreck the Cholesky factor.
 */
export const MAX_ABS_COVARIANCE_ENTRY = 1e8;

/** A square matrix read from text, with the line of each row (flat files: the line of each value). */
export interface ParsedMatrix {
  size: number;
  values: Float64Array;
}

/**
 * Reads a square matrix from text lines in any of these forms: an optional
 * first line holding only the dimension n, followed either by n^2 values one
 * per line (row by row), or by n lines of n values; values are separated by
 * whitespace or commas; blank lines and `#` comments are skipped.
 * A single integer first line counts as the dimension only when exactly n^2
 * values follow it. Cost O(values).
 * @param lines the file's lines (index 0 = line 1).
 * @param displayName file name for messages.
 * @param issues receives non-numeric, non-finite or absurd (beyond
 *   {@link MAX_ABS_COVARIANCE_ENTRY}) values (with line and column) and shape problems (count not a square, rows of unequal length,
 *   dimension line disagreeing with the values).
 * @returns the matrix, or null when it could not be formed.
 * @example parseMatrixText(['2', '1', '0.5', '0.5', '2'], 'c.txt', issues) // { size: 2, values: [1, 0.5, 0.5, 2] }
 */
export function parseMatrixText(lines: readonly string[], displayName: string, issues: IssueList): ParsedMatrix | null {
  const entries: Array<{ line: number; values: number[] }> = [];
  lines.forEach((text, index) => {
    const trimmed = text.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const values: number[] = [];
    for (const match of text.matchAll(/[^\s,]+/g)) {
      const cell = parseNumberCell(match[0]);
      if (cell.kind === 'number' && Math.abs(cell.value) > MAX_ABS_COVARIANCE_ENTRY) {
        issues.add({
          code: 'covariance.absurd_value', file: displayName, line: index + 1, column: (match.index ?? 0) + 1,
          message: 'covariance entry is beyond any physical value', expected: `|entry| <= ${MAX_ABS_COVARIANCE_ENTRY}`, found: match[0],
          fix: 'check the units and the file; regenerate the covariance',
        });
      }
      if (cell.kind === 'number') {
        values.push(cell.value);
        continue;
      }
      values.push(NaN);
      issues.add({
        code: cell.kind === 'non_finite' ? 'covariance.not_finite' : 'covariance.non_numeric', file: displayName,
        line: index + 1, column: (match.index ?? 0) + 1,
        message: cell.kind === 'non_finite' ? 'covariance entry is not finite' : 'covariance entry is not a number',
        expected: 'a finite decimal number', found: match[0], fix: 'regenerate the covariance file; every entry must be a finite number',
      });
    }
    entries.push({ line: index + 1, values });
  });
  const total = entries.reduce((sum, entry) => sum + entry.values.length, 0);
  const first = entries[0];
  let body = entries;
  if (first && first.values.length === 1 && Number.isInteger(first.values[0]) && first.values[0] >= 1) {
    const dimension = first.values[0];
    if (total - 1 === dimension * dimension) body = entries.slice(1);
    else if (!isSquare(total)) {
      issues.add({
        code: 'covariance.not_square', file: displayName, line: first.line,
        message: `the first line gives the dimension ${dimension}, so ${dimension * dimension} values should follow`,
        expected: `${dimension * dimension} values`, found: `${total - 1}`, fix: 'check that the file is complete and holds one whole matrix',
      });
      return null;
    }
  }
  if (body.length === 0) {
    issues.add({ code: 'covariance.empty', file: displayName, message: 'the covariance file holds no values', fix: 'check the path' });
    return null;
  }
  const flat = body.every((entry) => entry.values.length === 1);
  if (flat) {
    const count = body.length;
    if (!isSquare(count)) {
      issues.add({
        code: 'covariance.not_square', file: displayName,
        message: `${count} values cannot fill a square matrix (${count} is not a square number)`,
        expected: 'n^2 values', found: `${count}`, fix: 'check that the file is complete and holds one whole matrix',
      });
      return null;
    }
    return { size: Math.round(Math.sqrt(count)), values: Float64Array.from(body, (entry) => entry.values[0]) };
  }
  const width = body[0].values.length;
  const uneven = body.find((entry) => entry.values.length !== width);
  if (uneven || body.length !== width) {
    issues.add({
      code: 'covariance.not_square', file: displayName, line: uneven?.line ?? body[body.length - 1].line,
      message: uneven
        ? `rows have unequal lengths: line ${body[0].line} has ${width} values but this line has ${uneven.values.length}`
        : `${body.length} rows of ${width} values do not form a square matrix`,
      expected: `${width} rows of ${width} values`, found: uneven ? `${uneven.values.length} values` : `${body.length} rows`,
      fix: 'check that the file is complete and holds one whole matrix',
    });
    return null;
  }
  const values = new Float64Array(width * width);
  body.forEach((entry, row) => values.set(entry.values, row * width));
  return { size: width, values };
}

function isSquare(count: number): boolean {
  const root = Math.round(Math.sqrt(count));
  return count > 0 && root * root === count;
}
