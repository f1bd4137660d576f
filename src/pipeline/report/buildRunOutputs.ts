import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import {
  contourGeoJson, contourPathsCsv, contourThresholdsJson, credibleContours, densityGridCsv, hubbleFigure,
  marginalDensityCsv, measurementRatioFigure, nestedChainChecksNote, reportHtml, sampleWalkerTraces, summaryTableNote, summaryCells, summaryLatex, summaryMarkdown, svgToPdf, svgToPng, traceStackFigure, triangleFigure, writeFileAtomic,
  type BinnedResidual, type ContourSet2D, type ReportFigure, type TraceParameterPanel,
} from '../../output/index.js';
import { figureSettings, TRUTH_LABEL, type FigureSettings } from './figureSettings.js';
import { reportInputFiles } from './reportInputFiles.js';
import { modelColumn, siblingModelFolders, writeModelsIndex } from './modelsIndex.js';
import { RELIABLE_STEPS_PER_TAU } from '../../diagnostics/index.js';
import { densityGrid2D } from '../../math/index.js';
import { analyzeRun, priorBounds, type RunAnalysis } from './analyzeRun.js';
import { readRunFolder, type RunOnDisk } from '../run/runFiles.js';
import { readProbeDiagrams } from './probeDiagramFiles.js';
import { DEFAULT_PNG_WIDTH_PX, RUN_FILES, summaryJsonText } from '../../output/index.js';
import { summaryDocument } from './summaryDocument.js';
import { blindingMarks, blindingMarksOfRuns } from '../blinding/blindingMarks.js';
import { reportFactsOfRun } from './reportFactsOfRun.js';
import { binResiduals } from '../../output/index.js';
import { RESIDUAL_FIGURE_BINS, residualsFigureOfRun } from './residualsFigureOfRun.js';
import { autocorrelationFigureOfRun } from './autocorrelationFigureOfRun.js';
import { storedBudget } from '../budget/storedBudget.js';
import { stringify } from 'yaml';
import { PARAMETERS, parameterRank, parseParameterName } from '../../parameters/index.js';

/** The triangle figure shows every sampled parameter up to this many, else the cosmological ones. */
const TRIANGLE_MAX_PARAMETERS = 7;

/** The PNG of a figure: at the configured dots per inch, else {@link DEFAULT_PNG_WIDTH_PX} wide. */
function pngOf(svg: string, settings: FigureSettings): Buffer {
  return svgToPng(svg, settings.pngDpi === null ? DEFAULT_PNG_WIDTH_PX : { dotsPerInch: settings.pngDpi });
}

/** The truth values of the shown parameters, for the triangle figure's reference marks (none without a truth file). */
function truthOptions(settings: FigureSettings, parameters: readonly string[]): { reference?: Record<string, number>; referenceLabel?: string } {
  if (!settings.truth) return {};
  const shown = Object.fromEntries(parameters.filter((name) => settings.truth![name] !== undefined).map((name) => [name, settings.truth![name]]));
  return Object.keys(shown).length > 0 ? { reference: shown, referenceLabel: TRUTH_LABEL } : {};
}

function trianglePairs(parameters: string[]): Array<[string, string]> {
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i < parameters.length; i++) for (let j = i + 1; j < parameters.length; j++) pairs.push([parameters[i], parameters[j]]);
  return pairs;
}

function triangleParameters(analysis: RunAnalysis, settings: FigureSettings): string[] {
  if (settings.triangleParameters !== 'auto') {
    const chosen = settings.triangleParameters.filter((name) => analysis.sampled.includes(name));
    if (chosen.length > 0) return chosen;
  }
  if (analysis.sampled.length <= TRIANGLE_MAX_PARAMETERS) return analysis.sampled;
  const cosmological = analysis.sampled.filter((name) => ['omega_m', 'omega_de', 'w0', 'wa', 'h0'].includes(name));
  return cosmological.length ? cosmological : analysis.sampled.slice(0, TRIANGLE_MAX_PARAMETERS);
}

/**
 * Credible contours for every pair of `parameters` shown in a triangle
 * figure: the configured pairs already computed are reused, the others are
 * estimated from the kept draws (weighted for nested runs) with reflection at
 * hard prior edges.
 * Cost: one 2-D density grid per missing pair.
 * @param run the run folder read back.
 * @param analysis its analysis.
 * @param parameters the triangle's parameters, in order.
 * @returns one contour set per pair (i < j).
 * @throws CandelaError from the density estimate (e.g. a parameter without spread).
 * @example contoursForTriangle(run, analysis, ['omega_m', 'w0']).length // 1
 */
export function contoursForTriangle(run: RunOnDisk, analysis: RunAnalysis, parameters: string[]): ContourSet2D[] {
  const kept = analysis.keptRows;
  const column = (name: string) => Float64Array.from(kept, (r) => run.chains.columns[name][r]);
  const weights = analysis.keptWeights ? { weights: analysis.keptWeights } : {};
  return trianglePairs(parameters).map(([x, y]) => {
    const existing = analysis.contours.find((set) => set.grid.xParameter === x && set.grid.yParameter === y);
    return existing ?? credibleContours(densityGrid2D(x, column(x), y, column(y), { ...weights, xBounds: priorBounds(run, x), yBounds: priorBounds(run, y) }));
  });
}

export { binResiduals };

function hubbleSvg(run: RunOnDisk, settings: FigureSettings): string | null {
  if (!run.hubble || !run.hubbleModel) return null;
  const columns = run.hubble.columns;
  const z = Float64Array.from(columns.z, Number);
  const muObs = Float64Array.from(columns.mu_obs, Number);
  const muErr = Float64Array.from(columns.sigma_mu, Number);
  const muModel = Float64Array.from(columns.mu_model, Number);
  const residual = Float64Array.from(columns.residual, Number);
  const model = run.hubbleModel;
  return hubbleFigure({
    redshift: z, muObsMag: muObs, muErrMag: muErr, sample: columns.sample, bestFitMuMag: muModel,
    modelCurve: { z: model.z, median: model.mu_median, low68: model.mu_low68, high68: model.mu_high68 },
    // Already-binned data are not binned again: the points are the bins.
    ...(settings.dataAreBinned ? {} : { binnedResiduals: binResiduals(z, residual, muErr, RESIDUAL_FIGURE_BINS) }),
  }, {
    modelLabel: `${run.record.model.label} (best fit)`, width: settings.width, fontFace: settings.fontFace,
    sampleNames: settings.sampleNames, dataAreBinned: settings.dataAreBinned,
  });
}

function traceSvg(run: RunOnDisk, analysis: RunAnalysis, settings: FigureSettings): string {
  const { storedSteps: steps, walkers, ensembles, stepStride } = analysis;
  // Individual walkers, not their mean: a stuck walker shows as a flat line, and the acceptance summary's stuck walkers are always drawn.
  const panels: TraceParameterPanel[] = analysis.sampled.map((name) => ({
    parameter: name,
    ensembles: sampleWalkerTraces(run.chains.columns[name], { steps, walkers, ensembles }, { stuckWalkers: analysis.stuckWalkersByEnsemble, ...(stepStride > 1 ? { stepStride } : {}) }),
  }));
  return traceStackFigure(panels, analysis.burnInSteps, { width: settings.width, fontFace: settings.fontFace });
}

/** Which outputs of a run folder to write. */
export interface RunOutputOptions {
  /** Figures and report.html (default true); false writes the summaries, tables, marginals and contours only. */
  figures?: boolean;
  /** Memory the chains of each run may take, MB (see readRunFolder; default the run's `output.chain_memory_mb`). */
  chainMemoryMb?: number;
}

/** What the summaries of one run leave for its figures: the run, its analysis, figure settings and page marks. */
export interface RunSummaries {
  run: RunOnDisk;
  analysis: RunAnalysis;
  settings: FigureSettings;
  marks: ReturnType<typeof blindingMarks>;
}

/**
 * Writes the numbers of one run into `outDir`: summary.json, summary.md,
 * table.tex, marginal and contour files (everything but the figures and
 * report.html).
 * Cost: the analysis (analyzeRun), about half of writeRunOutputs at survey scale.
 * @param run the run folder read back.
 * @param outDir where to write (created when missing).
 * @returns what runFigureSteps needs to draw the rest.
 * @throws CandelaError from the analysis; Error from the file system.
 * @example writeRunSummaries(readRunFolder('out/run'), 'out/run').analysis.steps
 */
export function writeRunSummaries(run: RunOnDisk, outDir: string): RunSummaries {
  const analysis = analyzeRun(run);
  const settings = figureSettings(run);
  analysis.warnings.push(...settings.warnings);
  mkdirSync(join(outDir, 'marginals'), { recursive: true });
  mkdirSync(join(outDir, 'contours'), { recursive: true });
  mkdirSync(join(outDir, 'figures'), { recursive: true });
  const marks = blindingMarks(run.record);
  writeFileAtomic(join(outDir, RUN_FILES.summaryJson), summaryJsonText(marks.summaryJson(summaryDocument(run, analysis))));
  writeFileAtomic(join(outDir, RUN_FILES.summaryMarkdown), marks.markdown(summaryMarkdown(analysis.summary)));
  writeFileAtomic(join(outDir, RUN_FILES.tableLatex), marks.latex(summaryLatex(analysis.summary)));
  for (const marginal of analysis.marginals) writeFileAtomic(join(outDir, 'marginals', `${marginal.parameter}.csv`), marginalDensityCsv(marginal));
  for (const set of analysis.contours) {
    const stem = join(outDir, 'contours', `${set.grid.xParameter}__${set.grid.yParameter}`);
    writeFileAtomic(`${stem}.grid.csv`, densityGridCsv(set.grid));
    writeFileAtomic(`${stem}.levels.json`, contourThresholdsJson(set));
    writeFileAtomic(`${stem}.geojson`, contourGeoJson(set));
    writeFileAtomic(`${stem}.paths.csv`, contourPathsCsv(set));
  }
  return { run, analysis, settings, marks };
}

/**
 * Draws the figures of one run (SVG, and PNG or PDF as configured) and then
 * writes report.html (and, in place, the models page), yielding after each
 * figure: a synchronous caller drains it in one go (writeRunOutputs), the fit
 * turns the event loop between steps so that Ctrl-C is seen while it draws
 * (writeRunOutputsUnlessStopped). A generator left unfinished has written
 * whole figures only, and no report.html.
 * Cost: rendering the figures, seconds at survey scale.
 * @param written the run's summaries (writeRunSummaries).
 * @param outDir where to write.
 * @returns a generator yielding the file stem of each figure written.
 * @throws CandelaError from the figures; Error from the file system.
 * @example for (const stem of runFigureSteps(writeRunSummaries(run, dir), dir)) console.log(stem) // triangle, hubble, ...
 */
export function* runFigureSteps(written: RunSummaries, outDir: string): Generator<string, void, void> {
  const { run, analysis, settings, marks } = written;
  const wanted = settings.figures;
  const figures: ReportFigure[] = [];
  const draw = (title: string, svg: string, fileName: string): string => {
    const marked = marks.svg(svg);
    writeFileAtomic(join(outDir, 'figures', `${fileName}.svg`), marked);
    if (settings.png) writeFileAtomic(join(outDir, 'figures', `${fileName}.png`), pngOf(marked, settings));
    if (settings.pdf) writeFileAtomic(join(outDir, 'figures', `${fileName}.pdf`), svgToPdf(marked));
    figures.push({ title, svg: marked, fileName });
    return fileName;
  };
  if (wanted.includes('triangle')) {
    const parameters = triangleParameters(analysis, settings);
    const svg = triangleFigure([{ label: run.record.model.label, marginals: analysis.marginals.filter((m) => parameters.includes(m.parameter)), contours: contoursForTriangle(run, analysis, parameters) }], parameters, {
      width: settings.width, fontFace: settings.fontFace, ...truthOptions(settings, parameters),
    });
    yield draw('Posterior: 1-D marginals and 68% / 95% credible regions', svg, 'triangle');
  }
  if (wanted.includes('hubble')) {
    const svg = hubbleSvg(run, settings);
    if (svg) yield draw('Hubble diagram and residuals at the best fit', svg, 'hubble');
  }
  // Each probe term with a diagram (ProbeDefinition.diagram) draws its data against the fit, one figure per term.
  for (const { key, diagram } of readProbeDiagrams(run.dir)) yield draw(diagram.title, measurementRatioFigure(diagram), `probe-${key}`);
  // Traces show Markov chains; nested samples are not a chain, so nested runs have no trace figure.
  if (wanted.includes('trace') && analysis.method === 'ensemble') yield draw('Traces of a few walkers per ensemble (stuck walkers highlighted); shaded: burn-in', traceSvg(run, analysis, settings), 'trace');
  // Residuals on their own (the Hubble figure's lower panel, full size) and the autocorrelation functions with tau marked.
  const residuals = wanted.includes('residuals') ? residualsFigureOfRun(run, settings) : null;
  if (residuals) yield draw('Hubble residuals at the best fit, with binned means', residuals, 'residuals');
  const autocorrelation = wanted.includes('autocorrelation') ? autocorrelationFigureOfRun(run, analysis, settings) : null;
  if (autocorrelation) yield draw('Normalized autocorrelation per parameter; markers: integrated autocorrelation time', autocorrelation, 'autocorrelation');
  writeFileAtomic(join(outDir, RUN_FILES.report), reportHtml({
    title: marks.title(`${run.record.title} — ${run.record.model.label}`),
    facts: reportFactsOfRun(run.record, analysis),
    summary: {
      columns: ['Mean ± sd', 'Median, 68.27% errors', '95.45% interval', '68.27% HDI', 'MAP'],
      rows: analysis.summary.parameters.map((parameter) => {
        const cells = summaryCells(parameter, 'plain');
        const note = [...(parameter.derived ? ['derived'] : []), ...(parameter.note ? [parameter.note] : [])].join('; ');
        return { parameter: parameter.name, cells: [cells.meanSd, cells.median68, cells.interval95, cells.hdi68, cells.map], ...(note ? { note } : {}) };
      }),
      ...summaryNote(analysis),
    },
    diagnostics: {
      rows: analysis.sampled.filter((name) => analysis.diagnostics[name]).map((name) => {
        const d = analysis.diagnostics[name];
        return { parameter: name, rHat: d.rhat ?? Number.NaN, ess: d.essBulk ?? 0, autocorrelationTimeSteps: d.tau ?? Number.NaN };
      }),
      chainLengthSteps: analysis.steps, rHatMax: run.record.run.max_rhat, essMin: run.record.run.target_ess, tauMultiple: RELIABLE_STEPS_PER_TAU,
      ...(analysis.acceptanceMean !== null ? { acceptanceFraction: analysis.acceptanceMean } : {}),
      ...(analysis.method === 'nested' ? { notApplicable: nestedChainChecksNote(analysis.effectiveSampleSize ?? 0) } : {}),
    },
    figures,
    configurationYaml: stringify(run.record.configuration),
    inputFiles: reportInputFiles(run),
    warnings: analysis.warnings,
    budget: storedBudget(run.dir),
  }));
  if (resolve(outDir) === resolve(run.dir)) refreshModelsIndex(run, analysis);
}

/**
 * Writes every output of one run into `outDir` from its folder's chains and
 * records: summary.json, summary.md, table.tex, marginal and contour files,
 * figures (SVG and PNG) and report.html. Pure function of the run folder's
 * files, so `candela report` reproduces what `candela fit` wrote, byte for byte.
 * Nested runs use their posterior weights everywhere, have no trace figure,
 * and their report page states that the Markov-chain convergence checks do
 * not apply, giving ln Z and the Kish effective sample size instead.
 *
 * Cost: the analysis (analyzeRun) plus rendering the figures.
 * @param run the run folder read back.
 * @param outDir where to write (created when missing).
 * @returns the analysis.
 * @throws CandelaError from the analysis or figures; Error from the file system.
 * @example writeRunOutputs(readRunFolder('out/run'), 'out/run')
 */
export function writeRunOutputs(run: RunOnDisk, outDir: string, options: RunOutputOptions = {}): RunAnalysis {
  const written = writeRunSummaries(run, outDir);
  // After Ctrl-C only the numbers are written: figures and the report page take seconds at survey scale, and
  // `candela report` draws them later from the same folder, byte for byte.
  if (options.figures === false) return written.analysis;
  for (const figure of runFigureSteps(written, outDir)) void figure;
  return written.analysis;
}

/** Lets pending signal handlers run (a setImmediate turn of the event loop). */
const turnEventLoop = (): Promise<void> => new Promise((done) => setImmediate(done));

/**
 * The outputs of a run folder written in place as `candela fit` ends, with
 * the event loop turned between the summaries and each figure: once `signal`
 * is aborted (Ctrl-C after the sampling finished) the figures still to draw
 * and report.html are left to `candela report`, so the command ends within
 * about one figure's rendering instead of all of them.
 * @param runDir the run folder.
 * @param signal the fit's stop signal; null or aborted: the summaries only.
 * @param onSummaries receives the run as read back and its analysis once the summaries are written (the fit prints
 *   its terminal report from them instead of reading the run again).
 * @returns true when every output was written, false when the figures and report.html were left out.
 * @throws as writeRunOutputs.
 * @example await writeRunOutputsUnlessStopped('out/run', controller.signal) // true
 */
export async function writeRunOutputsUnlessStopped(runDir: string, signal: AbortSignal | null | undefined, onSummaries?: (written: RunSummaries) => void): Promise<boolean> {
  const written = writeRunSummaries(readRunFolder(runDir), runDir);
  onSummaries?.(written);
  if (signal === null) return false;
  await turnEventLoop();
  if (signal?.aborted) return false;
  const steps = runFigureSteps(written, runDir);
  for (let step = steps.next(); !step.done; step = steps.next()) {
    await turnEventLoop();
    // Left unfinished, the generator has written whole figures only, and no report.html.
    if (signal?.aborted) return false;
  }
  return true;
}

/**
 * After a model of a multi-model configuration is written in place, rewrites
 * the index page and models table beside the models' folders from every
 * model finished so far (a model whose folder cannot be analysed yet, e.g. an
 * interrupted one, is left out until it is).
 */
function refreshModelsIndex(run: RunOnDisk, analysis: RunAnalysis): void {
  const folders = siblingModelFolders(run);
  if (folders.length < 2) return;
  const indexDir = dirname(resolve(run.dir));
  const records: Array<RunOnDisk['record']> = [];
  const columns = folders.flatMap((folder) => {
    if (resolve(folder) === resolve(run.dir)) {
      records.push(run.record);
      return [modelColumn(run, analysis, indexDir)];
    }
    try {
      const sibling = readRunFolder(folder);
      records.push(sibling.record);
      return [modelColumn(sibling, analyzeRun(sibling), indexDir)];
    } catch {
      return [];
    }
  });
  if (columns.length >= 2) writeModelsIndex(columns, indexDir, records);
}

/**
 * `candela report`: rebuilds the outputs of one run folder in place (or in
 * `outDir`), or, for several folders, overlays their posteriors in one
 * triangle figure in `outDir`.
 * @param runDirs run folders written by `candela fit`.
 * @param outDir output folder.
 * @returns one analysis per run.
 * @throws CandelaError for unreadable run folders.
 * @example buildRunOutputs(['out/run'], 'out/run')
 */
export function buildRunOutputs(runDirs: string[], outDir: string, options: RunOutputOptions = {}): RunAnalysis[] {
  const runs = runDirs.map((dir) => readRunFolder(dir, { chainMemoryMb: options.chainMemoryMb }));
  if (runs.length === 1) return [writeRunOutputs(runs[0], outDir, options)];
  const analyses = runs.map((run) => analyzeRun(run));
  const settings = figureSettings(runs[0]);
  mkdirSync(outDir, { recursive: true });
  // The union of the runs' physical parameters (cosmology, early universe, probe: the registry's roles), in registry
  // order, so that supernovae alone, + BAO and + CMB share one figure; a run draws only the panels it has.
  const physical = (name: string) => ['cosmology', 'early_universe', 'probe'].includes(PARAMETERS[parseParameterName(name)?.base ?? '']?.role ?? '');
  const union = [...new Set(analyses.flatMap((a) => a.sampled))].sort((a, b) => parameterRank(a) - parameterRank(b));
  const parameters = union.some(physical) ? union.filter(physical) : union;
  const overlay = triangleFigure(runs.map((run, k) => ({
    label: run.record.model.label,
    marginals: analyses[k].marginals.filter((m) => parameters.includes(m.parameter)),
    contours: contoursForTriangle(run, analyses[k], parameters.filter((name) => analyses[k].sampled.includes(name))),
  })), parameters, { width: settings.width, fontFace: settings.fontFace });
  const marks = blindingMarksOfRuns(runs.map((run) => run.record));
  const svg = marks.svg(overlay);
  writeFileAtomic(join(outDir, 'overlay_triangle.svg'), svg);
  if (settings.png) writeFileAtomic(join(outDir, 'overlay_triangle.png'), pngOf(svg, settings));
  if (settings.pdf) writeFileAtomic(join(outDir, 'overlay_triangle.pdf'), svgToPdf(svg));
  writeFileAtomic(join(outDir, 'overlay_summary.md'), marks.markdown(runs.map((run, k) => `## ${run.record.model.label}\n\n${summaryMarkdown(analyses[k].summary)}`).join('\n')));
  writeModelsIndex(runs.map((run, k) => modelColumn(run, analyses[k], resolve(outDir))), outDir, runs.map((run) => run.record));
  return analyses;
}

/** The sentence under the report's parameter table (output's summaryTableNote): weighted samples, one-sided limits. */
function summaryNote(analysis: RunAnalysis): { note?: string } {
  const note = summaryTableNote({
    kishEffectiveSampleSize: analysis.method === 'nested' ? analysis.effectiveSampleSize ?? 0 : null,
    oneSidedLimits: analysis.summary.parameters.some((p) => p.oneSidedLimit),
  });
  return note ? { note } : {};
}
