import { accessSync, closeSync, constants, existsSync, mkdirSync, openSync, readdirSync, rmSync, statSync, unlinkSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { CandelaError } from '../../errors.js';

/** File names inside a run folder. */
export const RUN_FILES = {
  chains: 'chains.csv',
  run: 'run.json',
  checkpoint: 'checkpoint.bin',
  chainRecord: 'chain-record.bin',
  resolvedConfig: 'config.resolved.yaml',
  hubbleData: 'hubble_diagram.csv',
  hubbleModel: 'hubble_model.csv',
  summaryJson: 'summary.json',
  summaryMarkdown: 'summary.md',
  tableLatex: 'table.tex',
  report: 'report.html',
} as const;

/** Name of the empty file that checks that a run folder takes new files (created and removed at once). */
const WRITE_PROBE = '.candela-write-probe';

/** The file-system failure of a run-folder operation as an error the user can act on (exit 2). */
function folderError(dir: string, action: string, error: unknown): CandelaError {
  const code = (error as NodeJS.ErrnoException).code ?? 'unknown';
  const reason = code === 'EACCES' || code === 'EPERM' ? 'permission denied'
    : code === 'EROFS' ? 'the file system is read-only'
      : code === 'ENOSPC' ? 'the disk is full'
        : code === 'ENOTDIR' ? 'a part of the path is a file, not a folder'
          : (error as Error).message;
  return new CandelaError({
    code: 'run.folder_unwritable', file: dir, message: `cannot ${action} the output folder: ${reason} (${code})`,
    fix: 'choose a writable output folder with --out or output.dir, or free space on its disk',
  });
}

/**
 * Makes sure a run may write into `dir`: a missing or empty folder is created;
 * an existing non-empty one needs `force` (its contents are removed) or
 * `resume` (it must hold a checkpoint; a missing or empty folder, left by a
 * run interrupted before its first step, starts afresh; temporary files of
 * writes cut short by a hard stop are removed). Then checks that
 * the folder takes new files by creating and removing an empty probe file,
 * so that a read-only or full disk is reported before any sampling. Never
 * touches the folder's files when it throws, so earlier outputs stay as they
 * were.
 * @param dir the run folder.
 * @param options `force` replaces an existing run, `resume` continues it.
 * @throws CandelaError `run.not_a_folder`, `run.no_checkpoint`, `run.folder_not_empty`, `run.folder_unwritable` (permission, read-only or full file system, with the system code).
 * @example prepareRunFolder('out/demo', { force: false, resume: false })
 */
export function prepareRunFolder(dir: string, options: { force: boolean; resume: boolean }): void {
  const exists = existsSync(dir);
  if (exists && !statSync(dir).isDirectory()) {
    throw new CandelaError({ code: 'run.not_a_folder', file: dir, message: 'the output path exists and is not a folder', fix: 'choose another output folder with --out or output.dir' });
  }
  let entries: string[];
  try {
    entries = exists ? readdirSync(dir) : [];
  } catch (error) {
    throw folderError(dir, 'read', error);
  }
  if (options.resume && entries.length > 0) {
    if (!entries.includes(RUN_FILES.checkpoint)) {
      throw new CandelaError({ code: 'run.no_checkpoint', file: join(dir, RUN_FILES.checkpoint), message: 'there is no checkpoint to resume from', fix: 'run without --resume to start a new run' });
    }
    checkWritable(dir);
    removeTemporaryFiles(dir);
    return;
  }
  if (entries.length > 0 && !options.resume) {
    if (!options.force) {
      throw new CandelaError({
        code: 'run.folder_not_empty', file: dir, message: 'the output folder already holds files and is never overwritten silently',
        fix: 'pass --force to replace it, --resume to continue its run, or choose another folder with --out',
      });
    }
    checkWritable(dir);
    try {
      for (const entry of entries) rmSync(join(dir, entry), { recursive: true, force: true });
    } catch (error) {
      throw folderError(dir, 'empty', error);
    }
  }
  try {
    mkdirSync(dir, { recursive: true });
  } catch (error) {
    throw folderError(dir, 'create', causeInAncestor(dir) ?? error);
  }
  checkWritable(dir);
}

/**
 * Why a folder cannot be created when the system only says ENOENT (a
 * recursive mkdir reports the missing parent, not the read-only or
 * forbidden ancestor): the write-access error of the nearest existing
 * ancestor, or null when it is writable.
 */
function causeInAncestor(dir: string): unknown {
  let ancestor = dirname(resolve(dir));
  while (!existsSync(ancestor) && dirname(ancestor) !== ancestor) ancestor = dirname(ancestor);
  try {
    accessSync(ancestor, constants.W_OK);
    return null;
  } catch (error) {
    return error;
  }
}

/** Names of the temporary files of writeFileAtomic (`.<name>.<pid>.<n>.tmp`). */
const TEMPORARY_FILE = /^\..+\.\d+\.\d+\.tmp$/;

/**
 * Removes the temporary files a run left when it was ended at once (a
 * second Ctrl-C, `kill -9`, a crash) while writing: they never replaced a
 * file (the rename had not happened) and only take space.
 */
function removeTemporaryFiles(dir: string): void {
  try {
    for (const name of readdirSync(dir, { recursive: true }).map(String)) {
      if (TEMPORARY_FILE.test(basename(name))) rmSync(join(dir, name), { force: true });
    }
  } catch (error) {
    throw folderError(dir, 'tidy', error);
  }
}

/** Creates and removes an empty probe file in `dir`; throws `run.folder_unwritable` when the folder takes no new file. */
function checkWritable(dir: string): void {
  const probe = join(dir, WRITE_PROBE);
  try {
    closeSync(openSync(probe, 'w'));
    unlinkSync(probe);
  } catch (error) {
    throw folderError(dir, 'write into', error);
  }
}
