import { HALF_LOG_TWO_PI } from '../constants.js';
import { inverseNormalCdf } from './inverseNormalCdf.js';

/**
 * The standard normal distribution to full double precision: erf by its
 * everywhere-positive power series (Abramowitz & Stegun 1964, eq. 7.1.6) for
 * |x| < 1.5; erfc by its continued fraction (A&S eq. 7.1.14) evaluated with
 * the modified Lentz method (Press et al., Numerical Recipes, 3rd ed.,
 * section 5.2) above it. Quantiles come from {@link inverseNormalCdf}
 * (Wichura 1988, AS241), the one inverse normal CDF of candela.
 */

/**
 * Below this |x| the positive erf series is used (about 25 terms); above it the
 * continued fraction (about 90 terms at 1.5, fewer beyond), so erfc keeps about
 * 3e-15 relative accuracy (1 - erf loses at most a factor 30 at erfc(1.5) = 0.034).
 */
const SERIES_LIMIT = 1.5;
/** Relative size at which a series term or a Lentz factor no longer changes the result (about the unit roundoff). */
const CONVERGENCE_TOLERANCE = 1e-17;
/** Lentz's guard against a zero denominator. */
const TINY = 1e-300;
/** Iteration cap for the series and the continued fraction (never reached for finite input). */
const MAX_ITERATIONS = 500;

const TWO_OVER_SQRT_PI = 2 / Math.sqrt(Math.PI);
const INV_SQRT_PI = 1 / Math.sqrt(Math.PI);
const INV_SQRT_TWO = Math.SQRT1_2;

function erfSeries(x: number): number {
  const twiceSquare = 2 * x * x;
  let term = x;
  let sum = x;
  for (let n = 1; n < MAX_ITERATIONS; n++) {
    term *= twiceSquare / (2 * n + 1);
    sum += term;
    if (term < CONVERGENCE_TOLERANCE * sum) break;
  }
  return TWO_OVER_SQRT_PI * Math.exp(-x * x) * sum;
}

function erfcContinuedFraction(x: number): number {
  // erfc(x) = exp(-x^2)/sqrt(pi) / (x + (1/2)/(x + 1/(x + (3/2)/(x + ...)))), x > 0.
  let value = x;
  let c = x;
  let d = 0;
  for (let n = 1; n < MAX_ITERATIONS; n++) {
    const a = n / 2;
    d = x + a * d;
    if (Math.abs(d) < TINY) d = TINY;
    d = 1 / d;
    c = x + a / c;
    if (Math.abs(c) < TINY) c = TINY;
    const delta = c * d;
    value *= delta;
    if (Math.abs(delta - 1) < CONVERGENCE_TOLERANCE) break;
  }
  return (Math.exp(-x * x) * INV_SQRT_PI) / value;
}

/** Complementary error function erfc(x) = 1 - erf(x), relative accuracy ~1e-15. */
export function complementaryErrorFunction(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0) return 2 - complementaryErrorFunction(-x);
  if (x < SERIES_LIMIT) return 1 - erfSeries(x);
  if (x === Infinity) return 0;
  return erfcContinuedFraction(x);
}

/** Standard normal upper-tail probability Q(z) = P(Z > z), accurate to ~1e-15 relative in both tails. */
export function standardNormalSurvival(z: number): number {
  return 0.5 * complementaryErrorFunction(z * INV_SQRT_TWO);
}

/** Standard normal cumulative probability Phi(z) = P(Z <= z). */
export function standardNormalCumulative(z: number): number {
  return 0.5 * complementaryErrorFunction(-z * INV_SQRT_TWO);
}

/** ln of the standard normal density at z. */
export function logStandardNormalDensity(z: number): number {
  return -0.5 * z * z - HALF_LOG_TWO_PI;
}

/**
 * The z with Q(z) = q (upper-tail quantile), precise when q is tiny:
 * -Phi^-1(q), since AS241 works on the smaller tail probability directly.
 *
 * Cost: one {@link inverseNormalCdf}.
 * @param q upper-tail probability in [0, 1] (q = 0 gives +Infinity, q = 1 gives -Infinity).
 * @returns z in standard deviations.
 * @throws CandelaError `math.probability_range` for q outside [0, 1] or NaN.
 * @example standardNormalSurvivalQuantile(0.025) // 1.959963984540054
 */
export function standardNormalSurvivalQuantile(q: number): number {
  return -inverseNormalCdf(q);
}
