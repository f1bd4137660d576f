import { readFileSync } from 'node:fs';
import { CandelaError } from '../errors.js';
import type { Issue } from '../errors.js';

/**
 * Reads redshifts from a text file: one per line, or a column of a CSV /
 * whitespace table with a header line (the column named by `column`, else the
 * only column, else one named z or redshift). Blank lines and lines starting
 * with # are skipped.
 * @param file path (relative to the working directory).
 * @param column header name of the column to use (optional).
 * @throws CandelaError for a missing file, an ambiguous or missing column, or a cell that is not a number (with the line).
 * @example readRedshiftFile('redshifts.txt') // => [0.1, 0.5, 1]
 */
export function readRedshiftFile(file: string, column?: string): number[] {
  let text: string;
  try { text = readFileSync(file, 'utf8'); } catch (error) {
    throw new CandelaError({ code: 'distances.file_unreadable', file, path: 'redshiftFile', message: `cannot read the redshift file (${(error as NodeJS.ErrnoException).code ?? 'error'})`,
      fix: 'check the path; it is resolved from the directory candela runs in' });
  }
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/).map((line, i) => ({ cells: line.trim().split(/\s*[,;\t]\s*|\s+/), line: i + 1, blank: !line.trim() || line.trim().startsWith('#') }))
    .filter((entry) => !entry.blank);
  if (lines.length === 0) throw new CandelaError({ code: 'distances.empty_file', file, path: 'redshiftFile', message: 'the redshift file has no data lines', fix: 'put one redshift per line' });
  const hasHeader = lines[0].cells.some((cell) => cell !== '' && !Number.isFinite(Number(cell)));
  const names = hasHeader ? lines[0].cells : [];
  let index = 0;
  if (column !== undefined || lines[0].cells.length > 1) {
    const wanted = column ?? names.find((name) => /^(z|redshift)$/i.test(name));
    index = wanted === undefined ? -1 : names.indexOf(wanted);
    if (index < 0) {
      throw new CandelaError({ code: 'distances.no_redshift_column', file, line: lines[0].line, path: 'redshiftColumn',
        message: hasHeader ? 'cannot tell which column holds the redshifts' : 'the file has several columns but no header line naming them',
        expected: column ? `a column named ${column}` : 'one column, or a header with a column named z or redshift', found: lines[0].cells.join(', '),
        fix: hasHeader ? 'name the column to use' : 'add a header line, or keep one redshift per line' });
    }
  }
  const issues: Issue[] = [];
  const values = lines.slice(hasHeader ? 1 : 0).map(({ cells, line }) => {
    const value = Number(cells[index]);
    if (cells[index] === undefined || cells[index] === '' || !Number.isFinite(value)) {
      issues.push({ code: 'distances.bad_redshift', file, line, path: 'redshiftFile', message: 'the redshift cell is not a number', found: String(cells[index] ?? ''), fix: 'write the redshift as a plain number, e.g. 0.5' });
    }
    return value;
  });
  if (issues.length) throw new CandelaError(issues);
  return values;
}
