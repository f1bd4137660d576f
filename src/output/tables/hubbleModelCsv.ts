import { csvField } from '../density/csvField.js';

/** The model curve of a Hubble diagram on a redshift grid (arrays of one length). */
export interface HubbleModelCurve {
  /** Redshift grid. */
  redshift: ArrayLike<number>;
  /** Best-fit distance modulus, mag. */
  bestMag: ArrayLike<number>;
  /** Median over posterior draws, mag. */
  medianMag: ArrayLike<number>;
  /** 15.87% quantile over posterior draws, mag. */
  low68Mag: ArrayLike<number>;
  /** 84.13% quantile over posterior draws, mag. */
  high68Mag: ArrayLike<number>;
}

/**
 * The Hubble-diagram model curve as CSV (RFC 4180): z, mu_best, mu_median,
 * mu_low68, mu_high68 (mag), one row per grid point; non-finite numbers
 * (no usable draw) are empty cells.
 * @param curve the grid and the four curves.
 * @returns the CSV text, ending in a line break.
 * @throws nothing.
 * @example hubbleModelCsv({ redshift: [0.1], bestMag: [38.3], medianMag: [38.3], low68Mag: [38.2], high68Mag: [38.4] }) // => 'z,mu_best,mu_median,mu_low68,mu_high68\n0.1,38.3,38.3,38.2,38.4\n'
 */
export function hubbleModelCsv(curve: HubbleModelCurve): string {
  const lines = ['z,mu_best,mu_median,mu_low68,mu_high68'];
  for (let i = 0; i < curve.redshift.length; i++) {
    lines.push([curve.redshift[i], curve.bestMag[i], curve.medianMag[i], curve.low68Mag[i], curve.high68Mag[i]]
      .map((value) => (Number.isFinite(value) ? csvField(value) : '')).join(','));
  }
  return `${lines.join('\n')}\n`;
}
