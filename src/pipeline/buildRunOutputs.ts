import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import {
  contourGeoJson, contourPathsCsv, contourThresholdsJson, credibleContours, densityGridCsv, hubbleFigure,
  marginalDensityCsv, measurementRatioFigure, reportHtml, summaryCells, summaryLatex, summaryMarkdown, svgToPng, traceStackFigure, triangleFigure, writeFileAtomic,
  type BinnedResidual, type ContourSet2D, type ReportFigure, type ReportRunFacts, type TraceParameterPanel,
} from '../output/index.js';
import { RELIABLE_STEPS_PER_TAU } from '../diagnostics/index.js';
import { densityGrid2D } from '../math/index.js';
import { analyzeRun, priorBounds, type RunAnalysis } from './analyzeRun.js';
import { readRunFolder, type RunOnDisk } from './runFiles.js';
import { readProbeDiagrams } from './probeDiagramFiles.js';
import { RUN_FILES } from './runFolder.js';
import { summaryDocument } from './summaryDocument.js';
import { nestedReportFacts } from './nestedReportFacts.js';
import { arrayExtent } from './arrayExtent.js';
import { stringify } from 'yaml';

/** Width of PNG renderings, px (print quality for a figure of ~640 px design width). */
const PNG_WIDTH_PX = 1600;
/** The triangle figure shows every sampled parameter up to this many, else the cosmological ones. */
const TRIANGLE_MAX_PARAMETERS = 7;
/** Redshift bins of the binned Hubble residuals (equal in log z). */
const RESIDUAL_BINS = 12;

function figureNames(run: RunOnDisk): { figures: string[]; png: boolean } {
  const output = (run.record.configuration as { output?: { figures?: string[]; png?: boolean } }).output ?? {};
  return { figures: output.figures ?? ['triangle', 'hubble', 'trace'], png: output.png ?? true };
}

function trianglePairs(parameters: string[]): Array<[string, string]> {
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i < parameters.length; i++) for (let j = i + 1; j < parameters.length; j++) pairs.push([parameters[i], parameters[j]]);
  return pairs;
}

function triangleParameters(analysis: RunAnalysis): string[] {
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

/**
 * Inverse-variance weighted mean residual in log-spaced redshift bins
 * (diagonal errors only: correlations between supernovae are ignored, as
 * usual for a display).
 * @param z redshifts (> 0 are binned).
 * @param residual residuals, mag.
 * @param error one-sigma errors, mag (> 0 are used).
 * @param bins number of equal bins in ln z.
 * @returns one entry per non-empty bin: weighted mean ln z as z, mean residual and its error (mag).
 * @throws nothing.
 * @example binResiduals(z, residual, sigma, 12)[0].mean
 */
export function binResiduals(z: Float64Array, residual: Float64Array, error: Float64Array, bins: number): BinnedResidual[] {
  const [zLow, zHigh] = arrayExtent(z.filter((v) => v > 0));
  const low = Math.log(zLow);
  const high = Math.log(zHigh);
  const width = (high - low) / bins || 1;
  const sums = Array.from({ length: bins }, () => ({ weight: 0, weighted: 0, weightedZ: 0 }));
  for (let i = 0; i < z.length; i++) {
    if (!(z[i] > 0 && error[i] > 0 && Number.isFinite(residual[i]))) continue;
    const bin = Math.min(bins - 1, Math.floor((Math.log(z[i]) - low) / width));
    const weight = 1 / (error[i] * error[i]);
    sums[bin].weight += weight;
    sums[bin].weighted += weight * residual[i];
    sums[bin].weightedZ += weight * Math.log(z[i]);
  }
  return sums.filter((s) => s.weight > 0).map((s) => ({ z: Math.exp(s.weightedZ / s.weight), mean: s.weighted / s.weight, err: 1 / Math.sqrt(s.weight) }));
}

function hubbleSvg(run: RunOnDisk): string | null {
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
    binnedResiduals: binResiduals(z, residual, muErr, RESIDUAL_BINS),
  }, { modelLabel: `${run.record.model.label} (best fit)` });
}

function traceSvg(run: RunOnDisk, analysis: RunAnalysis): string {
  const { steps, walkers, ensembles } = analysis;
  const panels: TraceParameterPanel[] = analysis.sampled.map((name) => {
    const column = run.chains.columns[name];
    return {
      parameter: name,
      ensembles: Array.from({ length: ensembles }, (_, k) => {
        const mean = new Float64Array(steps);
        for (let s = 0; s < steps; s++) {
          let sum = 0;
          for (let w = 0; w < walkers; w++) sum += column[(k * steps + s) * walkers + w];
          mean[s] = sum / walkers;
        }
        return { label: `ensemble ${k + 1} (walker mean)`, series: [mean] };
      }),
    };
  });
  return traceStackFigure(panels, analysis.burnInSteps);
}

function reportFacts(run: RunOnDisk, analysis: RunAnalysis): ReportRunFacts {
  const { record } = run;
  if (analysis.method === 'nested') return nestedReportFacts(record, analysis);
  return {
    seed: record.run.seed, steps: record.run.steps, walkers: record.run.walkers, ensembles: record.run.ensembles,
    stopReason: record.run.stop_reason, wallTimeSeconds: record.run.wall_seconds, version: record.tool.version, model: record.model.label,
    extra: [
      { label: 'supernovae', value: String(record.data.supernovae) },
      { label: 'chi-square at best fit', value: record.best_fit.chi_square === null ? 'n/a' : `${record.best_fit.chi_square.toFixed(2)} for ${record.best_fit.degrees_of_freedom} degrees of freedom` },
      ...termRows(record),
      { label: 'likelihood evaluations', value: String(record.run.evaluations) },
    ],
  };
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
export function writeRunOutputs(run: RunOnDisk, outDir: string): RunAnalysis {
  const analysis = analyzeRun(run);
  mkdirSync(join(outDir, 'marginals'), { recursive: true });
  mkdirSync(join(outDir, 'contours'), { recursive: true });
  mkdirSync(join(outDir, 'figures'), { recursive: true });
  writeFileAtomic(join(outDir, RUN_FILES.summaryJson), `${JSON.stringify(summaryDocument(run, analysis), null, 2)}\n`);
  writeFileAtomic(join(outDir, RUN_FILES.summaryMarkdown), summaryMarkdown(analysis.summary));
  writeFileAtomic(join(outDir, RUN_FILES.tableLatex), summaryLatex(analysis.summary));
  for (const marginal of analysis.marginals) writeFileAtomic(join(outDir, 'marginals', `${marginal.parameter}.csv`), marginalDensityCsv(marginal));
  for (const set of analysis.contours) {
    const stem = join(outDir, 'contours', `${set.grid.xParameter}__${set.grid.yParameter}`);
    writeFileAtomic(`${stem}.grid.csv`, densityGridCsv(set.grid));
    writeFileAtomic(`${stem}.levels.json`, contourThresholdsJson(set));
    writeFileAtomic(`${stem}.geojson`, contourGeoJson(set));
    writeFileAtomic(`${stem}.paths.csv`, contourPathsCsv(set));
  }
  const { figures: wanted, png } = figureNames(run);
  const figures: ReportFigure[] = [];
  if (wanted.includes('triangle')) {
    const parameters = triangleParameters(analysis);
    const svg = triangleFigure([{ label: run.record.model.label, marginals: analysis.marginals.filter((m) => parameters.includes(m.parameter)), contours: contoursForTriangle(run, analysis, parameters) }], parameters);
    figures.push({ title: 'Posterior: 1-D marginals and 68% / 95% credible regions', svg, fileName: 'triangle' });
  }
  if (wanted.includes('hubble')) {
    const svg = hubbleSvg(run);
    if (svg) figures.push({ title: 'Hubble diagram and residuals at the best fit', svg, fileName: 'hubble' });
  }
  // Each probe term with a diagram (ProbeDefinition.diagram) draws its data against the fit, one figure per term.
  for (const { key, diagram } of readProbeDiagrams(run.dir)) {
    figures.push({ title: diagram.title, svg: measurementRatioFigure(diagram), fileName: `probe-${key}` });
  }
  // Traces show Markov chains; nested samples are not a chain, so nested runs have no trace figure.
  if (wanted.includes('trace') && analysis.method === 'ensemble') figures.push({ title: 'Traces (walker mean per ensemble); shaded: burn-in', svg: traceSvg(run, analysis), fileName: 'trace' });
  for (const figure of figures) {
    writeFileAtomic(join(outDir, 'figures', `${figure.fileName}.svg`), figure.svg);
    if (png) writeFileAtomic(join(outDir, 'figures', `${figure.fileName}.png`), svgToPng(figure.svg, PNG_WIDTH_PX));
  }
  writeFileAtomic(join(outDir, RUN_FILES.report), reportHtml({
    title: `${run.record.title} — ${run.record.model.label}`,
    facts: reportFacts(run, analysis),
    summary: {
      columns: ['Mean ± sd', 'Median, 68.27% errors', '95.45% interval'],
      rows: analysis.summary.parameters.map((parameter) => {
        const cells = summaryCells(parameter, 'plain');
        return { parameter: parameter.name, cells: [cells.meanSd, cells.median68, cells.interval95] };
      }),
      ...(analysis.method === 'nested' ? { note: `Weighted nested-sampling samples (Kish effective sample size ${(analysis.effectiveSampleSize ?? 0).toFixed(0)}).` } : {}),
    },
    diagnostics: {
      rows: analysis.sampled.filter((name) => analysis.diagnostics[name]).map((name) => {
        const d = analysis.diagnostics[name];
        return { parameter: name, rHat: d.rhat ?? Number.NaN, ess: d.essBulk ?? 0, autocorrelationTimeSteps: d.tau ?? Number.NaN };
      }),
      chainLengthSteps: analysis.steps, rHatMax: run.record.run.max_rhat, essMin: run.record.run.target_ess, tauMultiple: RELIABLE_STEPS_PER_TAU,
      ...(analysis.acceptanceMean !== null ? { acceptanceFraction: analysis.acceptanceMean } : {}),
      ...(analysis.method === 'nested' ? { notApplicable: `Nested sampling draws independent weighted samples: R-hat and autocorrelation times do not apply. Kish effective sample size of the weights: ${(analysis.effectiveSampleSize ?? 0).toFixed(0)}.` } : {}),
    },
    figures,
    configurationYaml: stringify(run.record.configuration),
    inputFiles: run.record.inputs.map((input) => ({ path: input.path, sha256: input.sha256 })),
    warnings: analysis.warnings,
  }));
  return analysis;
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
export function buildRunOutputs(runDirs: string[], outDir: string): RunAnalysis[] {
  const runs = runDirs.map(readRunFolder);
  if (runs.length === 1) return [writeRunOutputs(runs[0], outDir)];
  const analyses = runs.map((run) => analyzeRun(run));
  mkdirSync(outDir, { recursive: true });
  const shared = analyses[0].sampled.filter((name) => analyses.every((a) => a.sampled.includes(name)) && ['omega_m', 'omega_de', 'w0', 'wa', 'h0'].includes(name));
  const parameters = shared.length >= 1 ? shared : analyses[0].sampled.filter((name) => analyses.every((a) => a.sampled.includes(name)));
  const svg = triangleFigure(runs.map((run, k) => ({
    label: run.record.model.label,
    marginals: analyses[k].marginals.filter((m) => parameters.includes(m.parameter)),
    contours: contoursForTriangle(run, analyses[k], parameters),
  })), parameters);
  writeFileAtomic(join(outDir, 'overlay_triangle.svg'), svg);
  if (figureNames(runs[0]).png) writeFileAtomic(join(outDir, 'overlay_triangle.png'), svgToPng(svg, PNG_WIDTH_PX));
  writeFileAtomic(join(outDir, 'overlay_summary.md'), runs.map((run, k) => `## ${run.record.model.label}\n\n${summaryMarkdown(analyses[k].summary)}`).join('\n'));
  return analyses;
}

/** One report row per likelihood term when the posterior has more than one: its chi-square and degrees of freedom. */
function termRows(record: RunOnDisk['record']): Array<{ label: string; value: string }> {
  const terms = record.best_fit.terms ?? [];
  if (terms.length < 2) return [];
  return terms.map((term) => ({
    label: `chi-square of ${term.name}`,
    value: term.chi_square === null ? 'n/a' : `${term.chi_square.toFixed(2)} for ${term.n_data} data points, ${term.degrees_of_freedom} degrees of freedom`,
  }));
}
