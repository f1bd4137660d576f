import { readFileSync } from 'node:fs';
import { CandelaError } from '../errors.js';

/**
 * Reads a text file and returns its lines (index 0 is line 1), without line
 * breaks (LF or CRLF) and without a leading byte-order mark.
 * Cost: one read of the file.
 * @param file path to read.
 * @param displayName how to name the file in messages.
 * @throws CandelaError `data.file_not_found` or `data.file_unreadable`.
 * @example readTextLines('../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt', 'sys')[0] // '40'
 */
export function readTextLines(file: string, displayName: string): string[] {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const missing = code === 'ENOENT';
    throw new CandelaError({
      code: missing ? 'data.file_not_found' : 'data.file_unreadable',
      message: missing ? 'the file does not exist' : `the file cannot be read (${code ?? String(error)})`,
      file: displayName,
      fix: missing ? 'check the path; relative paths are resolved from the directory candela runs in' : 'check that the path names a readable file, not a directory',
    });
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const lines = text.split(/\r?\n/);
  if (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  return lines;
}
