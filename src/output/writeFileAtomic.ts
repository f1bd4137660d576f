import { closeSync, fsyncSync, openSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { CandelaError, isCandelaError } from '../errors.js';

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
 * @throws CandelaError `output.write_failed` naming the file, with the reason (full disk, read-only file system, ...).
 * @example writeFileAtomic('out/run/summary.md', summaryMarkdown(summary))
 */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  writeFileAtomicBy(path, (write) => write(content));
}

/**
 * {@link writeFileAtomic} for content produced piece by piece: `produce`
 * calls `write` as often as it likes, and each piece goes to the temporary
 * file at once, so a file of any size is written in the memory of its
 * largest piece. A piece the disk takes only in part (a disk filling up) is
 * retried until it is written or the system refuses.
 *
 * Cost: one write per piece, two fsyncs, one rename.
 * @param path target file (its folder must exist).
 * @param produce called once with the `write` function; whatever it throws is reported after the temporary file is removed.
 * @throws CandelaError `output.write_failed` as writeFileAtomic; rethrows a CandelaError thrown by `produce`.
 * @example writeFileAtomicBy('out/run/chains.csv', (write) => { write('a,b\n'); write('1,2\n'); })
 */
export function writeFileAtomicBy(path: string, produce: (write: (piece: string | Uint8Array) => void) => void): void {
  const folder = dirname(path);
  const temporary = join(folder, `.${basename(path)}.${process.pid}.${temporaryCounter++}.tmp`);
  let descriptor: number | undefined;
  try {
    const target = openSync(temporary, 'wx');
    descriptor = target;
    produce((piece) => {
      const bytes = typeof piece === 'string' ? Buffer.from(piece, 'utf8') : piece;
      let written = 0;
      while (written < bytes.length) written += writeSync(target, bytes, written, bytes.length - written);
    });
    fsyncSync(target);
    closeSync(target);
    descriptor = undefined;
    renameSync(temporary, path);
  } catch (error) {
    if (descriptor !== undefined) {
      try { closeSync(descriptor); } catch { /* already reporting the first error */ }
    }
    try { unlinkSync(temporary); } catch { /* the temporary file may not exist */ }
    if (isCandelaError(error)) throw error;
    throw writeFailure(path, error);
  }
  flushFolder(folder);
}

/**
 * A file-system error met while writing `path`, as the error the user sees
 * (exit 2): the file, the cause in words with its system code (full disk,
 * read-only file system, permission), and what to do.
 * Cost: O(1).
 * @param path the file being written.
 * @param error what the file system threw.
 * @returns a CandelaError `output.write_failed`.
 * @throws nothing.
 * @example writeFailure('out/run/chains.csv', Object.assign(new Error('no space'), { code: 'ENOSPC' })).issues[0].message // 'could not write out/run/chains.csv: the disk is full (ENOSPC)'
 */
export function writeFailure(path: string, error: unknown): CandelaError {
  return new CandelaError({
    code: 'output.write_failed', file: path, message: `could not write ${path}: ${systemReason(error)}`,
    fix: 'check that the output folder exists, is writable and has free space',
  });
}

/** The system error of a failed write in words, with its code. */
function systemReason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  const words: Record<string, string> = { ENOSPC: 'the disk is full', EDQUOT: 'the disk quota is used up', EROFS: 'the file system is read-only', EACCES: 'permission denied', EPERM: 'permission denied' };
  return code && words[code] ? `${words[code]} (${code})` : (error as Error).message;
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
