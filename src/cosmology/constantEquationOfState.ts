import type { DarkEnergyLawDefinition } from './darkEnergyLawDefinition.js';
import type { DarkEnergyEvolution } from './darkEnergyEvolution.js';

/**
 * Dark energy with a constant equation of state w (the "wCDM" family, e.g.
 * Turner & White 1997, Phys. Rev. D 56, R4439): from the continuity equation,
 * rho_DE(z) / rho_DE0 = (1 + z)^(3 (1 + w)).
 * Cost: one exp per density evaluation.
 * @param w equation of state p / (rho c^2), dimensionless, finite.
 * @throws nothing (the caller validates w).
 * @example constantEquationOfState(-0.8).densityScaling(Math.log(2), 2) // => 2^0.6 = 1.515716566510398
 */
export function constantEquationOfState(w: number): DarkEnergyEvolution {
  const exponent = 3 * (1 + w);
  return {
    law: 'constant_w',
    equationOfState: () => w,
    densityScaling: (lnOnePlusZ) => Math.exp(exponent * lnOnePlusZ),
    logDensityScaling: (lnOnePlusZ) => exponent * lnOnePlusZ,
    highRedshiftExponent: exponent,
    highRedshiftLogFactor: 0,
  };
}

/** Constant w as a law of the registry: one parameter, w0. */
export const CONSTANT_EQUATION_OF_STATE_LAW: DarkEnergyLawDefinition = {
  name: 'constant_w',
  title: 'constant equation of state (w = w0)',
  parameters: ['w0'],
  evolution: (values) => constantEquationOfState(values.w0),
};
