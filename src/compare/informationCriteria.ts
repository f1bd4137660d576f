import { CandelaError } from '../errors.js';

function check(name: string, value: number, expected: string, ok: boolean): void {
  if (!ok) throw new CandelaError({ code: 'compare.invalid_argument', path: name, message: `${name} is not valid for an information criterion`, expected, found: String(value) });
}

/**
 * Akaike information criterion (Akaike 1974, IEEE Trans. Autom. Control 19, 716):
 *   AIC = -2 ln L_max + 2 k.
 * candela defines it with the full maximum log-likelihood (normalization
 * included), like BIC below. When the data covariance does not depend on the
 * parameters, -2 ln L_max = chi2_min + constant and the constant cancels in
 * every AIC difference, so delta AIC = delta chi2_min + 2 delta k.
 *
 * Cost: O(1).
 * @param bestFitDeviance -2 ln L_max, dimensionless (ln L in nats).
 * @param freeParameterCount k, the number of parameters varied in the fit (integer >= 0).
 * @throws CandelaError `compare.invalid_argument` for a non-finite deviance or a bad k.
 * @example akaikeInformationCriterion(100, 3) // 106
 */
export function akaikeInformationCriterion(bestFitDeviance: number, freeParameterCount: number): number {
  check('bestFitDeviance', bestFitDeviance, 'a finite number', Number.isFinite(bestFitDeviance));
  check('freeParameterCount', freeParameterCount, 'an integer >= 0', Number.isInteger(freeParameterCount) && freeParameterCount >= 0);
  return bestFitDeviance + 2 * freeParameterCount;
}

/**
 * Bayesian (Schwarz) information criterion (Schwarz 1978, Ann. Stat. 6, 461):
 *   BIC = -2 ln L_max + k ln N,
 * an asymptotic approximation to -2 ln Z for N independent data points.
 *
 * Cost: O(1).
 * @param bestFitDeviance -2 ln L_max, dimensionless.
 * @param freeParameterCount k (integer >= 0).
 * @param dataCount N, the number of data points (integer >= 1; supernovae for candela).
 * @throws CandelaError `compare.invalid_argument` for a non-finite deviance, bad k or bad N.
 * @example bayesianInformationCriterion(100, 2, 100) // 109.21034037197618
 */
export function bayesianInformationCriterion(bestFitDeviance: number, freeParameterCount: number, dataCount: number): number {
  check('bestFitDeviance', bestFitDeviance, 'a finite number', Number.isFinite(bestFitDeviance));
  check('freeParameterCount', freeParameterCount, 'an integer >= 0', Number.isInteger(freeParameterCount) && freeParameterCount >= 0);
  check('dataCount', dataCount, 'an integer >= 1', Number.isInteger(dataCount) && dataCount >= 1);
  return bestFitDeviance + freeParameterCount * Math.log(dataCount);
}
