import { ensembleAutocorrelation } from '../../diagnostics/index.js';
import { isCandelaError } from '../../errors.js';
import { autocorrelationFigure, type AutocorrelationFigureOptions, type AutocorrelationSeries } from '../../output/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { RunOnDisk } from '../run/runFiles.js';

/**
 * The figure `output.figures: [autocorrelation]` promises: for every sampled
 * parameter, the normalized autocorrelation function over the whole chain
 * with every walker of every ensemble a series (ensembleAutocorrelation, the
 * same walkers and steps from which the summaries' tau is computed), and that
 * tau marked. A parameter whose walkers never moved is left out.
 *
 * Cost: two FFTs of length about 2 x steps per pair of walkers and parameter.
 * @param run the run folder read back.
 * @param analysis its analysis (layout and tau per parameter).
 * @param look figure width and font face (the run's figure settings).
 * @returns the SVG document, or null for a nested-sampling run (its samples are not a chain) or when no parameter moved.
 * @throws CandelaError from autocorrelationFigure.
 * @example autocorrelationFigureOfRun(run, analyzeRun(run))?.includes('tau-marker') // true
 */
export function autocorrelationFigureOfRun(run: RunOnDisk, analysis: RunAnalysis, look: Pick<AutocorrelationFigureOptions, 'width' | 'fontFace'> = {}): string | null {
  if (analysis.method !== 'ensemble') return null;
  // Chains read every k-th step (the memory budget): the series hold the kept steps, k steps apart.
  const { storedSteps: steps, walkers, ensembles, stepStride } = analysis;
  const series: AutocorrelationSeries[] = [];
  for (const name of analysis.sampled) {
    const column = run.chains.columns[name];
    const walkerSeries: Float64Array[] = [];
    for (let k = 0; k < ensembles; k++) {
      for (let w = 0; w < walkers; w++) walkerSeries.push(Float64Array.from({ length: steps }, (_, s) => column[(k * steps + s) * walkers + w]));
    }
    try {
      series.push({ parameter: name, correlation: ensembleAutocorrelation(walkerSeries).correlation, tauSteps: analysis.diagnostics[name]?.tau ?? null, ...(stepStride > 1 ? { lagStepSize: stepStride } : {}) });
    } catch (error) {
      if (!isCandelaError(error)) throw error;
    }
  }
  return series.length > 0 ? autocorrelationFigure(series, { width: look.width, fontFace: look.fontFace }) : null;
}
