import { CandelaError } from '../../errors.js';
import { analyzeRun, type RunAnalysis } from '../report/analyzeRun.js';
import { readRunFolder, type RunOnDisk } from '../run/runFiles.js';

/** A run folder read back together with its analysis. */
export interface AnalyzedRun {
  run: RunOnDisk;
  analysis: RunAnalysis;
}

/**
 * Reads and analyzes the run folders given to `candela compare`; their model
 * labels name the rows of the comparison, so they must differ.
 *
 * Cost: one analyzeRun per folder.
 * @param runDirs run folders written by `candela fit` (ensemble or nested).
 * @returns the runs in the given order.
 * @throws CandelaError `compare.no_runs` for an empty list, `compare.duplicate_label`
 *   when two folders hold the same model label; the errors of readRunFolder and analyzeRun.
 * @example readComparedRuns(['out/p/flat_lcdm', 'out/p/flat_wcdm']).map((r) => r.run.record.model.label)
 */
export function readComparedRuns(runDirs: readonly string[]): AnalyzedRun[] {
  if (runDirs.length === 0) {
    throw new CandelaError({ code: 'compare.no_runs', message: 'no run folder was given', expected: 'one or more run folders written by `candela fit`', fix: 'list the run folders to compare' });
  }
  // Every run is held until the comparison is written: they share one chain budget (readRunFolder).
  const runs = runDirs.map((dir) => readRunFolder(dir, { sharedBy: runDirs.length }));
  const seen = new Map<string, string>();
  for (const run of runs) {
    const label = run.record.model.label;
    const earlier = seen.get(label);
    if (earlier !== undefined) {
      throw new CandelaError({
        code: 'compare.duplicate_label', file: run.dir, message: `the runs in ${earlier} and ${run.dir} both fit a model labelled ${label}`,
        expected: 'one run per model label', found: label, fix: 'compare runs of differently labelled models (rename one model in its configuration and refit)',
      });
    }
    seen.set(label, run.dir);
  }
  return runs.map((run) => ({ run, analysis: analyzeRun(run) }));
}
