import { CandelaError } from '../errors.js';
import { choleskyInPlace, choleskySolveInPlace } from '../math/index.js';

/** Marginalized constraints implied by a Fisher matrix. */
export interface FisherMarginals {
  /** Parameter covariance F^-1, row major. */
  covariance: Float64Array;
  /** Marginalized 1-sigma errors sqrt((F^-1)_ii), in the parameters' units. */
  sigma: Float64Array;
  /** Correlation matrix (F^-1)_ij / (sigma_i sigma_j), row major. */
  correlation: Float64Array;
  /** 1/sqrt(det Cov(w0, wa)) when both w0 and wa are parameters, else null. */
  figureOfMerit: number | null;
}

/**
 * Inverts a Fisher matrix into marginalized errors, correlations and the
 * dark-energy figure of merit. The Cramer-Rao bound: sigma_i >= sqrt((F^-1)_ii)
 * for the marginalized error (Tegmark, Taylor & Heavens 1997, ApJ 480, 22). The figure of merit is 1/sqrt(det C_{w0 wa}) of the marginal 2 x 2
 * block (Albrecht et al. 2006, Report of the Dark Energy Task Force). The
 * inverse is taken column by column with Cholesky solves (the full covariance
 * is the wanted result here); a matrix that is not positive definite is a
 * degenerate forecast. Cost O(P^3).
 * @param fisher P x P Fisher matrix, row major, in inverse squared parameter units.
 * @param names parameter names in matrix order (w0 and wa are looked up by name).
 * @throws CandelaError `forecast.degenerate` naming the parameter at which the factorization fails.
 * @example marginalizeFisher(Float64Array.of(4, 0, 0, 1), ['omega_m', 'w0']).sigma // [0.5, 1]
 */
export function marginalizeFisher(fisher: Float64Array, names: readonly string[]): FisherMarginals {
  const size = names.length;
  const factor = Float64Array.from(fisher);
  const outcome = choleskyInPlace(factor, size);
  if (!outcome.ok) {
    throw new CandelaError({
      code: 'forecast.degenerate', path: names[outcome.index],
      message: `the Fisher matrix is not positive definite (pivot ${outcome.pivot.toPrecision(3)} at ${names[outcome.index]}): the survey cannot constrain this parameter together with the ones before it`,
      fix: 'fix the parameter, add a Gaussian prior on it, or widen the survey (redshift range, numbers)',
    });
  }
  const covariance = new Float64Array(size * size);
  const column = new Float64Array(size);
  for (let j = 0; j < size; j++) {
    column.fill(0);
    column[j] = 1;
    choleskySolveInPlace(factor, size, column);
    for (let i = 0; i < size; i++) covariance[i * size + j] = column[i];
  }
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < i; j++) {
      const mean = 0.5 * (covariance[i * size + j] + covariance[j * size + i]);
      covariance[i * size + j] = mean;
      covariance[j * size + i] = mean;
    }
  }
  const sigma = Float64Array.from({ length: size }, (_, i) => Math.sqrt(covariance[i * size + i]));
  const correlation = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) correlation[i * size + j] = i === j ? 1 : covariance[i * size + j] / (sigma[i] * sigma[j]);
  }
  const w0 = names.indexOf('w0');
  const wa = names.indexOf('wa');
  let figureOfMerit: number | null = null;
  if (w0 >= 0 && wa >= 0) {
    const determinant = covariance[w0 * size + w0] * covariance[wa * size + wa] - covariance[w0 * size + wa] ** 2;
    figureOfMerit = 1 / Math.sqrt(determinant);
  }
  return { covariance, sigma, correlation, figureOfMerit };
}
