import { csvField } from '../density/csvField.js';

/** Per-supernova columns of a Hubble diagram, as the writer needs them (plain arrays, one entry per supernova). */
export interface HubbleDiagramColumns {
  ids: readonly string[];
  /** Hubble-diagram redshift. */
  redshift: ArrayLike<number>;
  /** Observed distance modulus, mag (NaN: an empty cell, e.g. hidden in a blinded run). */
  distanceModulusMag: ArrayLike<number>;
  /** Error of the observed distance modulus, mag. */
  distanceModulusErrorMag: ArrayLike<number>;
  /** Model distance modulus, mag (NaN: an empty cell). */
  modelDistanceModulusMag: ArrayLike<number>;
  /** Observed minus model, mag. */
  residualMag: ArrayLike<number>;
  /** True for supernovae with an external distance (calibrators). */
  isCalibrator: readonly boolean[];
}

/** A finite number as its shortest round-trip text; NaN and infinities as an empty cell. */
function numberCell(value: number): string {
  return Number.isFinite(value) ? csvField(value) : '';
}

/**
 * The Hubble-diagram table as CSV (RFC 4180): id, sample, z, mu_obs,
 * sigma_mu, mu_model, residual (mag), calibrator (1 for supernovae with an
 * external distance, else 0). Non-finite numbers are empty cells.
 * @param diagram the per-supernova columns.
 * @param samples sample label of each supernova, in the same order.
 * @returns the CSV text, ending in a line break.
 * @throws nothing.
 * @example hubbleDiagramCsv(diagram, samples).split('\n')[0] // => 'id,sample,z,mu_obs,sigma_mu,mu_model,residual,calibrator'
 */
export function hubbleDiagramCsv(diagram: HubbleDiagramColumns, samples: readonly string[]): string {
  const lines = ['id,sample,z,mu_obs,sigma_mu,mu_model,residual,calibrator'];
  for (let i = 0; i < diagram.ids.length; i++) {
    lines.push([
      csvField(diagram.ids[i]), csvField(samples[i]), numberCell(diagram.redshift[i]), numberCell(diagram.distanceModulusMag[i]),
      numberCell(diagram.distanceModulusErrorMag[i]), numberCell(diagram.modelDistanceModulusMag[i]), numberCell(diagram.residualMag[i]),
      diagram.isCalibrator[i] ? '1' : '0',
    ].join(','));
  }
  return `${lines.join('\n')}\n`;
}
