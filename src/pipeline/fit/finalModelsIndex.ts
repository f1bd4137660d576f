import { resolve } from 'node:path';
import { analyzeRun } from '../report/analyzeRun.js';
import { modelColumn, writeModelsIndex } from '../report/modelsIndex.js';
import { readRunFolder, type RunOnDisk } from '../run/runFiles.js';

/**
 * Writes the multi-model pages (index.html and models.tex, see
 * writeModelsIndex) into `indexDir` from the run folders of a configuration's
 * models, read back from disk: what a fit of the models in turn leaves after
 * its last model, written once when models fitted side by side have all
 * ended. A folder that cannot be read or analysed (a model that has not
 * started, or stopped before it had steps enough) is left out, as the
 * in-turn fit leaves it out; with fewer than two models left nothing is
 * written.
 * Cost: one analysis (densities, contours) per model folder.
 * @param folders the models' run folders, in the configuration's order.
 * @param indexDir the folder that holds them (links in the page are relative to it).
 * @returns the number of models in the pages (0 when nothing was written).
 * @throws CandelaError from writing the pages.
 * @example writeFinalModelsIndex(['out/p/flat_lcdm', 'out/p/flat_wcdm'], 'out/p') // 2
 */
export function writeFinalModelsIndex(folders: readonly string[], indexDir: string): number {
  const runs = folders.flatMap((folder): Array<{ run: RunOnDisk; column: ReturnType<typeof modelColumn> }> => {
    try {
      const run = readRunFolder(folder);
      return [{ run, column: modelColumn(run, analyzeRun(run), resolve(indexDir)) }];
    } catch {
      return [];
    }
  });
  if (runs.length < 2) return 0;
  // Marked BLINDED when any model is, as the pages the models' own processes write (writeModelsIndex).
  writeModelsIndex(runs.map((entry) => entry.column), resolve(indexDir), runs.map((entry) => entry.run.record));
  return runs.length;
}

/** When one model's process wrote its final run.json (its outputs start) and when it ended, ms on the system clock. */
export interface OutputsWindow {
  /** True when the model finished (exit 0): its process wrote its outputs and, with its siblings present, the models page. */
  finished: boolean;
  /** Modification time of its final run.json, ms (null when there is none). */
  outputsFromMs: number | null;
  /** When its process ended, ms. */
  endedAtMs: number;
}

/**
 * True when the models page left by the models' own processes is already
 * what writeFinalModelsIndex would write, so the conductor need not read
 * every folder back again. Each finished model, after its outputs, rewrites
 * the page from every sibling folder holding a run.json, its column computed
 * from that run.json and the chain record (both final once the model's
 * outputs start). The page is current when every model finished and the
 * model whose outputs started last did so after every other process had
 * ended: it then read each sibling complete, and no process wrote the page
 * after it. Otherwise (an interrupt, a failure, output phases that overlap)
 * the page must be written again.
 * @param windows one per model of the configuration.
 * @returns whether the page on disk is current.
 * @throws nothing.
 * @example modelsPageIsCurrent([{ finished: true, outputsFromMs: 10, endedAtMs: 20 }, { finished: true, outputsFromMs: 30, endedAtMs: 40 }]) // true
 */
export function modelsPageIsCurrent(windows: readonly OutputsWindow[]): boolean {
  if (windows.length < 2 || windows.some((window) => !window.finished || window.outputsFromMs === null)) return false;
  const last = windows.reduce((latest, window) => ((window.outputsFromMs as number) > (latest.outputsFromMs as number) ? window : latest));
  return windows.every((window) => window === last || window.endedAtMs < (last.outputsFromMs as number));
}
