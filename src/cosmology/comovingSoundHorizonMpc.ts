import { CandelaError } from '../errors.js';
import { adaptiveGaussKronrod } from '../math/index.js';
import { checkPhysicalDensities } from './checkPhysicalDensities.js';
import type { Cosmology } from './cosmology.js';
import { physicalRadiationDensity } from './physicalRadiationDensity.js';

/**
 * Relative tolerance of the sound-horizon quadrature. The integrand is smooth
 * in the scale factor (its only feature is matter-radiation equality), so
 * G7-K15 reaches this in a few subintervals; 1e-11 keeps R and l_A good to
 * 1e-9, far below any CMB measurement error (~3e-4 on l_A).
 */
const SOUND_HORIZON_RELATIVE_TOLERANCE = 1e-11;

/**
 * Comoving sound horizon r_s(z) = int_z^inf c_s(z') / H(z') dz' of the
 * baryon-photon fluid, with c_s = c / sqrt(3 (1 + R_b)) and
 * R_b = 3 rho_b / (4 rho_gamma) = (3 omega_b / (4 omega_gamma)) / (1 + z)
 * (Eisenstein & Hu 1998, ApJ 496, 605: R_b is their eq. 5, and their eq. 6 is
 * this integral in closed form for matter and radiation alone; equation
 * numbers from memory). Integrated in the scale factor a = 1/(1+z),
 *   r_s = (c/H0) int_0^a(z) da / (a^2 E(a) sqrt(3 (1 + R_b(a)))),
 * where a^2 E(a) -> sqrt(Omega_r) as a -> 0, so the infinite upper limit in z
 * becomes a finite, smooth integral (adaptive Gauss-Kronrod, never evaluated at
 * a = 0). H(z) is the cosmology's own E(z), which must include radiation:
 * photons from cmbTemperatureK and N_eff massless neutrinos.
 * Evaluated at the drag epoch (dragRedshift) it is r_d, at decoupling
 * (decouplingRedshift) r_s(z*).
 * Cost: a few hundred E(z) evaluations.
 * @param cosmology FLRW cosmology created with cmbTemperatureK > 0 and maxRedshift = Infinity (the default).
 * @param omegaBaryonH2 omega_b = Omega_b h^2 (> 0, <= Omega_m h^2 of the cosmology).
 * @param redshift z >= 0 where the horizon is measured.
 * @returns r_s(z), comoving, Mpc.
 * @throws CandelaError cosmology.radiation_required, cosmology.redshift_range_too_small,
 *   cosmology.physical_density_invalid, cosmology.redshift_out_of_range, cosmology.quadrature_not_converged.
 * @example comovingSoundHorizonMpc(planckLike, 0.02237, 1089.92) // => 144.2656... Mpc (flat, Omega_m 0.3153, H0 67.36, T_CMB 2.7255 K, N_eff 3.046)
 */
export function comovingSoundHorizonMpc(cosmology: Cosmology, omegaBaryonH2: number, redshift: number): number {
  const { cmbTemperatureK, effectiveNeutrinoSpecies, h0KmPerSPerMpc } = cosmology.parameters;
  checkEarlyUniverseCosmology(cosmology);
  const h = h0KmPerSPerMpc / 100;
  checkPhysicalDensities(omegaBaryonH2, cosmology.omegaMatter * h * h, 'Omega_m h^2');
  if (!(Number.isFinite(redshift) && redshift >= 0)) {
    throw new CandelaError({
      code: 'cosmology.redshift_out_of_range', message: `redshift ${redshift} is not usable for a sound horizon`,
      path: 'redshift', expected: 'a finite redshift >= 0', found: String(redshift), fix: 'use a redshift >= 0',
    });
  }
  const photonsH2 = physicalRadiationDensity(cmbTemperatureK, effectiveNeutrinoSpecies).photons;
  const baryonToPhotonPerScaleFactor = (3 * omegaBaryonH2) / (4 * photonsH2);
  const integrand = (a: number): number => {
    const scaledRate = a * a * cosmology.expansionRate(1 / a - 1);
    return 1 / (scaledRate * Math.sqrt(3 * (1 + baryonToPhotonPerScaleFactor * a)));
  };
  const result = adaptiveGaussKronrod(integrand, 0, 1 / (1 + redshift), { relativeTolerance: SOUND_HORIZON_RELATIVE_TOLERANCE });
  if (!result.converged) {
    throw new CandelaError({
      code: 'cosmology.quadrature_not_converged', message: `the sound-horizon integral to z = ${redshift} did not converge`,
      path: 'redshift', expected: `relative error <= ${SOUND_HORIZON_RELATIVE_TOLERANCE}`, found: `estimate ${result.errorEstimate / Math.abs(result.value)}`,
      fix: 'check that the dark energy does not dominate the early universe (w(z) well below 1/3 at high redshift)',
    });
  }
  return cosmology.hubbleDistanceMpc * result.value;
}

/**
 * Checks that a cosmology can describe the early universe: radiation on and
 * E(z) checked up to infinite redshift.
 * @throws CandelaError cosmology.radiation_required or cosmology.redshift_range_too_small.
 */
export function checkEarlyUniverseCosmology(cosmology: Cosmology): void {
  if (!(cosmology.parameters.cmbTemperatureK > 0)) {
    throw new CandelaError({
      code: 'cosmology.radiation_required', message: 'the sound horizon needs photons: this cosmology has no radiation (T_CMB = 0)',
      path: 'cmbTemperatureK', expected: 'a CMB temperature > 0 K (2.7255 K)', found: String(cosmology.parameters.cmbTemperatureK),
      fix: 'create the cosmology with cmbTemperatureK = CMB_TEMPERATURE_K',
    });
  }
  if (cosmology.maxRedshift !== Infinity) {
    throw new CandelaError({
      code: 'cosmology.redshift_range_too_small', message: `the sound horizon integrates to infinite redshift, but this cosmology was checked only to z = ${cosmology.maxRedshift}`,
      path: 'maxRedshift', expected: 'Infinity', found: String(cosmology.maxRedshift), fix: 'create the cosmology without a maxRedshift (default Infinity)',
    });
  }
}
