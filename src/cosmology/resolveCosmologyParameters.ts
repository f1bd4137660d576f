import { DARK_ENERGY_LAW_NAMES } from './darkEnergyLaws.js';
import { darkEnergyEvolution } from './darkEnergyEvolution.js';
import type { CosmologyParameters } from './cosmology.js';
import type { DensityBudget } from './densityBudget.js';
import { radiationDensity } from './radiationDensity.js';

/** Default N_eff for massless neutrinos (Mangano et al. 2005, Nucl. Phys. B 729, 221). */
export const DEFAULT_EFFECTIVE_NEUTRINO_SPECIES = 3.046;

/** Parameters with defaults filled in and the density budget, or the reason they are unusable. */
export type ResolvedCosmology =
  | { ok: true; parameters: Required<CosmologyParameters>; budget: DensityBudget }
  | { ok: false; reason: string };


/**
 * Checks the numbers of a parameter set and builds its density budget:
 * flat models get Omega_DE = 1 - Omega_m - Omega_r and Omega_k = 0; curved
 * models keep Omega_DE and get Omega_k = 1 - Omega_m - Omega_DE - Omega_r.
 * Does not check E^2 > 0 (see findExpansionFailure).
 * Cost: O(1).
 * @param p the parameters (units as in CosmologyParameters).
 * @returns ok with resolved parameters and budget, or a reason naming the parameter and its value.
 * @throws nothing.
 * @example resolveCosmologyParameters({ darkEnergy: 'lambda', flat: true, omegaMatter: -0.1, h0KmPerSPerMpc: 70 })
 *   // => { ok: false, reason: 'Omega_m = -0.1 is negative; matter density must be >= 0' }
 */
export function resolveCosmologyParameters(p: CosmologyParameters): ResolvedCosmology {
  const fail = (reason: string): ResolvedCosmology => ({ ok: false, reason });
  if (!DARK_ENERGY_LAW_NAMES.includes(p.darkEnergy)) return fail(`unknown dark-energy law '${String(p.darkEnergy)}'; expected one of ${DARK_ENERGY_LAW_NAMES.join(', ')}`);
  if (typeof p.flat !== 'boolean') return fail(`'flat' must be true or false, got ${String(p.flat)}`);
  const w0 = p.w0 ?? -1;
  const wa = p.wa ?? 0;
  const cmbTemperatureK = p.cmbTemperatureK ?? 0;
  const effectiveNeutrinoSpecies = p.effectiveNeutrinoSpecies ?? DEFAULT_EFFECTIVE_NEUTRINO_SPECIES;
  const finite: [string, number][] = [['Omega_m', p.omegaMatter], ['H0', p.h0KmPerSPerMpc], ['w0', w0], ['wa', wa],
    ['T_CMB', cmbTemperatureK], ['N_eff', effectiveNeutrinoSpecies]];
  if (!p.flat) finite.push(['Omega_DE', p.omegaDarkEnergy as number]);
  for (const [name, value] of finite) {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      return fail(value === undefined && name === 'Omega_DE'
        ? 'Omega_DE is required for a curved model (flat = false)'
        : `${name} = ${String(value)} is not a finite number`);
    }
  }
  if (p.omegaMatter < 0) return fail(`Omega_m = ${p.omegaMatter} is negative; matter density must be >= 0`);
  if (p.h0KmPerSPerMpc <= 0) return fail(`H0 = ${p.h0KmPerSPerMpc} km/s/Mpc must be positive`);
  if (cmbTemperatureK < 0) return fail(`T_CMB = ${cmbTemperatureK} K must be >= 0 (0 means no radiation)`);
  if (effectiveNeutrinoSpecies < 0) return fail(`N_eff = ${effectiveNeutrinoSpecies} must be >= 0`);
  if (p.darkEnergy === 'lambda' && (w0 !== -1 || wa !== 0)) {
    return fail(`the lambda law has w0 = -1 and wa = 0, got w0 = ${w0}, wa = ${wa}; use constant_w or cpl to vary them`);
  }
  if (p.darkEnergy === 'constant_w' && wa !== 0) return fail(`the constant_w law has wa = 0, got wa = ${wa}; use cpl to vary wa`);

  const radiation = radiationDensity(cmbTemperatureK, p.h0KmPerSPerMpc, effectiveNeutrinoSpecies).total;
  const omegaDarkEnergy = p.flat ? 1 - p.omegaMatter - radiation : (p.omegaDarkEnergy as number);
  const curvature = p.flat ? 0 : 1 - p.omegaMatter - omegaDarkEnergy - radiation;
  return {
    ok: true,
    parameters: {
      darkEnergy: p.darkEnergy, flat: p.flat, omegaMatter: p.omegaMatter, omegaDarkEnergy, w0, wa,
      h0KmPerSPerMpc: p.h0KmPerSPerMpc, cmbTemperatureK, effectiveNeutrinoSpecies,
    },
    budget: {
      radiation, matter: p.omegaMatter, curvature, darkEnergy: omegaDarkEnergy,
      law: darkEnergyEvolution(p.darkEnergy, w0, wa),
    },
  };
}
