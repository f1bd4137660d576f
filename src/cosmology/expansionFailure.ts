import { squaredExpansionRate } from './densityBudget.js';
import type { DensityBudget } from './densityBudget.js';

/** Where E^2 stops being positive. */
export interface ExpansionFailure {
  /** Lowest redshift found where E^2 reaches 0 (Infinity: only asymptotically). */
  redshift: number;
  /** Redshift of the first non-positive sample, and E^2 there (<= 0, or NaN for an undefined value). */
  sampleRedshift: number;
  squaredExpansionRate: number;
}

/** What a scan of E^2 over [0, maxRedshift] found. */
export interface ExpansionScan {
  failure: ExpansionFailure | null;
  /**
   * Distance, in ln(1+z), from the real axis to the complex zeros of E^2 that
   * the deepest dip of E^2 implies (Infinity when E^2 has no interior minimum).
   * A dip of depth m and curvature k (in ln(1+z)) has zeros at +- i sqrt(2m/k).
   */
  dipSingularityDistanceLn: number;
}

/** Grid step in ln(1+z): E^2 is a sum of at most four exponentials in ln(1+z), so a dip narrower than this would need near-exact cancellation. */
const GRID_STEP_LN = 0.02;
/** The grid stops at ln(1+z) = 16 (z ~ 9e6); beyond, the term with the largest power of (1+z) decides. */
const GRID_END_LN = 16;
/** Golden-section and bisection steps (shrink a bracket by 0.618^60 ~ 3e-13 or 2^-60). */
const REFINE_STEPS = 60;
/** Bisection for the first zero of E^2 stops at this bracket width in ln(1+z) (~1e-15 relative in 1+z). */
const BISECTION_WIDTH_LN = 1e-15;
/** Powers of (1+z) closer than this are one term in the asymptotic check. */
const SAME_POWER = 1e-12;

/**
 * Looks for a redshift in [0, maxRedshift] where E^2(z) <= 0, i.e. where the
 * Friedmann equation has no real expansion rate: the universe would have
 * bounced (no Big Bang) before that redshift.
 * Cost: see scanExpansion.
 * @param budget density parameters and law.
 * @param maxRedshift largest redshift to check (>= 0, may be Infinity).
 * @returns null when E^2 > 0 throughout, else the first failure found.
 * @throws nothing.
 * @example findExpansionFailure({ radiation: 0, matter: 0.1, curvature: -1.6, darkEnergy: 2.5, law: cosmologicalConstant() }, Infinity)
 *   // => { redshift: 0.30..., ... } (a bouncing closed universe: 0.1 u^3 - 1.6 u^2 + 2.5 = 0 at u = 1 + z)
 */
export function findExpansionFailure(budget: DensityBudget, maxRedshift: number): ExpansionFailure | null {
  return scanExpansion(budget, maxRedshift).failure;
}

/**
 * Scans E^2 on a grid of step 0.02 in ln(1+z) up to min(ln(1+maxRedshift), 16),
 * refines the smallest value by golden-section search, bisects to the first
 * zero when there is one, and, when maxRedshift lies beyond the grid, checks
 * the sign of the dominant high-redshift term. Also measures the deepest dip
 * of E^2, which tells the quadrature how close its integrand's singularities
 * come to the real axis.
 * Cost: <= 800 E^2 evaluations for maxRedshift = Infinity, ~60 for z <= 2.3.
 * @param budget density parameters and law.
 * @param maxRedshift largest redshift to check (>= 0, may be Infinity).
 * @throws nothing.
 * @example scanExpansion({ radiation: 0, matter: 0.3, curvature: 0, darkEnergy: 0.7, law: cosmologicalConstant() }, 2)
 *   // => { failure: null, dipSingularityDistanceLn: Infinity } (E^2 grows monotonically)
 */
export function scanExpansion(budget: DensityBudget, maxRedshift: number): ExpansionScan {
  const endLn = Math.min(Math.log1p(maxRedshift), GRID_END_LN);
  const steps = Math.max(2, Math.ceil(endLn / GRID_STEP_LN));
  const step = endLn / steps;
  const valueAt = (lnOnePlusZ: number): number => squaredExpansionRate(budget, lnOnePlusZ, Math.exp(lnOnePlusZ));
  let smallestIndex = 0;
  let smallest = Infinity;
  let dipDistance = Infinity;
  let beforePrevious = NaN;
  let previous = NaN;
  for (let i = 0; i <= steps; i++) {
    const value = valueAt(i * step);
    if (!(value > 0)) return { failure: failureBetween(valueAt, (i - 1) * step, i * step, value), dipSingularityDistanceLn: 0 };
    if (value < smallest) { smallest = value; smallestIndex = i; }
    // previous is an interior local minimum: fit a parabola through the three samples.
    if (i >= 2 && previous <= beforePrevious && previous <= value) {
      const curvature = (beforePrevious - 2 * previous + value) / (step * step);
      const slope = (value - beforePrevious) / (2 * step);
      const depth = curvature > 0 ? previous - (slope * slope) / (2 * curvature) : previous;
      if (curvature > 0) dipDistance = Math.min(dipDistance, Math.sqrt((2 * Math.max(depth, 0)) / curvature));
    }
    beforePrevious = previous;
    previous = value;
  }
  const refined = goldenSectionMinimum(valueAt, Math.max(0, (smallestIndex - 1) * step), Math.min(endLn, (smallestIndex + 1) * step));
  if (!(refined.value > 0)) {
    return { failure: failureBetween(valueAt, Math.max(0, (smallestIndex - 1) * step), refined.x, refined.value), dipSingularityDistanceLn: 0 };
  }
  if (Math.log1p(maxRedshift) > GRID_END_LN) {
    const dominant = dominantHighRedshiftCoefficient(budget);
    if (!(dominant > 0)) return { failure: { redshift: Infinity, sampleRedshift: Infinity, squaredExpansionRate: dominant }, dipSingularityDistanceLn: 0 };
  }
  return { failure: null, dipSingularityDistanceLn: dipDistance };
}

/**
 * The coefficient of the highest power of (1+z) in E^2 as z -> infinity
 * (powers 4, 3, 2 and the dark-energy law's exponent, which may tie).
 * Cost: O(1).
 * @param budget density parameters and law.
 * @throws nothing.
 * @example dominantHighRedshiftCoefficient({ radiation: 0, matter: 0.3, curvature: 0, darkEnergy: 0.7, law: cosmologicalConstant() }) // => 0.3
 */
export function dominantHighRedshiftCoefficient(budget: DensityBudget): number {
  const terms: [number, number][] = [
    [4, budget.radiation],
    [3, budget.matter],
    [2, budget.curvature],
    [budget.law.highRedshiftExponent, budget.darkEnergy * Math.exp(budget.law.highRedshiftLogFactor)],
  ];
  const power = dominantHighRedshiftPower(budget);
  let sum = 0;
  for (const [p, coefficient] of terms) if (coefficient !== 0 && Math.abs(p - power) <= SAME_POWER) sum += coefficient;
  return sum;
}

/**
 * The highest power of (1+z) with a non-zero coefficient in E^2 (-Infinity
 * when all vanish). The age integral converges only when it is > 0.
 * Cost: O(1).
 * @param budget density parameters and law.
 * @throws nothing.
 * @example dominantHighRedshiftPower({ radiation: 0, matter: 0, curvature: 0, darkEnergy: 1, law: cosmologicalConstant() }) // => 0 (de Sitter: infinite age)
 */
export function dominantHighRedshiftPower(budget: DensityBudget): number {
  let power = -Infinity;
  if (budget.radiation !== 0) power = 4;
  else if (budget.matter !== 0) power = 3;
  else if (budget.curvature !== 0) power = 2;
  if (budget.darkEnergy !== 0) power = Math.max(power, budget.law.highRedshiftExponent);
  return power;
}

/** Bisects [positiveLn, failingLn] in ln(1+z) for the first zero of E^2 (E^2(0) = 1 > 0 always). */
function failureBetween(f: (lnOnePlusZ: number) => number, positiveLn: number, failingLn: number, failingValue: number): ExpansionFailure {
  let low = Math.max(0, positiveLn);
  let high = failingLn;
  for (let i = 0; i < REFINE_STEPS && high - low > BISECTION_WIDTH_LN; i++) {
    const middle = 0.5 * (low + high);
    if (f(middle) > 0) low = middle;
    else high = middle;
  }
  return { redshift: Math.expm1(0.5 * (low + high)), sampleRedshift: Math.expm1(failingLn), squaredExpansionRate: failingValue };
}

/** Golden-section search (Kiefer 1953) for the minimum of a unimodal f on [lower, upper]. */
function goldenSectionMinimum(f: (lnOnePlusZ: number) => number, lower: number, upper: number): { x: number; value: number } {
  const ratio = (Math.sqrt(5) - 1) / 2;
  let left = lower;
  let right = upper;
  let innerLeft = right - ratio * (right - left);
  let innerRight = left + ratio * (right - left);
  let valueLeft = f(innerLeft);
  let valueRight = f(innerRight);
  for (let i = 0; i < REFINE_STEPS; i++) {
    if (valueLeft < valueRight) {
      right = innerRight; innerRight = innerLeft; valueRight = valueLeft;
      innerLeft = right - ratio * (right - left); valueLeft = f(innerLeft);
    } else {
      left = innerLeft; innerLeft = innerRight; valueLeft = valueRight;
      innerRight = left + ratio * (right - left); valueRight = f(innerRight);
    }
  }
  return valueLeft < valueRight ? { x: innerLeft, value: valueLeft } : { x: innerRight, value: valueRight };
}
