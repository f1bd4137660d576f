import { CandelaError } from '../errors.js';
import { HALF_LOG_TWO_PI, inverseNormalCdf, logRegularizedGammaQ } from '../math/index.js';

/**
 * Below this tail probability the inverse normal CDF is replaced by Newton
 * steps on the asymptotic normal tail (A&S eq. 26.2.12), so that p-values
 * that underflow double precision still give a finite n-sigma.
 */
const SMALLEST_DIRECT_TAIL = 1e-300;
/** Newton steps on the asymptotic tail; from the leading-order start, 6 reach 1e-12 relative for z > 37. */
const TAIL_NEWTON_STEPS = 6;

/** The words that go with every frequentist significance in candela's tables. */
export const SIGNIFICANCE_CAUTION =
  'The n-sigma figure converts a difference in best-fit chi-square only. It ignores the priors and the volume of ' +
  'parameter space the extra parameters open (the Occam penalty), and relies on Wilks (1938): nested models, ' +
  'extra parameters not at the edge of their range, and a log-likelihood that is close to quadratic.';

/** A delta chi-square turned into a p-value and an equivalent Gaussian significance. */
export interface ChiSquareSignificance {
  /** The chi-square improvement, base minus extended (>= 0 for a proper fit). */
  deltaChiSquare: number;
  /** Number of extra free parameters m (degrees of freedom). */
  extraParameters: number;
  /** Probability of an improvement at least this large by chance: Q(m/2, delta chi2 / 2). */
  pValue: number;
  /** Natural log of the p-value (finite even when the p-value underflows to 0). */
  logPValue: number;
  /** Two-sided Gaussian equivalent: the n with P(|Z| > n) = p; 0 for p = 1. */
  sigma: number;
  /** {@link SIGNIFICANCE_CAUTION}. */
  caution: string;
}

/** ln of the two-sided tail 2 (1 - Phi(z)) for large z: Mills-ratio series to order z^-6 (A&S eq. 26.2.12). */
function logTwoSidedTail(z: number): number {
  const inverseSquared = 1 / (z * z);
  const series = 1 - inverseSquared + 3 * inverseSquared * inverseSquared - 15 * inverseSquared ** 3;
  return Math.log(2) - 0.5 * z * z - HALF_LOG_TWO_PI - Math.log(z) + Math.log(series);
}

/**
 * The two-sided Gaussian significance n of a p-value given as its natural log:
 * P(|Z| > n) = p, i.e. n = -Phi^-1(p / 2), with Phi^-1 from Wichura (1988,
 * AS241; src/math/special/inverseNormalCdf.ts). For p below 2e-300 it solves the
 * asymptotic tail equation by Newton's method instead.
 *
 * Cost: O(1).
 * @param logPValue ln p, at most 0.
 * @returns n in standard deviations (0 for p = 1).
 * @throws CandelaError `compare.invalid_argument` for ln p > 0 or NaN.
 * @example twoSidedGaussianSigma(Math.log(0.0455003)) // 2.0000
 */
export function twoSidedGaussianSigma(logPValue: number): number {
  if (!(logPValue <= 0)) {
    throw new CandelaError({ code: 'compare.invalid_argument', message: 'a p-value must lie in [0, 1]', expected: 'ln p <= 0', found: String(logPValue) });
  }
  const halfTail = Math.exp(logPValue) / 2;
  if (halfTail >= SMALLEST_DIRECT_TAIL) return Math.max(0, -inverseNormalCdf(halfTail));
  if (logPValue === -Infinity) return Infinity;
  let z = Math.sqrt(-2 * logPValue);
  for (let step = 0; step < TAIL_NEWTON_STEPS; step++) {
    // d/dz ln tail = -z - 1/z + (small series derivative, neglected: Newton still converges).
    z -= (logTwoSidedTail(z) - logPValue) / (-z - 1 / z);
  }
  return z;
}

/**
 * Equivalent Gaussian significance of a chi-square improvement delta chi2
 * obtained by m extra parameters (common practice; Press et al. 2007,
 * Numerical Recipes 3rd ed., section 15.6): by Wilks (1938) delta chi2 follows
 * a chi-square law with m degrees of freedom under the simpler model, so
 * p = Q(m/2, delta chi2 / 2) and n = -Phi^-1(p / 2). Examples: delta chi2 = 1,
 * m = 1 gives 1 sigma; delta chi2 = 2.30, m = 2 gives 1 sigma.
 * A negative delta chi2 (the extended fit not converged) counts as 0.
 *
 * Cost: O(sqrt(m) + 1).
 * @param deltaChiSquare chi2_min(base) - chi2_min(extended), dimensionless.
 * @param extraParameters m, an integer >= 1.
 * @throws CandelaError `compare.invalid_argument` for non-finite delta chi2 or m not a positive integer.
 * @example deltaChiSquareSignificance(4, 1).sigma // 2.0000
 */
export function deltaChiSquareSignificance(deltaChiSquare: number, extraParameters: number): ChiSquareSignificance {
  if (!Number.isFinite(deltaChiSquare) || !Number.isInteger(extraParameters) || extraParameters < 1) {
    throw new CandelaError({
      code: 'compare.invalid_argument',
      message: 'a significance needs a finite delta chi-square and a positive whole number of extra parameters',
      expected: 'finite delta chi2, m >= 1',
      found: `delta chi2 = ${deltaChiSquare}, m = ${extraParameters}`,
    });
  }
  const logPValue = logRegularizedGammaQ(extraParameters / 2, Math.max(0, deltaChiSquare) / 2);
  return {
    deltaChiSquare,
    extraParameters,
    pValue: Math.exp(logPValue),
    logPValue,
    sigma: twoSidedGaussianSigma(logPValue),
    caution: SIGNIFICANCE_CAUTION,
  };
}
