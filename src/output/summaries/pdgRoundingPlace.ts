/**
 * The power of ten to which an uncertainty (and its central value) is
 * rounded, by the rule of the Review of Particle Physics (Particle Data
 * Group, Introduction, "Rounding"): look at the three leading digits of the
 * error; 100-354: keep two significant digits; 355-949: keep one; 950-999:
 * round the error up to 1000 and keep two significant digits (so 0.971
 * becomes 1.0). The central value is then rounded to the same place.
 *
 * The leading digits are read from the shortest decimal that reads back as
 * the same double (0.355 counts as 355, not as 354.99...). Truncated, not
 * rounded: 0.3549 has leading digits 354.
 *
 * Cost: O(1).
 * @param error a positive, finite uncertainty (any unit).
 * @returns the place p: round to multiples of 10^p (p = -2 means hundredths);
 *   undefined when the error is not positive and finite.
 * @example pdgRoundingPlace(0.119) // -2  (0.12)
 * @example pdgRoundingPlace(0.367) // -1  (0.4)
 * @example pdgRoundingPlace(0.971) // -1  (1.0)
 */
export function pdgRoundingPlace(error: number): number | undefined {
  if (!(error > 0) || !Number.isFinite(error)) return undefined;
  const [mantissa, exponentText] = error.toExponential().split('e');
  const exponent = Number(exponentText);
  const leading = Number(mantissa.replace('.', '').padEnd(3, '0').slice(0, 3));
  if (leading <= 354) return exponent - 1;
  return exponent;
}
