import { CandelaError } from '../../errors.js';

/** |p - 1/2| up to which the central rational approximation is used (Wichura 1988, AS241). */
const CENTRAL_REGION_HALF_WIDTH = 0.425;
/** sqrt(-log(tail probability)) up to which the intermediate-tail approximation is used (AS241). */
const INTERMEDIATE_TAIL_LIMIT = 5;

/**
 * Quantile function of the standard normal distribution, Phi^-1(p): the z with
 * P(Z <= z) = p. Algorithm AS241 "PPND16" (Wichura, M. J. 1988, "The
 * percentage points of the normal distribution", Applied Statistics 37(3),
 * 477-484): three rational approximations of degree 7, in q = p - 1/2 for
 * |q| <= 0.425 and in r = sqrt(-log(min(p, 1 - p))) in the tails. Its relative
 * accuracy is about 1e-16, so no Newton refinement step is needed; it is the
 * algorithm of R's `qnorm`, which the rank-normalized diagnostics are defined with.
 *
 * Cost: one rational function (plus one log and one sqrt in the tails).
 * @param probability p in [0, 1]; p = 0 gives -Infinity and p = 1 gives +Infinity.
 * @returns z, in units of standard deviations.
 * @throws CandelaError `math.probability_range` for p outside [0, 1] or NaN.
 * @example inverseNormalCdf(0.975) // => 1.959963984540054
 */
export function inverseNormalCdf(probability: number): number {
  if (!(probability >= 0 && probability <= 1)) {
    throw new CandelaError({ code: 'math.probability_range', message: 'a probability must lie in [0, 1]', expected: '0 <= p <= 1', found: String(probability) });
  }
  if (probability === 0) return -Infinity;
  if (probability === 1) return Infinity;
  const q = probability - 0.5;
  if (Math.abs(q) <= CENTRAL_REGION_HALF_WIDTH) {
    const r = 0.180625 - q * q;
    return (
      (q *
        (((((((r * 2509.0809287301226727 + 33430.575583588128105) * r + 67265.770927008700853) * r + 45921.953931549871457) * r +
          13731.693765509461125) * r + 1971.5909503065514427) * r + 133.14166789178437745) * r + 3.387132872796366608)) /
      (((((((r * 5226.495278852545925 + 28729.085735721942674) * r + 39307.89580009271061) * r + 21213.794301586595867) * r +
        5394.1960214247511077) * r + 687.1870074920579083) * r + 42.313330701600911252) * r + 1)
    );
  }
  const tail = q < 0 ? probability : 1 - probability;
  let r = Math.sqrt(-Math.log(tail));
  let value: number;
  if (r <= INTERMEDIATE_TAIL_LIMIT) {
    r -= 1.6;
    value =
      (((((((r * 7.7454501427834140764e-4 + 0.0227238449892691845833) * r + 0.24178072517745061177) * r + 1.27045825245236838258) * r +
        3.64784832476320460504) * r + 5.7694972214606914055) * r + 4.6303378461565452959) * r + 1.42343711074968357734) /
      (((((((r * 1.05075007164441684324e-9 + 5.475938084995344946e-4) * r + 0.0151986665636164571966) * r + 0.14810397642748007459) * r +
        0.68976733498510000455) * r + 1.6763848301838038494) * r + 2.05319162663775882187) * r + 1);
  } else {
    r -= 5;
    value =
      (((((((r * 2.01033439929228813265e-7 + 2.71155556874348757815e-5) * r + 0.0012426609473880784386) * r + 0.026532189526576123093) * r +
        0.29656057182850489123) * r + 1.7848265399172913358) * r + 5.4637849111641143699) * r + 6.6579046435011037772) /
      (((((((r * 2.04426310338993978564e-15 + 1.4215117583164458887e-7) * r + 1.8463183175100546818e-5) * r + 7.868691311456132591e-4) * r +
        0.0148753612908506148525) * r + 0.13692988092273580531) * r + 0.59983220655588793769) * r + 1);
  }
  return q < 0 ? -value : value;
}
