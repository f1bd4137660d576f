/**
 * The part of an error budget that one ingredient adds in quadrature:
 * sign(a^2 - b^2) sqrt(|a^2 - b^2|), where `withSd` is the standard
 * deviation with the ingredient and `withoutSd` without it. Errors of
 * independent Gaussian contributions add in quadrature, so this is the
 * ingredient's contribution when a >= b (common practice in systematic
 * error budgets, e.g. Betoule et al. 2014, table 12). It comes out negative
 * only when Monte Carlo noise makes the posterior with the ingredient look
 * narrower than without it; the sign is kept so that such noise shows
 * instead of being clipped to zero.
 *
 * Cost O(1).
 * @param withSd standard deviation with the ingredient (unit of the parameter, >= 0).
 * @param withoutSd standard deviation without it (same unit, >= 0).
 * @returns the signed contribution, same unit; 0 when both are equal.
 * @example quadratureDifference(5, 4) // 3
 * @example quadratureDifference(4, 5) // -3
 */
export function quadratureDifference(withSd: number, withoutSd: number): number {
  const difference = (withSd - withoutSd) * (withSd + withoutSd);
  return Math.sign(difference) * Math.sqrt(Math.abs(difference));
}
