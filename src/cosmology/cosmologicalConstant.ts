import type { DarkEnergyLawDefinition } from './darkEnergyLawDefinition.js';
import type { DarkEnergyEvolution } from './darkEnergyEvolution.js';

const LAMBDA: DarkEnergyEvolution = {
  law: 'lambda',
  equationOfState: () => -1,
  densityScaling: () => 1,
  logDensityScaling: () => 0,
  highRedshiftExponent: 0,
  highRedshiftLogFactor: 0,
};

/**
 * The cosmological constant (Einstein 1917): w = -1 at every redshift, so the
 * dark-energy density never changes, rho_Lambda(z) / rho_Lambda0 = 1.
 * Cost: O(1), shared object.
 * @throws nothing.
 * @example cosmologicalConstant().equationOfState(3) // => -1
 */
export function cosmologicalConstant(): DarkEnergyEvolution {
  return LAMBDA;
}

/**
 * The cosmological constant as a law of the registry: no parameter of its own
 * (w = -1 always).
 */
export const COSMOLOGICAL_CONSTANT_LAW: DarkEnergyLawDefinition = {
  name: 'lambda',
  title: 'cosmological constant (w = -1)',
  parameters: [],
  evolution: () => cosmologicalConstant(),
};
