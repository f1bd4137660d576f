import { existsSync } from 'node:fs';
import { basename, dirname, join, relative } from 'node:path';
import { akaikeInformationCriterion, bayesianInformationCriterion } from '../../compare/index.js';
import { modelsIndexHtml, modelsLatex, writeFileAtomic, type ModelColumn } from '../../output/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { RunOnDisk } from '../run/runFiles.js';
import { blindingMarksOfRuns } from '../blinding/blindingMarks.js';
import { plainConfiguration } from '../../config/index.js';
import { RUN_FILES } from '../../output/index.js';

/** File names of the multi-model pages, in the folder that holds the models' run folders. */
export const MODELS_INDEX_FILES = { html: 'index.html', latex: 'models.tex' } as const;

/**
 * One model's column of the side-by-side tables: its summary rows, the
 * chi-square with its p-value, and AIC (Akaike 1974) and BIC (Schwarz 1978)
 * from the best fit's deviance (the chi-square, or -2 ln L without one).
 * @param run the model's run folder read back.
 * @param analysis its analysis.
 * @param indexDir the folder of the index page (links are relative to it).
 * @returns the column.
 * @throws nothing.
 * @example modelColumn(run, analysis, 'out/kestrel').link // 'flat_lcdm/report.html'
 */
export function modelColumn(run: RunOnDisk, analysis: RunAnalysis, indexDir: string): ModelColumn {
  const fit = run.record.best_fit;
  const deviance = fit.chi_square ?? (Number.isFinite(fit.log_likelihood) ? -2 * fit.log_likelihood : null);
  return {
    label: run.record.model.label,
    link: relative(indexDir, join(run.dir, RUN_FILES.report)).split('\\').join('/'),
    parameters: analysis.summary.parameters,
    chiSquare: fit.chi_square,
    degreesOfFreedom: fit.degrees_of_freedom,
    pValue: analysis.goodness?.pValue ?? null,
    aic: deviance === null ? null : akaikeInformationCriterion(deviance, fit.n_free),
    bic: deviance === null ? null : bayesianInformationCriterion(deviance, fit.n_free, fit.n_data),
    warningCount: analysis.warnings.length,
  };
}

/**
 * Writes the index page (index.html) and the LaTeX table with models as
 * columns (models.tex) of several runs into `indexDir`. When any of the runs
 * is blinded, both say so (blindingMarksOfRuns): the page's title, and the
 * table's first comment line and last row, as table.tex does.
 * Cost: O(parameters x models) plus the writes.
 * @param columns the models' columns, in order.
 * @param indexDir where to write.
 * @param records the runs' records (the first one's title and tool version head the page; blinding from all).
 * @returns nothing.
 * @throws Error from the file system.
 * @example writeModelsIndex(columns, 'out/kestrel', runs.map((run) => run.record))
 */
export function writeModelsIndex(columns: readonly ModelColumn[], indexDir: string, records: ReadonlyArray<RunOnDisk['record']>): void {
  const marks = blindingMarksOfRuns(records);
  writeFileAtomic(join(indexDir, MODELS_INDEX_FILES.html), modelsIndexHtml({ title: marks.title(records[0].title), version: records[0].tool.version, models: columns }));
  writeFileAtomic(join(indexDir, MODELS_INDEX_FILES.latex), marks.latex(modelsLatex(columns)));
}

/**
 * The run folders of the other models of a run's configuration, when the run
 * sits in a folder named after its model beside them (the layout `candela
 * fit` writes for several models); the run's own folder included, in the
 * configuration's order. Empty for a single model or another layout.
 * @param run the run folder read back.
 * @returns the sibling run folders that hold a run.json.
 * @throws nothing.
 * @example siblingModelFolders(readRunFolder('out/kestrel/flat_lcdm')) // ['out/kestrel/flat_lcdm', 'out/kestrel/flat_wcdm']
 */
export function siblingModelFolders(run: RunOnDisk): string[] {
  const models = plainConfiguration(run.record.configuration).models ?? [];
  if (models.length < 2 || basename(run.dir) !== run.record.model.label) return [];
  const parent = dirname(run.dir);
  return models.map((model) => join(parent, String(model.label))).filter((dir) => existsSync(join(dir, RUN_FILES.run)));
}
