import { CandelaError } from '../errors.js';

/**
 * Checks a physical baryon density and a physical matter density
 * (omega = Omega h^2) before a fitting formula uses them.
 * @param omegaBaryonH2 omega_b h^2 (finite, > 0).
 * @param omegaMatterH2 omega_m h^2 (finite, >= omegaBaryonH2); omitted when only the baryons matter.
 * @param matterName the caller's name of the second density, for the message.
 * @throws CandelaError cosmology.physical_density_invalid naming the density and its value.
 */
export function checkPhysicalDensities(omegaBaryonH2: number, omegaMatterH2?: number, matterName = 'omegaMatterH2'): void {
  if (!(Number.isFinite(omegaBaryonH2) && omegaBaryonH2 > 0)) {
    throw invalid('omegaBaryonH2', omegaBaryonH2, 'a finite omega_b h^2 > 0 (about 0.0224)');
  }
  if (omegaMatterH2 !== undefined && !(Number.isFinite(omegaMatterH2) && omegaMatterH2 >= omegaBaryonH2)) {
    throw invalid(matterName, omegaMatterH2, `a finite ${matterName} >= omega_b h^2 = ${omegaBaryonH2}`);
  }
}

function invalid(path: string, value: number, expected: string): CandelaError {
  return new CandelaError({
    code: 'cosmology.physical_density_invalid', message: `${path} = ${value} is not a usable physical density`,
    path, expected, found: String(value), fix: 'give omega = Omega h^2 with 0 < omega_b h^2 <= omega_m h^2',
  });
}
