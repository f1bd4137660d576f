import type { DarkEnergyLawDefinition } from './darkEnergyLawDefinition.js';
import type { DarkEnergyEvolution } from './darkEnergyEvolution.js';

/**
 * The CPL equation of state w(a) = w0 + wa (1 - a), i.e.
 * w(z) = w0 + wa z / (1 + z) (Chevallier & Polarski 2001, Int. J. Mod. Phys.
 * D 10, 213; Linder 2003, Phys. Rev. Lett. 90, 091301). Integrating the
 * continuity equation gives
 * rho_DE(z) / rho_DE0 = (1 + z)^(3 (1 + w0 + wa)) exp(-3 wa z / (1 + z)),
 * which tends to exp(-3 wa) (1 + z)^(3 (1 + w0 + wa)) at high redshift.
 * wa = 0 is constant w; w0 = -1, wa = 0 is the cosmological constant.
 * Cost: one exp per density evaluation.
 * @param w0 equation of state today, dimensionless.
 * @param wa slope -dw/da, dimensionless.
 * @throws nothing (the caller validates the numbers).
 * @example chevallierPolarskiLinder(-0.9, 0.3).equationOfState(1) // => -0.75
 */
export function chevallierPolarskiLinder(w0: number, wa: number): DarkEnergyEvolution {
  const exponent = 3 * (1 + w0 + wa);
  const logDensity = (lnOnePlusZ: number, onePlusZ: number): number => exponent * lnOnePlusZ - 3 * wa * (1 - 1 / onePlusZ);
  return {
    law: 'cpl',
    equationOfState: (z) => w0 + (wa * z) / (1 + z),
    densityScaling: (lnOnePlusZ, onePlusZ) => Math.exp(logDensity(lnOnePlusZ, onePlusZ)),
    logDensityScaling: logDensity,
    highRedshiftExponent: exponent,
    highRedshiftLogFactor: -3 * wa,
  };
}

/** The CPL law of the registry: two parameters, w0 and wa. */
export const CHEVALLIER_POLARSKI_LINDER_LAW: DarkEnergyLawDefinition = {
  name: 'cpl',
  title: 'w0-wa (Chevallier-Polarski-Linder)',
  parameters: ['w0', 'wa'],
  evolution: (values) => chevallierPolarskiLinder(values.w0, values.wa),
};
