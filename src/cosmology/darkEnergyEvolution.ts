import { darkEnergyLaw } from './darkEnergyLaws.js';

/** The dark-energy laws candela knows: Lambda, constant w (wCDM), CPL w0-wa. */
export type DarkEnergyLaw = 'lambda' | 'constant_w' | 'cpl';

/**
 * What a dark-energy law supplies to the FLRW core: its equation of state
 * w(z) = p / (rho c^2) and its density relative to today,
 * rho_DE(z) / rho_DE0 = exp(3 int_0^z (1 + w(z')) dz' / (1 + z')).
 * The core owns E(z) and every distance; a law is a few lines.
 * Both density functions take x = ln(1 + z) and 1 + z, which the core has
 * already computed, so the hot loop calls no extra log.
 */
export interface DarkEnergyEvolution {
  readonly law: DarkEnergyLaw;
  /** w(z), dimensionless; z >= 0 (redshift). */
  equationOfState(z: number): number;
  /** rho_DE(z) / rho_DE0 at x = ln(1+z) (onePlusZ = 1 + z). */
  densityScaling(lnOnePlusZ: number, onePlusZ: number): number;
  /** ln of densityScaling; finite even where the scaling itself would overflow. */
  logDensityScaling(lnOnePlusZ: number, onePlusZ: number): number;
  /** p such that rho_DE(z) / rho_DE0 -> C (1+z)^p as z -> infinity. */
  readonly highRedshiftExponent: number;
  /** ln C of that limit. */
  readonly highRedshiftLogFactor: number;
}

/**
 * The evolution for a law and its parameters (through the law registry).
 * Cost: O(1).
 * @param law a name of the registry: 'lambda' (w = -1), 'constant_w' (w = w0), 'cpl' (w0 + wa z/(1+z)).
 * @param w0 equation of state today (dimensionless; ignored for 'lambda').
 * @param wa CPL slope dw/da (dimensionless; used only by 'cpl').
 * @throws RangeError for a law outside the registry.
 * @example darkEnergyEvolution('constant_w', -0.8, 0).densityScaling(Math.log(2), 2) // => 2^0.6 = 1.515716566510398
 */
export function darkEnergyEvolution(law: DarkEnergyLaw, w0: number, wa: number): DarkEnergyEvolution {
  return darkEnergyLaw(law).evolution({ w0, wa });
}
