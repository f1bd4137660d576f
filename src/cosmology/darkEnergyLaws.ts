import { CHEVALLIER_POLARSKI_LINDER_LAW } from './chevallierPolarskiLinder.js';
import { CONSTANT_EQUATION_OF_STATE_LAW } from './constantEquationOfState.js';
import { COSMOLOGICAL_CONSTANT_LAW } from './cosmologicalConstant.js';
import type { DarkEnergyLaw } from './darkEnergyEvolution.js';
import type { DarkEnergyLawDefinition } from './darkEnergyLawDefinition.js';

/**
 * The registry of dark-energy laws: adding a law is one file declaring its
 * definition plus one line here. Configuration, command line and outputs
 * accept exactly these names.
 * @example DARK_ENERGY_LAWS.map((law) => law.name) // ['lambda', 'constant_w', 'cpl']
 */
export const DARK_ENERGY_LAWS: readonly DarkEnergyLawDefinition[] = [
  COSMOLOGICAL_CONSTANT_LAW,
  CONSTANT_EQUATION_OF_STATE_LAW,
  CHEVALLIER_POLARSKI_LINDER_LAW,
];

/** The names of every law, in registry order. */
export const DARK_ENERGY_LAW_NAMES: readonly DarkEnergyLaw[] = DARK_ENERGY_LAWS.map((law) => law.name);

/**
 * The definition of a law by name.
 * @throws RangeError for a name outside the registry (validated input never has one).
 * @example darkEnergyLaw('cpl').parameters // ['w0', 'wa']
 */
export function darkEnergyLaw(name: DarkEnergyLaw): DarkEnergyLawDefinition {
  const found = DARK_ENERGY_LAWS.find((law) => law.name === name);
  if (!found) throw new RangeError(`unknown dark-energy law '${String(name)}'`);
  return found;
}
