import { residualsFigure, type ResidualsFigureOptions } from '../../output/index.js';
import { binResiduals } from '../../output/index.js';
import type { RunOnDisk } from '../run/runFiles.js';

/** Redshift bins of the binned Hubble residuals (equal in ln z): the residuals figure and the Hubble figure's residual panel. */
export const RESIDUAL_FIGURE_BINS = 12;

/**
 * The figure `output.figures: [residuals]` promises: the run's Hubble
 * residuals at the best fit (hubble_diagram.csv) against redshift, with the
 * inverse-variance weighted means in RESIDUAL_FIGURE_BINS bins (none when the
 * data are already binned) and the
 * model's 68% band about its best fit (hubble_model.csv).
 *
 * Cost: O(n log n) for n supernovae.
 * @param run the run folder read back.
 * @param look figure width, font face, sample names and binned-data flag (the run's figure settings).
 * @returns the SVG document, or null when the run has no Hubble-diagram files (no supernovae).
 * @throws CandelaError from residualsFigure (e.g. no positive redshift).
 * @example residualsFigureOfRun(readRunFolder('out/run'))?.startsWith('<svg') // true
 */
export function residualsFigureOfRun(run: RunOnDisk, look: Pick<ResidualsFigureOptions, 'width' | 'fontFace' | 'sampleNames' | 'dataAreBinned'> = {}): string | null {
  if (!run.hubble) return null;
  const columns = run.hubble.columns;
  const z = Float64Array.from(columns.z, Number);
  const residual = Float64Array.from(columns.residual, Number);
  const error = Float64Array.from(columns.sigma_mu, Number);
  const model = run.hubbleModel;
  return residualsFigure({
    redshift: z, residualMag: residual, errorMag: error, sample: columns.sample,
    ...(look.dataAreBinned ? {} : { binnedResiduals: binResiduals(z, residual, error, RESIDUAL_FIGURE_BINS) }),
    ...(model ? { modelBand: { z: model.z, low68: model.mu_low68.map((value, i) => value - model.mu_median[i]), high68: model.mu_high68.map((value, i) => value - model.mu_median[i]) } } : {}),
  }, { width: look.width, fontFace: look.fontFace, sampleNames: look.sampleNames, dataAreBinned: look.dataAreBinned, modelLabel: `${run.record.model.label} (best fit)` });
}
