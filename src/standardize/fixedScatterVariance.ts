import type { SupernovaTable } from '../data/index.js';
import { FIVE_OVER_LN10, SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';

/** Lensing dispersion per unit redshift, mag (Jonsson et al. 2010, MNRAS 405, 535: sigma_lens = 0.055 z). */
export const LENSING_DISPERSION_PER_REDSHIFT = 0.055;

/** Which parameter-independent variance terms to add. */
export interface ScatterTerms {
  /** Lensing dispersion per unit redshift, mag (0 = none; {@link LENSING_DISPERSION_PER_REDSHIFT} is usual). */
  lensingPerRedshift: number;
  /** Peculiar-velocity dispersion, km/s (0 = none; 150 to 300 are usual). */
  peculiarVelocityKmPerS: number;
  /** Add the redshift measurement errors of the table. */
  includeRedshiftErrors: boolean;
}

/**
 * Variance terms that do not depend on the sampled parameters, in the form of
 * the JLA analysis, Betoule et al. (2014, A&A 568, A22):
 *
 *   sigma^2 = (lensingPerRedshift z)^2 + (5 / ln 10)^2 [(sigma_v / c)^2 + sigma_z^2] / z^2
 *
 * with z the Hubble-diagram redshift, sigma_v the peculiar-velocity
 * dispersion and sigma_z the redshift error (only when included). The
 * peculiar-velocity term is the low-redshift form d mu = (5 / ln 10) dz / z.
 * Cost O(N), no allocation.
 * @param table any supernova table (z > 0, as the reader guarantees).
 * @param terms which terms, with their sizes.
 * @param out length-N output, mag^2; returned.
 * @example
 * // z = 0.1, 0.055 z lensing, 300 km/s: 0.0055^2 + (2.1715 * 0.0010007 / 0.1)^2 = 5.02e-4 mag^2
 * fixedScatterVariance(table, { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 300, includeRedshiftErrors: false }, out)
 */
export function fixedScatterVariance(table: SupernovaTable, terms: ScatterTerms, out: Float64Array): Float64Array {
  const velocityFraction = terms.peculiarVelocityKmPerS / SPEED_OF_LIGHT_KM_PER_S;
  const lensing = terms.lensingPerRedshift;
  const redshiftErr = terms.includeRedshiftErrors ? table.redshiftErr : undefined;
  for (let i = 0; i < table.count; i++) {
    const z = table.redshift[i];
    const sigmaZ = redshiftErr ? redshiftErr[i] : 0;
    const fractional = (FIVE_OVER_LN10 * FIVE_OVER_LN10 * (velocityFraction * velocityFraction + sigmaZ * sigmaZ)) / (z * z);
    out[i] = lensing * z * (lensing * z) + fractional;
  }
  return out;
}
