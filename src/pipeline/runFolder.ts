import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError } from '../errors.js';

/** File names inside a run folder. */
export const RUN_FILES = {
  chains: 'chains.csv',
  run: 'run.json',
  checkpoint: 'checkpoint.bin',
  resolvedConfig: 'config.resolved.yaml',
  hubbleData: 'hubble_diagram.csv',
  hubbleModel: 'hubble_model.csv',
  summaryJson: 'summary.json',
  summaryMarkdown: 'summary.md',
  tableLatex: 'table.tex',
  report: 'report.html',
} as const;

/**
 * Makes sure a run may write into `dir`: a missing or empty folder is created;
 * an existing non-empty one needs `force` (its contents are removed) or
 * `resume` (it must hold a checkpoint). Never touches the folder when it
 * throws, so earlier outputs stay as they were.
 */
export function prepareRunFolder(dir: string, options: { force: boolean; resume: boolean }): void {
  const exists = existsSync(dir);
  if (exists && !statSync(dir).isDirectory()) {
    throw new CandelaError({ code: 'run.not_a_folder', file: dir, message: 'the output path exists and is not a folder', fix: 'choose another output folder with --out or output.dir' });
  }
  const entries = exists ? readdirSync(dir) : [];
  if (options.resume) {
    if (!entries.includes(RUN_FILES.checkpoint)) {
      throw new CandelaError({ code: 'run.no_checkpoint', file: join(dir, RUN_FILES.checkpoint), message: 'there is no checkpoint to resume from', fix: 'run without --resume to start a new run' });
    }
    return;
  }
  if (entries.length > 0) {
    if (!options.force) {
      throw new CandelaError({
        code: 'run.folder_not_empty', file: dir, message: 'the output folder already holds files and is never overwritten silently',
        fix: 'pass --force to replace it, --resume to continue its run, or choose another folder with --out',
      });
    }
    for (const entry of entries) rmSync(join(dir, entry), { recursive: true, force: true });
  }
  mkdirSync(dir, { recursive: true });
}
