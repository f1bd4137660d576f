import { decelerationParameter } from './densityBudget.js';
import type { DensityBudget } from './densityBudget.js';

/** Upper end of the search, redshift: acceleration that started earlier than z = 1000 is not looked for. */
export const ACCELERATION_SEARCH_MAX_REDSHIFT = 1e3;
/** Scan step in ln(1+z) before bisection (q(z) changes on scales of order one in ln(1+z)). */
const SCAN_STEP_LN = 0.01;
/** Bisection stops when the bracket in ln(1+z) is this narrow (about 1e-14 relative in 1+z). */
const BISECTION_WIDTH_LN = 1e-14;

/**
 * The redshift at which the expansion began to accelerate: the lowest z > 0
 * where the deceleration parameter q(z) crosses zero from q < 0 (below) to
 * q > 0 (above). Null when q0 >= 0 (not accelerating today) or when no
 * crossing lies below min(1000, maxRedshift).
 * Method: scan q on a grid of step 0.01 in ln(1+z), then bisect the bracket.
 * Cost: ~700 q evaluations for the full range plus ~50 for the bisection.
 * @param budget density parameters and law (E^2 > 0 up to maxRedshift).
 * @param maxRedshift largest redshift that was checked for E^2 > 0.
 * @throws nothing.
 * @example accelerationRedshift({ radiation: 0, matter: 0.3, curvature: 0, darkEnergy: 0.7, law: cosmologicalConstant() }, Infinity)
 *   // => 0.6710 ((2 Omega_L / Omega_m)^(1/3) - 1)
 */
export function accelerationRedshift(budget: DensityBudget, maxRedshift: number): number | null {
  const q = (lnOnePlusZ: number): number => decelerationParameter(budget, Math.expm1(lnOnePlusZ));
  if (!(q(0) < 0)) return null;
  const endLn = Math.log1p(Math.min(ACCELERATION_SEARCH_MAX_REDSHIFT, maxRedshift));
  const steps = Math.max(1, Math.ceil(endLn / SCAN_STEP_LN));
  const step = endLn / steps;
  let below = 0;
  for (let i = 1; i <= steps; i++) {
    const lnOnePlusZ = i * step;
    if (q(lnOnePlusZ) >= 0) {
      let low = below;
      let high = lnOnePlusZ;
      while (high - low > BISECTION_WIDTH_LN) {
        const middle = 0.5 * (low + high);
        if (middle <= low || middle >= high) break;
        if (q(middle) < 0) low = middle;
        else high = middle;
      }
      return Math.expm1(0.5 * (low + high));
    }
    below = lnOnePlusZ;
  }
  return null;
}
