/**
 * The configuration layer's one contact with the file system: reading a
 * configuration or survey file as text.
 */
import { readFileSync } from 'node:fs';
import type { Issue } from '../errors.js';

/**
 * Reads a UTF-8 text file (a leading byte-order mark removed), or returns the
 * one problem that stops it, saying whether the file is missing, a folder or
 * unreadable.
 * @param path the file, relative to the working folder or absolute.
 * @param what how to name the file in the message, e.g. 'configuration file'.
 * @param missingFix the fix to suggest when the file does not exist.
 * @example readTextFile('configs/jla.yaml', 'configuration file', 'check the path').ok // true
 */
export function readTextFile(path: string, what: string, missingFix: string): { ok: true; text: string } | { ok: false; issue: Issue } {
  try {
    return { ok: true, text: readFileSync(path, 'utf8').replace(/^\uFEFF/, '') };
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'does not exist' : code === 'EISDIR' ? 'is a folder' : `cannot be read (${code ?? String(error)})`;
    return {
      ok: false,
      issue: { code: 'config.unreadable', message: `the ${what} ${reason}`, file: path, fix: code === 'ENOENT' ? missingFix : `give the path of a readable YAML ${what}` },
    };
  }
}
