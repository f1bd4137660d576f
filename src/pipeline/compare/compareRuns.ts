import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { compareModels, type NestedModelPair } from '../../compare/index.js';
import { CandelaError, isCandelaError } from '../../errors.js';
import { closestWord } from '../../math/index.js';
import { comparisonJsonText, comparisonMarkdownDetails, dicMissingNotice, writeFileAtomic } from '../../output/index.js';
import { comparisonDocument } from './compareDocument.js';
import { checkComparisonFolder, clearComparisonFolder } from './compareOutputFolder.js';
import { readComparedRuns } from './compareInputs.js';
import { comparedModel } from './compareModelRecord.js';
import { detectNestedPairs, savageDickeyForPair, type DetectedNestedPair, type PairSavageDickey } from './compareNestedPairs.js';
import { rebuildRunModel, type RebuiltRunModel } from './compareRebuildModel.js';
import { writeDarkEnergyFigures } from './darkEnergyFigures.js';
import { storedConfiguration } from '../run/storedConfiguration.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';
import { comparisonBlindingMarks } from '../blinding/comparisonBlindingMarks.js';

/** File names `candela compare` writes. */
export const COMPARISON_FILES = { json: 'comparison.json', markdown: 'comparison.md', latex: 'comparison.tex' } as const;

/** What the caller asks of `candela compare`. */
export interface CompareRequest {
  /** Run folders written by `candela fit` (ensemble or nested sampling). */
  runDirs: string[];
  /** Label of the base model (default: the first run's). */
  baseLabel?: string;
  /** Output folder (created when missing). */
  outDir: string;
  /** Replace the contents of an existing non-empty output folder (default: refuse it). */
  force?: boolean;
}

/** What `candela compare` wrote. */
export interface CompareOutcome {
  outDir: string;
  /** comparison.json's content. */
  document: ReturnType<typeof comparisonDocument>;
  /** Every file written, relative to outDir. */
  files: string[];
  warnings: string[];
}

/**
 * `candela compare`: compares fitted models from their run folders.
 * Reads and analyzes each run, rebuilds each model's likelihood from the
 * run's resolved configuration and input files (their SHA-256 checked
 * against run.json; changes are listed and warned about), and builds per
 * model chi-square at the best fit, N, k, AIC (Akaike 1974), BIC (Schwarz
 * 1978), DIC (Spiegelhalter et al. 2002; deviance D = -2 ln L of every kept
 * draw, D at the posterior mean from the rebuilt likelihood) and ln Z for
 * nested-sampling runs. Nested pairs are found automatically
 * (detectNestedPairs); for each, the Savage-Dickey ratio (Dickey 1971) from
 * the extended run's draws and the delta chi-square significance (Wilks
 * 1938) with its caution. Bayes factors against the base are read on the
 * Kass & Raftery (1995) scale (compareModels). A model whose DIC cannot be
 * computed says why in comparison.json (`dic_missing`), at the top of
 * comparison.md and in the warnings. Writes comparison.json,
 * comparison.md and comparison.tex, and the dark-energy figures
 * (writeDarkEnergyFigures) as SVG and, when the base run's configuration
 * asks for PNG, PNG. Deterministic: seeds derive from the base run's seed.
 *
 * Cost: one analysis and one likelihood rebuild per run, bootstrap
 * Savage-Dickey estimates, a few thousand likelihood evaluations for the figures.
 * @param request run folders, base label, output folder.
 * @returns the document, the files written and the warnings.
 * @throws CandelaError `compare.folder_not_empty` without `force` (checkComparisonFolder), `compare.unknown_model` for a base label no run has; the errors of
 *   readComparedRuns and compareModels (e.g. different data counts); file-system errors.
 * @example compareRuns({ runDirs: ['out/p/flat_lcdm', 'out/p/flat_wcdm'], outDir: 'out/p/comparison' }).document.models[1].delta_aic
 */
export function compareRuns(request: CompareRequest): CompareOutcome {
  checkComparisonFolder(request.outDir, request.runDirs, Boolean(request.force));
  const runs = readComparedRuns(request.runDirs);
  const labels = runs.map(({ run }) => run.record.model.label);
  const baseLabel = request.baseLabel ?? labels[0];
  const baseIndex = labels.indexOf(baseLabel);
  if (baseIndex < 0) {
    const suggestion = closestWord(baseLabel, labels);
    throw new CandelaError({ code: 'compare.unknown_model', path: '--base', message: `no run fits a model labelled ${baseLabel}`, expected: `one of: ${labels.join(', ')}`, found: baseLabel, fix: suggestion ? `did you mean --base ${suggestion}?` : 'give --base one of the runs\' model labels' });
  }
  const seed = `${runs[baseIndex].run.record.run.seed}/compare`;
  const warnings: string[] = [];
  const changedInputs: Array<{ model: string; path: string; recorded: string | null; current: string }> = [];
  const rebuildFailures: Array<string | null> = runs.map(() => null);
  const rebuilt: Array<RebuiltRunModel | null> = runs.map(({ run }, k) => {
    try {
      const result = rebuildRunModel(run);
      for (const change of result.changedInputs) {
        changedInputs.push({ model: run.record.model.label, ...change });
        warnings.push(`${run.record.model.label}: the input file ${change.path} changed since the fit (SHA-256 ${change.current}, recorded ${change.recorded ?? 'none'}); numbers computed from the rebuilt likelihood (DIC, distance bands) use the current file`);
      }
      return result;
    } catch (error) {
      if (!isCandelaError(error)) throw error;
      rebuildFailures[k] = error.issues.map((issue) => `${issue.message}${issue.file ? ` (${issue.file})` : ''}`).join('; ');
      warnings.push(`${run.record.model.label}: the model could not be rebuilt from ${run.dir}: ${rebuildFailures[k]}`);
      return null;
    }
  });
  const models = runs.map((analyzed, k) => {
    const model = comparedModel(analyzed, rebuilt[k]);
    return rebuildFailures[k] === null ? model : { ...model, dicMissing: `${model.dicMissing}: ${rebuildFailures[k]}` };
  });
  for (const model of models) warnings.push(...model.warnings);
  // Blinded runs (docs/blinding.md): a density at the nested value (w0 = -1) of shifted draws is no Bayes factor, so it is withheld.
  const withheld = (pair: DetectedNestedPair): PairSavageDickey | null => {
    const blinded = blindedParametersOf(pair.extended.run.record).filter((name) => pair.extra.some((entry) => entry.name === name));
    return blinded.length ? { ok: false, reason: `withheld while ${pair.extended.run.record.model.label} is blinded: the density of the shifted ${blinded.join(', ')} at the nested value is not the Savage-Dickey ratio` } : null;
  };
  const pairs = detectNestedPairs(runs).map((pair) => ({ pair, savageDickey: withheld(pair) ?? savageDickeyForPair(pair, `${seed}/savage-dickey/${pair.extended.run.record.model.label}`) }));
  const nestedPairs: NestedModelPair[] = pairs.map(({ pair, savageDickey }) => ({
    base: pair.base.run.record.model.label,
    extended: pair.extended.run.record.model.label,
    ...(savageDickey.ok ? { savageDickey: { logBayesFactor: savageDickey.estimate.logBayesFactor, logBayesFactorError: savageDickey.estimate.logBayesFactorError } } : {}),
  }));
  const report = compareModels(models.map((model) => model.record), { baseLabel, nestedPairs });
  clearComparisonFolder(request.outDir);
  mkdirSync(request.outDir, { recursive: true });
  const baseConfiguration = storedConfiguration(runs[baseIndex].run);
  const png = baseConfiguration.ok ? baseConfiguration.value.output.png : true;
  const blindedRuns = runs.filter(({ run }) => blindedParametersOf(run.record).length > 0).map(({ run }) => run.record.model.label);
  const figures = blindedRuns.length
    ? { written: [], skipped: [`${blindedRuns.join(', ')} ${blindedRuns.length === 1 ? 'is' : 'are'} blinded: the dark-energy figures would draw bands of shifted draws through a model of the true data (candela unblind first)`] }
    : writeDarkEnergyFigures(runs, rebuilt, baseIndex, request.outDir, { png, seed });
  warnings.push(...figures.skipped.map((reason) => `figure not drawn: ${reason}`));
  const marks = comparisonBlindingMarks(runs.map(({ run }) => run.record));
  if (marks.notice) warnings.unshift(marks.notice); // printed first by the command, and kept in comparison.json
  const document = marks.document(comparisonDocument({
    runs, models, pairs, comparison: report.comparison, changedInputs, warnings,
    figures: figures.written.flatMap((stem) => (png ? [`${stem}.svg`, `${stem}.png`] : [`${stem}.svg`])),
  }));
  writeFileAtomic(join(request.outDir, COMPARISON_FILES.json), comparisonJsonText(document));
  writeFileAtomic(join(request.outDir, COMPARISON_FILES.markdown), marks.markdown(dicMissingNotice(document) + report.markdown + comparisonMarkdownDetails(document)));
  writeFileAtomic(join(request.outDir, COMPARISON_FILES.latex), marks.latex(report.latex));
  return { outDir: request.outDir, document, files: [COMPARISON_FILES.json, COMPARISON_FILES.markdown, COMPARISON_FILES.latex, ...document.figures], warnings };
}
