/**
 * Mass, cumulative probability and quantile of a standard normal restricted
 * to [lower, upper] (standardized bounds), computed in whichever tail keeps
 * full relative precision (private helper for the truncated-Gaussian prior).
 */
import {
  standardNormalCumulative,
  inverseNormalCdf as standardNormalQuantile,
  standardNormalSurvival,
  standardNormalSurvivalQuantile,
} from '../math/index.js';

/** P(lower <= Z <= upper) for a standard normal Z (bounds in standard deviations). @example truncatedNormalMass(-1, 1) // 0.6826894921370859 */
export function truncatedNormalMass(lower: number, upper: number): number {
  if (lower > 0) return standardNormalSurvival(lower) - standardNormalSurvival(upper);
  return standardNormalCumulative(upper) - standardNormalCumulative(lower);
}

/** P(Z <= t | lower <= Z <= upper), clamped to [0, 1]. */
export function truncatedNormalCumulative(t: number, lower: number, upper: number): number {
  if (t <= lower) return 0;
  if (t >= upper) return 1;
  const mass = truncatedNormalMass(lower, upper);
  const inside = lower > 0
    ? standardNormalSurvival(lower) - standardNormalSurvival(t)
    : standardNormalCumulative(t) - standardNormalCumulative(lower);
  return Math.min(1, Math.max(0, inside / mass));
}

/** The t in [lower, upper] with truncatedNormalCumulative(t) = u, u in [0, 1]. */
export function truncatedNormalQuantile(u: number, lower: number, upper: number): number {
  const mass = truncatedNormalMass(lower, upper);
  const t = lower > 0
    ? standardNormalSurvivalQuantile(standardNormalSurvival(lower) - u * mass)
    : standardNormalQuantile(standardNormalCumulative(lower) + u * mass);
  return Math.min(upper, Math.max(lower, t));
}
