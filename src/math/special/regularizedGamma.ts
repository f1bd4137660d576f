import { CandelaError } from '../../errors.js';
import { logGamma } from './logGamma.js';

/** Relative size of a series term or continued-fraction factor at which the sum has converged (about the unit roundoff; Press et al. 2007, section 6.2). */
const CONVERGENCE_TOLERANCE = 1e-16;
/** Guard against a zero denominator in the modified Lentz method (Press et al. 2007, section 5.2). */
const LENTZ_TINY = 1e-300;
/** Iteration cap; both expansions need O(sqrt(a)) terms, so this allows a up to about 1e8. */
const MAX_ITERATIONS = 100_000;

function notConverged(a: number, x: number): CandelaError {
  return new CandelaError({ code: 'math.gamma_not_converged', message: 'the incomplete gamma function did not converge', expected: `convergence within ${MAX_ITERATIONS} terms`, found: `a = ${a}, x = ${x}` });
}

/** ln P(a, x) from the series gamma(a,x) = e^-x x^a sum_n x^n / (a (a+1) ... (a+n)) (A&S eq. 6.5.29). */
function logLowerBySeries(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  for (let n = 1; n < MAX_ITERATIONS; n++) {
    term *= x / (a + n);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * CONVERGENCE_TOLERANCE) return -x + a * Math.log(x) - logGamma(a) + Math.log(sum);
  }
  throw notConverged(a, x);
}

/** ln Q(a, x) from the continued fraction of Legendre (A&S eq. 6.5.31) by the modified Lentz method. */
function logUpperByContinuedFraction(a: number, x: number): number {
  let b = x + 1 - a;
  let c = 1 / LENTZ_TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < MAX_ITERATIONS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < LENTZ_TINY) d = LENTZ_TINY;
    c = b + an / c;
    if (Math.abs(c) < LENTZ_TINY) c = LENTZ_TINY;
    d = 1 / d;
    const factor = d * c;
    h *= factor;
    if (Math.abs(factor - 1) < CONVERGENCE_TOLERANCE) return -x + a * Math.log(x) - logGamma(a) + Math.log(h);
  }
  throw notConverged(a, x);
}

function checkArguments(a: number, x: number): void {
  if (!(a > 0) || !Number.isFinite(a) || !(x >= 0) || Number.isNaN(x)) {
    throw new CandelaError({ code: 'math.invalid_argument', message: 'the incomplete gamma function needs a > 0 and x >= 0', expected: 'a > 0 finite, x >= 0', found: `a = ${a}, x = ${x}` });
  }
}

/**
 * Natural log of the regularized upper incomplete gamma function
 * Q(a, x) = Gamma(a, x) / Gamma(a), following Press, Teukolsky, Vetterling &
 * Flannery (2007, Numerical Recipes 3rd ed., section 6.2): the series for
 * x < a + 1 (then Q = 1 - P), Legendre's continued fraction otherwise, so
 * that tiny tail probabilities keep full relative accuracy and never underflow
 * in log form. Q(nu/2, chi2/2) is the chi-square survival function.
 *
 * Cost: O(sqrt(a) + 1) terms.
 * @param a Shape a > 0 (dimensionless).
 * @param x Argument x >= 0 (Infinity gives -Infinity).
 * @throws CandelaError `math.invalid_argument` for a <= 0 or x < 0 or NaN; `math.gamma_not_converged` for a beyond about 1e8.
 * @example Math.exp(logRegularizedGammaQ(1, 2)) // e^-2 = 0.1353352832366127
 */
export function logRegularizedGammaQ(a: number, x: number): number {
  checkArguments(a, x);
  if (x === 0) return 0;
  if (x === Infinity) return -Infinity;
  if (x < a + 1) return Math.log1p(-Math.exp(logLowerBySeries(a, x)));
  return logUpperByContinuedFraction(a, x);
}

/**
 * Regularized lower incomplete gamma function P(a, x) = gamma(a, x) / Gamma(a)
 * = 1 - Q(a, x) (Press et al. 2007, section 6.2; A&S eq. 6.5.1).
 *
 * Cost: O(sqrt(a) + 1) terms.
 * @param a Shape a > 0.
 * @param x Argument x >= 0.
 * @throws As {@link logRegularizedGammaQ}.
 * @example regularizedGammaP(0.5, 0.5) // erf(sqrt(0.5)) = 0.6826894921370859
 */
export function regularizedGammaP(a: number, x: number): number {
  checkArguments(a, x);
  if (x === 0) return 0;
  if (x === Infinity) return 1;
  if (x < a + 1) return Math.exp(logLowerBySeries(a, x));
  return -Math.expm1(logUpperByContinuedFraction(a, x));
}

/**
 * Regularized upper incomplete gamma function Q(a, x) = 1 - P(a, x)
 * (Press et al. 2007, section 6.2). See {@link logRegularizedGammaQ}.
 * @example regularizedGammaQ(1.5, 7.814728 / 2) // 0.0500 (chi-square with 3 degrees of freedom beyond 7.814728; A&S Table 26.8)
 */
export function regularizedGammaQ(a: number, x: number): number {
  return Math.exp(logRegularizedGammaQ(a, x));
}
