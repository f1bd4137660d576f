import { closeSync, fsyncSync, openSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { CandelaError } from '../errors.js';

/** Counts temporary files of this process, so that two writes never share a name. */
let temporaryCounter = 0;

/**
 * Writes a file so that readers see either the old content or the whole new
 * content, never a part: the data go to a temporary file in the same folder
 * (`.<name>.<pid>.<n>.tmp`), are flushed to disk (fsync), and the temporary
 * file is renamed over the target (rename is atomic within one file system
 * on POSIX). The folder is then flushed too, where the platform allows it,
 * so that the rename survives a crash. On failure the temporary file is
 * removed and the target is left as it was.
 *
 * Cost: one write, two fsyncs, one rename.
 * @param path target file (its folder must exist).
 * @param content text (written as UTF-8) or bytes.
 * @throws CandelaError `output.write_failed` naming the file, with the system message.
 * @example writeFileAtomic('out/run/summary.md', summaryMarkdown(summary))
 */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  const folder = dirname(path);
  const temporary = join(folder, `.${basename(path)}.${process.pid}.${temporaryCounter++}.tmp`);
  let descriptor: number | undefined;
  try {
    descriptor = openSync(temporary, 'wx');
    const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
    let written = 0;
    while (written < bytes.length) written += writeSync(descriptor, bytes, written, bytes.length - written);
    fsyncSync(descriptor);
    closeSync(descriptor);
    descriptor = undefined;
    renameSync(temporary, path);
  } catch (error) {
    if (descriptor !== undefined) {
      try { closeSync(descriptor); } catch { /* already reporting the first error */ }
    }
    try { unlinkSync(temporary); } catch { /* the temporary file may not exist */ }
    throw new CandelaError({
      code: 'output.write_failed', file: path, message: `could not write ${path}: ${(error as Error).message}`,
      fix: 'check that the output folder exists, is writable and has free space',
    });
  }
  flushFolder(folder);
}

/** fsync of a folder; some platforms (Windows) and file systems refuse it, which only weakens crash safety. */
function flushFolder(folder: string): void {
  let descriptor: number | undefined;
  try {
    descriptor = openSync(folder, 'r');
    fsyncSync(descriptor);
  } catch {
    // Not supported here: the rename is still atomic for readers.
  } finally {
    if (descriptor !== undefined) closeSync(descriptor);
  }
}
