import type { CosmologyOutcome, CosmologyParameters } from './cosmology.js';
import { scanExpansion } from './expansionFailure.js';
import { FlrwCosmology } from './flrwCosmology.js';
import { resolveCosmologyParameters } from './resolveCosmologyParameters.js';

/** Options of createCosmology. */
export interface CreateCosmologyOptions {
  /** Largest redshift the cosmology will be asked about; E^2 > 0 is checked on [0, maxRedshift]. Default Infinity (the whole past, needed for ages). */
  maxRedshift?: number;
  /** Use closed forms where they exist (default true); false forces the quadrature (for tests and benchmarks). */
  useClosedForms?: boolean;
}

/**
 * Redshift up to which E^2 must be scanned. With every density non-negative
 * and Omega_m + Omega_r > 0, E^2 >= Omega_m (1+z)^3 + Omega_r (1+z)^4 > 0, so no
 * Big-Bang failure is possible; only an interior dip (which sets the
 * quadrature panel width) can exist, and it lies where decaying (phantom) dark
 * energy competes with growing matter: at ln(1+z) = ln(-(1+w) Omega_DE / Omega_m)
 * / (-3w) for constant w, below ln(1+z) = 3 for any |w| <= 10 and
 * Omega_DE/Omega_m <= 1e6. Beyond it every term grows or fades monotonically,
 * so the scan stops at z = e^3 - 1 (a 6x cheaper construction, which the
 * sampler's derived quantities need on every evaluation).
 */
const POSITIVE_BUDGET_SCAN_END_REDSHIFT = Math.expm1(3);

function scanLimit(budget: { radiation: number; matter: number; curvature: number; darkEnergy: number }, maxRedshift: number): number {
  const positive = budget.radiation >= 0 && budget.matter >= 0 && budget.curvature >= 0 && budget.darkEnergy >= 0 && budget.matter + budget.radiation > 0;
  return positive ? Math.min(maxRedshift, POSITIVE_BUDGET_SCAN_END_REDSHIFT) : maxRedshift;
}

/**
 * Validates a parameter set and builds its FLRW cosmology. Unphysical sets
 * are reported, never turned into NaN: a negative Omega_m, a non-positive H0,
 * non-finite numbers, a missing Omega_DE for a curved model, w0/wa values a
 * law does not have, and E^2(z) <= 0 somewhere in [0, maxRedshift] (no Big
 * Bang: the universe bounced before that redshift).
 * Cost: O(1) plus the E^2 scan (~60 evaluations for maxRedshift = 2.3, ~800
 * for Infinity); integrals are computed only when asked for.
 * @param p parameters; densities are fractions of the critical density today, H0 in km/s/Mpc, T_CMB in K.
 * @param options maxRedshift (>= 0, may be Infinity) and useClosedForms.
 * @returns { ok: true, cosmology } or { ok: false, reason } with the parameters and redshift named.
 * @throws nothing.
 * @example createCosmology({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.1, omegaDarkEnergy: 2.5, h0KmPerSPerMpc: 70 })
 *   // => { ok: false, reason: 'no Big Bang: E^2(z) = H^2/H0^2 falls to 0 at z = 0.3... for Omega_m = 0.1, Omega_DE = 2.5, ...' }
 */
export function createCosmology(p: CosmologyParameters, options: CreateCosmologyOptions = {}): CosmologyOutcome {
  const maxRedshift = options.maxRedshift ?? Infinity;
  if (!(maxRedshift >= 0)) return { ok: false, reason: `maxRedshift = ${maxRedshift} must be >= 0` };
  const resolved = resolveCosmologyParameters(p);
  if (!resolved.ok) return resolved;
  const { parameters, budget } = resolved;
  const scan = maxRedshift > 0 ? scanExpansion(budget, scanLimit(budget, maxRedshift)) : { failure: null, dipSingularityDistanceLn: Infinity };
  const failure = scan.failure;
  if (failure) {
    const where = failure.redshift === Infinity ? 'at high redshift (z -> infinity)' : `at z = ${Number(failure.redshift.toPrecision(4))}`;
    const law = p.darkEnergy === 'lambda' ? '' : p.darkEnergy === 'constant_w' ? `, w = ${parameters.w0}` : `, w0 = ${parameters.w0}, wa = ${parameters.wa}`;
    return {
      ok: false,
      reason: `no Big Bang: E^2(z) = H^2/H0^2 falls to 0 ${where} for Omega_m = ${budget.matter}, ` +
        `Omega_DE = ${budget.darkEnergy}, Omega_k = ${Number(budget.curvature.toPrecision(6))}${law}; the universe bounced there instead of starting from a Big Bang`,
    };
  }
  return { ok: true, cosmology: new FlrwCosmology(parameters, budget, maxRedshift, options.useClosedForms ?? true, scan.dipSingularityDistanceLn) };
}
