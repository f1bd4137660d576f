import { mkdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { CandelaError, isCandelaError } from '../../errors.js';
import { closestWord, systematicBudget } from '../../math/index.js';
import { essErrorInflation } from '../../diagnostics/index.js';
import { budgetFigure, budgetJson, budgetLatex, budgetMarkdown, budgetMethod, DEFAULT_PNG_WIDTH_PX, RUN_FILES, smallestBulkEssInSummaryJson, svgToPng, writeFileAtomic, type BudgetTable } from '../../output/index.js';
import { rebuildRunModel } from '../compare/compareRebuildModel.js';
import { buildRunOutputs } from '../report/buildRunOutputs.js';
import { storedConfiguration } from '../run/storedConfiguration.js';
import { readRunFolder, samplerMethodOf } from '../run/runFiles.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';
import { budgetDraws } from './budgetDraws.js';
import { budgetTable } from './budgetTableOf.js';
import { BUDGET_FILES } from './budgetFiles.js';
import { budgetSystematics, variantData } from './budgetSystematics.js';
import { fullVariantFit } from './fullVariantFit.js';
import { variantLogLikelihoods } from './variantLogLikelihoods.js';

/** Draws reweighted by default: enough for Monte Carlo errors of a few percent of sigma, few enough for 2K + 2 likelihood passes. */
export const DEFAULT_BUDGET_DRAWS = 4000;
/** Kish effective count below which a reweighted variant is flagged (a mean to ~5% of sigma, common practice). */
export const DEFAULT_MIN_EFFECTIVE_DRAWS = 400;

/** What `candela budget` is asked to do. */
export interface BudgetRequest {
  /** A run folder written by `candela fit` (ensemble sampler). */
  runDir: string;
  /** Most draws reweighted (default DEFAULT_BUDGET_DRAWS). */
  maxDraws?: number;
  /** Flag threshold on the Kish effective count (default DEFAULT_MIN_EFFECTIVE_DRAWS). */
  minEffectiveDraws?: number;
  /** Parameters shown in the tables and figure (default: every sampled parameter). */
  parameters?: string[];
  /** Also fit each stat + all-but-one variant in full, to check the fast path. */
  full?: boolean;
  /** Rebuild the run's outputs afterwards, so report.html shows the budget (default true). */
  report?: boolean;
  /** Progress lines (one per variant). */
  onProgress?: (line: string) => void;
}

/** What it wrote and found. */
export interface BudgetOutcome {
  table: BudgetTable;
  files: string[];
  /** Input files that changed since the fit (the draws then come from another likelihood: the numbers are approximate). */
  changedInputs: string[];
  wallSeconds: number;
}

/**
 * The systematic budget of a run (docs/budget.md): for every named
 * systematic of its configuration, the shift of each parameter's mean when
 * it is removed and its error contribution in quadrature, removed from all
 * and alone with the statistical errors, by importance reweighting of the
 * run's own draws (math/reweighting), with the Gaussian linear response as a
 * cross-check and, with `full`, full fits of each stat + all-but-one variant.
 * Writes budget.md, budget.tex, budget.json and figures/budget.svg (and .png
 * when the run writes PNG) into the run folder, then rebuilds its outputs
 * (buildRunOutputs) so that report.html shows the budget.
 *
 * Cost: (2 K + 2) model builds and likelihood passes over the draws for K
 * systematics; with `full`, K fits more.
 * @param request the run folder and options.
 * @throws CandelaError `budget.blinded`, `budget.nested_run`, `budget.no_systematics`, `budget.unknown_parameter`,
 *   `budget.bad_option`, and the errors of reading the run and its data (each with file, key and fix).
 */
export async function runBudget(request: BudgetRequest): Promise<BudgetOutcome> {
  const started = Date.now();
  const maxDraws = request.maxDraws ?? DEFAULT_BUDGET_DRAWS;
  const minEffective = request.minEffectiveDraws ?? DEFAULT_MIN_EFFECTIVE_DRAWS;
  checkCount(maxDraws, '--draws', 'a whole number of draws >= 100', 100);
  checkCount(minEffective, '--min-effective', 'a whole number of draws >= 1', 1);
  const run = readRunFolder(request.runDir);
  const runFile = join(request.runDir, 'run.json');
  if (blindedParametersOf(run.record).length > 0) {
    throw new CandelaError({ code: 'budget.blinded', file: runFile, message: 'this run is blinded: shifts of its means would show the blinded values', fix: 'unblind it first (candela unblind), or make the budget of an unblinded mock run' });
  }
  if (samplerMethodOf(run.record) !== 'ensemble') {
    throw new CandelaError({ code: 'budget.nested_run', file: runFile, message: 'the budget reweights equally weighted ensemble draws; this run used nested sampling', fix: 'fit the configuration with sampler.method: ensemble' });
  }
  const { model, data, changedInputs } = recoded(() => rebuildRunModel(run));
  const parsed = storedConfiguration(run);
  if (!parsed.ok) throw new CandelaError(parsed.issues);
  const config = parsed.value;
  const modelIndex = config.models.findIndex((entry) => entry.label === run.record.model.label);
  const systematics = budgetSystematics(config, data);
  if (systematics.length === 0) {
    throw new CandelaError({
      code: 'budget.no_systematics', file: runFile, path: 'supernovae[].covariances, supernovae[].systematic_modes',
      message: 'the run has no systematic to weigh (no covariance matrix beyond the statistical errors, no mode file)',
      fix: 'add covariances or systematic_modes entries to the data set and fit again',
    });
  }
  const shown = shownParameters(request.parameters, model.parameterNames, runFile);
  const draws = budgetDraws(run.chains, model.parameterNames, maxDraws);
  const progress = request.onProgress ?? (() => undefined);
  const logLikelihoodOf = (kept: typeof systematics, label: string) => {
    const result = variantLogLikelihoods(config, modelIndex, variantData(data, systematics, kept), draws);
    progress(`  ln L at ${draws.count} draws: ${label}`);
    return result;
  };
  const all = logLikelihoodOf(systematics, 'statistical + every systematic');
  const statistical = logLikelihoodOf([], 'statistical only');
  const variants = systematics.map((systematic) => ({
    systematic,
    without: logLikelihoodOf(systematics.filter((other) => other !== systematic), `without ${systematic.name}`),
    alone: logLikelihoodOf([systematic], `statistical + ${systematic.name}`),
  }));
  const budget = systematicBudget({
    draws: draws.values, parameterNames: model.parameterNames, allLogLikelihood: all.logLikelihood, statisticalLogLikelihood: statistical.logLikelihood,
    systematics: variants.map(({ systematic, without, alone }) => ({ name: systematic.name, withoutLogLikelihood: without.logLikelihood, aloneLogLikelihood: alone.logLikelihood })),
    minEffectiveCount: minEffective,
  });
  const full: Array<{ mean: number[]; sd: number[] } | null> = [];
  for (const { systematic, without } of variants) {
    if (!request.full) { full.push(null); continue; }
    const fit = await fullVariantFit(without.model, config.sampler, `${config.seed}-budget-${systematic.name}`);
    progress(`  full fit without ${systematic.name}: ${fit.steps} steps${fit.converged ? '' : ' (stopping rule not met)'}`);
    full.push(fit);
  }
  const ess = smallestBulkEss(request.runDir, model.parameterNames);
  const inflation = ess === null ? 1 : essErrorInflation(draws.count, ess);
  const method = budgetMethod({ draws: draws.count, minEffectiveDraws: minEffective, inflation: ess === null ? null : { factor: inflation, smallestBulkEss: ess }, fullFits: request.full === true });
  const table = budgetTable(budget, shown, full, { title: run.record.title, model: run.record.model.label, method, minEffective, inflation });
  const files = writeBudgetFiles(request.runDir, table, config.output.png);
  if (request.report !== false) {
    buildRunOutputs([request.runDir], request.runDir);
    files.push(join(request.runDir, 'report.html'));
  }
  return { table, files, changedInputs: changedInputs.map((entry) => entry.path), wallSeconds: (Date.now() - started) / 1000 };
}

/** Writes the three tables and the figure; returns their paths. */
function writeBudgetFiles(dir: string, table: BudgetTable, png: boolean): string[] {
  const svg = budgetFigure(table);
  const files: Array<[string, string | Uint8Array]> = [
    [join(dir, BUDGET_FILES.markdown), budgetMarkdown(table)],
    [join(dir, BUDGET_FILES.latex), budgetLatex(table)],
    [join(dir, BUDGET_FILES.json), budgetJson(table)],
    [join(dir, BUDGET_FILES.figure), svg],
    ...(png ? [[join(dir, BUDGET_FILES.figure.replace(/\.svg$/, '.png')), svgToPng(svg, DEFAULT_PNG_WIDTH_PX)] as [string, Uint8Array]] : []),
  ];
  mkdirSync(dirname(join(dir, BUDGET_FILES.figure)), { recursive: true });
  for (const [path, content] of files) writeFileAtomic(path, content);
  return files.map(([path]) => path);
}


/** The parameters asked for, each one the run samples (did-you-mean otherwise); all when none is asked for. */
function shownParameters(asked: string[] | undefined, sampled: readonly string[], runFile: string): string[] {
  if (!asked || asked.length === 0) return [...sampled];
  const unknown = asked.filter((name) => !sampled.includes(name));
  if (unknown.length > 0) {
    throw new CandelaError(unknown.map((name) => {
      const near = closestWord(name, sampled);
      return {
        code: 'budget.unknown_parameter', file: runFile, path: '--parameters', message: `the run does not sample "${name}"`,
        expected: `one of ${sampled.join(', ')}`, found: name, fix: near ? `did you mean "${near}"?` : `choose among ${sampled.join(', ')}`,
      };
    }));
  }
  return asked;
}

/**
 * The smallest bulk ESS of the sampled parameters in the run's summary.json
 * (null when it is missing or has none): draws closer together than the
 * autocorrelation are worth fewer independent ones, so the independent-draw
 * errors are scaled by sqrt(draws / ESS) when the draws outnumber it (common practice).
 */
function smallestBulkEss(runDir: string, names: readonly string[]): number | null {
  let text: string;
  try {
    text = readFileSync(join(runDir, RUN_FILES.summaryJson), 'utf8');
  } catch {
    return null;
  }
  return smallestBulkEssInSummaryJson(text, names);
}

function checkCount(value: number, option: string, expected: string, minimum: number): void {
  if (!Number.isInteger(value) || value < minimum) {
    throw new CandelaError({ code: 'budget.bad_option', path: option, message: `${option} must be ${expected}`, expected, found: String(value), fix: `pass ${option} ${Math.max(minimum, 1000)}` });
  }
}

/** Rebuilding the run's model, with the rebuild's compare.* codes named for this command. */
function recoded<T>(work: () => T): T {
  try {
    return work();
  } catch (error) {
    if (!isCandelaError(error)) throw error;
    throw new CandelaError(error.issues.map((issue) => ({ ...issue, code: issue.code.replace(/^compare\./, 'budget.') })));
  }
}
