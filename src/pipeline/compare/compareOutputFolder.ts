import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import { join, relative, resolve, isAbsolute } from 'node:path';
import { CandelaError } from '../../errors.js';

/** True when `inner` is `outer` or lies inside it. */
function isWithin(inner: string, outer: string): boolean {
  const path = relative(resolve(outer), resolve(inner));
  return path === '' || (!path.startsWith('..') && !isAbsolute(path));
}

/**
 * Checks, before any analysis, that `candela compare` may write into
 * `outDir`: it must not be a file, must not be (or hold) one of the compared
 * run folders, and, when it exists and holds files, `force` must be given
 * (an earlier comparison is never overwritten silently). Touches nothing.
 * @param outDir the comparison folder.
 * @param runDirs the compared run folders.
 * @param force whether an existing comparison may be replaced.
 * @throws CandelaError `compare.not_a_folder`, `compare.folder_holds_run`, `compare.folder_not_empty`.
 * @example checkComparisonFolder('out/p/comparison', ['out/p/flat_lcdm', 'out/p/flat_wcdm'], false)
 */
export function checkComparisonFolder(outDir: string, runDirs: readonly string[], force: boolean): void {
  if (existsSync(outDir) && !statSync(outDir).isDirectory()) {
    throw new CandelaError({ code: 'compare.not_a_folder', path: '--out', file: outDir, message: 'the output path exists and is not a folder', fix: 'choose another folder with --out' });
  }
  const held = runDirs.find((dir) => isWithin(dir, outDir));
  if (held) {
    throw new CandelaError({
      code: 'compare.folder_holds_run', path: '--out', file: outDir, message: `the output folder is or holds the compared run folder ${held}, whose files must stay`,
      fix: 'choose a folder of its own with --out (the default is comparison/ next to the first run folder)',
    });
  }
  if (!force && existsSync(outDir) && readdirSync(outDir).length > 0) {
    throw new CandelaError({
      code: 'compare.folder_not_empty', path: '--out', file: outDir, message: 'the output folder already holds files (an earlier comparison?) and is never overwritten silently',
      fix: 'pass --force to replace its contents, or choose another folder with --out',
    });
  }
}

/**
 * Empties the comparison folder (after {@link checkComparisonFolder} allowed
 * it) so that no figure or table of an earlier comparison stays beside the
 * new one; creates it when missing.
 * @param outDir the comparison folder.
 * @example clearComparisonFolder('out/p/comparison')
 */
export function clearComparisonFolder(outDir: string): void {
  if (!existsSync(outDir)) return;
  for (const entry of readdirSync(outDir)) rmSync(join(outDir, entry), { recursive: true, force: true });
}
