import { readFileSync } from 'node:fs';
import { mockTruthValues, runWarning, type FigureWidth, type FontFace, type RunWarning } from '../../output/index.js';
import type { RunOnDisk } from '../run/runFiles.js';
import { plainConfiguration } from '../../config/index.js';

/** Figure kinds drawn when a run's configuration names none (the configuration's own default). */
const FALLBACK_FIGURES = ['triangle', 'hubble', 'trace'];
/** Legend label of the values read from a mock's truth file. */
export const TRUTH_LABEL = 'truth (mock input)';

/** How a run's figures are drawn and written, from its stored configuration (`output` and the data sets' figure keys). */
export interface FigureSettings {
  figures: string[];
  png: boolean;
  /** Undefined: the figures' on-screen design width. */
  width: FigureWidth | undefined;
  fontFace: FontFace;
  pdf: boolean;
  /** PNG dots per inch, or null for the fixed PNG width. */
  pngDpi: number | null;
  /** `auto` or the triangle's parameters in order. */
  triangleParameters: 'auto' | string[];
  /** True values from the truth file, by parameter name, or null. */
  truth: Record<string, number> | null;
  /** Sample code -> legend name, merged over the data sets. */
  sampleNames: Record<string, string>;
  /** Every data set says its rows are already binned. */
  dataAreBinned: boolean;
  /** Problems met while reading the settings (an unreadable truth file). */
  warnings: RunWarning[];
}

/**
 * Reads the figure settings of a run from the configuration stored in its
 * run.json (older runs without the newer keys get their defaults), and the
 * truth values when a truth file is named: the numbers under `truth` in a
 * `candela simulate` truth.json.
 * Cost: one small file read when a truth file is named.
 * @param run the run folder read back.
 * @returns the settings.
 * @throws nothing (an unreadable truth file becomes a warning).
 * @example figureSettings(readRunFolder('out/run')).fontFace // 'sans'
 */
export function figureSettings(run: RunOnDisk): FigureSettings {
  const configuration = plainConfiguration(run.record.configuration);
  const output = configuration.output ?? {};
  const sets = configuration.supernovae ?? [];
  const width = output.figure_width;
  const warnings: RunWarning[] = [];
  let truth: Record<string, number> | null = null;
  if (output.truth_file) {
    try {
      truth = mockTruthValues(readFileSync(output.truth_file, 'utf8'));
    } catch (error) {
      warnings.push(runWarning('truth_file_unreadable', null, `output.truth_file ${output.truth_file} could not be read (${(error as Error).message}): the triangle figure shows no truth`));
    }
  }
  return {
    figures: output.figures ?? FALLBACK_FIGURES,
    png: output.png ?? true,
    width: typeof width === 'number' ? { inches: width } : width === 'single' || width === 'double' ? width : undefined,
    fontFace: output.font === 'serif' ? 'serif' : 'sans',
    pdf: output.pdf ?? false,
    pngDpi: typeof output.png_dpi === 'number' ? output.png_dpi : null,
    triangleParameters: Array.isArray(output.triangle_parameters) ? output.triangle_parameters : 'auto',
    truth,
    sampleNames: Object.assign({}, ...sets.map((set) => set.sample_names ?? {})) as Record<string, string>,
    dataAreBinned: sets.length > 0 && sets.every((set) => set.binned === true),
    warnings,
  };
}
