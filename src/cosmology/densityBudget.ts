import type { DarkEnergyEvolution } from './darkEnergyEvolution.js';

/**
 * The density parameters today (fractions of the critical density) and the
 * dark-energy law: everything the FLRW core needs. They sum to one:
 * radiation + matter + curvature + darkEnergy = 1.
 */
export interface DensityBudget {
  readonly radiation: number;
  readonly matter: number;
  readonly curvature: number;
  readonly darkEnergy: number;
  readonly law: DarkEnergyEvolution;
}

/**
 * E^2(z) = H^2(z) / H0^2 of an FLRW universe (Friedmann equation; notation of
 * Hogg 1999, arXiv:astro-ph/9905116, eq. 14, with radiation added):
 * E^2 = Omega_r (1+z)^4 + Omega_m (1+z)^3 + Omega_k (1+z)^2 + Omega_DE rho_DE(z)/rho_DE0.
 * Cost: a few flops plus the law's density (one exp unless Lambda).
 * @param budget density parameters and dark-energy law.
 * @param lnOnePlusZ x = ln(1 + z), dimensionless.
 * @param onePlusZ 1 + z (both are passed so the caller's values are reused).
 * @throws nothing; may return a value <= 0 for an unphysical budget.
 * @example squaredExpansionRate({ radiation: 0, matter: 0.3, curvature: 0, darkEnergy: 0.7, law: cosmologicalConstant() }, Math.log(2), 2)
 *   // => 3.1 (0.3 * 8 + 0.7)
 */
export function squaredExpansionRate(budget: DensityBudget, lnOnePlusZ: number, onePlusZ: number): number {
  const polynomial = onePlusZ * onePlusZ * (budget.curvature + onePlusZ * (budget.matter + onePlusZ * budget.radiation));
  return budget.darkEnergy === 0 ? polynomial : polynomial + budget.darkEnergy * budget.law.densityScaling(lnOnePlusZ, onePlusZ);
}

/**
 * Deceleration parameter q(z) = -a a'' / a'^2 = (1/2) sum_i Omega_i(z) (1 + 3 w_i)
 * from the acceleration equation a''/a = -(4 pi G / 3) sum_i (rho_i + 3 p_i / c^2)
 * (Friedmann 1922): radiation w = 1/3, matter w = 0, curvature does not enter,
 * dark energy w(z).
 * Cost: like squaredExpansionRate.
 * @param budget density parameters and law.
 * @param z redshift (>= 0).
 * @throws nothing; the caller ensures E^2(z) > 0.
 * @example decelerationParameter({ radiation: 0, matter: 0.3, curvature: 0, darkEnergy: 0.7, law: cosmologicalConstant() }, 0)
 *   // => -0.55 (0.5 * 0.3 - 0.7)
 */
export function decelerationParameter(budget: DensityBudget, z: number): number {
  const onePlusZ = 1 + z;
  const lnOnePlusZ = Math.log1p(z);
  const cube = onePlusZ * onePlusZ * onePlusZ;
  const radiation = budget.radiation * cube * onePlusZ;
  const matter = budget.matter * cube;
  const darkEnergy = budget.darkEnergy === 0 ? 0 : budget.darkEnergy * budget.law.densityScaling(lnOnePlusZ, onePlusZ);
  const squared = squaredExpansionRate(budget, lnOnePlusZ, onePlusZ);
  return (radiation + 0.5 * matter + 0.5 * darkEnergy * (1 + 3 * budget.law.equationOfState(z))) / squared;
}
