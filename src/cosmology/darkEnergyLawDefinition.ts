import type { DarkEnergyEvolution, DarkEnergyLaw } from './darkEnergyEvolution.js';

/**
 * A dark-energy law as its file declares it: its one name (used in the
 * configuration, on the command line and in every output), a title for
 * pages, the parameters it reads (names of the parameter registry), and its
 * evolution at given values of those parameters.
 */
export interface DarkEnergyLawDefinition {
  readonly name: DarkEnergyLaw;
  readonly title: string;
  /** Parameter names the law reads, e.g. ['w0', 'wa']. */
  readonly parameters: readonly ('w0' | 'wa')[];
  /** The law at given values (only the declared parameters are read). */
  evolution(values: { w0: number; wa: number }): DarkEnergyEvolution;
}
