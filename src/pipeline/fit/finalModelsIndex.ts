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
  const last = runs[runs.length - 1].run.record;
  writeModelsIndex(runs.map((entry) => entry.column), resolve(indexDir), last.title, last.tool.version);
  return runs.length;
}
