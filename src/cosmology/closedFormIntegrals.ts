import type { DensityBudget } from './densityBudget.js';
import type { ExpansionIntegrals } from './expansionIntegrals.js';

/**
 * Below this Omega_k the open matter-only age formula is not used: its two
 * terms carry 1/(1 - Omega_m)^(3/2) and cancel, losing about
 * Omega_k^(-3/2) ulps (90 ulps at 0.05); the quadrature is better there.
 */
const OPEN_AGE_MIN_CURVATURE = 0.05;

/**
 * The closed forms that exist for a budget, chosen once at construction
 * (formulas from Hogg 1999, arXiv:astro-ph/9905116, and the standard
 * parametric solutions of the Friedmann equation), all in Hubble units:
 * - Einstein-de Sitter (Omega_m = 1 only): chi = 2 (1 - (1+z)^(-1/2)),
 *   H0 t = (2/3)(1+z)^(-3/2), H0 t_lookback = (2/3)(1 - (1+z)^(-3/2)).
 * - Empty (Milne; Omega_k = 1): chi = ln(1+z), H0 t = 1/(1+z), H0 t_lookback = z/(1+z).
 * - Lambda = 0, no radiation, open (0 < Omega_m < 1): Mattig's D_M (Mattig 1958,
 *   Astron. Nachr. 284, 109, in the form quoted by Hogg 1999) rewritten without cancellation as
 *   D_M = 2 z (1 + z/(1+S)) / ((1+S)(1+z)), S = sqrt(1 + Omega_m z), and
 *   chi = asinh(sqrt(Omega_k) D_M) / sqrt(Omega_k); age
 *   H0 t = sqrt(1+Omega_m z)/((1-Omega_m)(1+z)) - Omega_m/(2(1-Omega_m)^(3/2)) arccosh(1 + 2 Omega_k/(Omega_m (1+z))).
 * - Flat LambdaCDM without radiation: H0 t = 2/(3 sqrt(Omega_L)) asinh(sqrt(Omega_L/Omega_m) (1+z)^(-3/2)).
 * Cost: O(1) per call.
 * @param budget the density parameters and law.
 * @returns the members that have closed forms, and a method name; empty when none apply.
 * @throws nothing.
 * @example closedFormIntegrals({ radiation: 0, matter: 1, curvature: 0, darkEnergy: 0, law: cosmologicalConstant() })
 *   .comovingHubble?.(3) // => 1 (2 (1 - 1/2))
 */
export function closedFormIntegrals(budget: DensityBudget): Partial<ExpansionIntegrals> {
  const { radiation, matter, curvature, darkEnergy } = budget;
  if (radiation !== 0) return {};
  if (darkEnergy === 0 && matter === 1 && curvature === 0) {
    return {
      method: 'einstein_de_sitter',
      comovingHubble: einsteinDeSitterComoving,
      comovingHubbleSorted: mapSorted(einsteinDeSitterComoving),
      ageHubble: (z) => (2 / 3) * Math.pow(1 + z, -1.5),
      lookbackHubble: (z) => -(2 / 3) * Math.expm1(-1.5 * Math.log1p(z)),
    };
  }
  if (darkEnergy === 0 && matter === 0 && curvature === 1) {
    return {
      method: 'empty',
      comovingHubble: Math.log1p,
      comovingHubbleSorted: mapSorted(Math.log1p),
      ageHubble: (z) => 1 / (1 + z),
      lookbackHubble: (z) => z / (1 + z),
    };
  }
  if (darkEnergy === 0 && matter > 0 && curvature > 0) {
    const rootCurvature = Math.sqrt(curvature);
    const comoving = (z: number): number => Math.asinh(rootCurvature * mattigTransverse(z, matter)) / rootCurvature;
    const closed: Partial<ExpansionIntegrals> = { method: 'mattig', comovingHubble: comoving, comovingHubbleSorted: mapSorted(comoving) };
    if (curvature >= OPEN_AGE_MIN_CURVATURE) closed.ageHubble = (z) => openMatterAge(z, matter, curvature);
    return closed;
  }
  if (budget.law.law === 'lambda' && curvature === 0 && matter > 0 && darkEnergy > 0) {
    const rootLambda = Math.sqrt(darkEnergy);
    const ratio = Math.sqrt(darkEnergy / matter);
    return {
      method: 'flat_lambda_age',
      ageHubble: (z) => (2 / (3 * rootLambda)) * Math.asinh(ratio * Math.pow(1 + z, -1.5)),
    };
  }
  return {};
}

/** chi = 2 (1 - 1/sqrt(1+z)) written as 2 z / (S (1 + S)), S = sqrt(1+z), exact at small z. */
function einsteinDeSitterComoving(z: number): number {
  const root = Math.sqrt(1 + z);
  return (2 * z) / (root * (1 + root));
}

/** Mattig's transverse comoving distance (Hogg 1999) in a cancellation-free form, Hubble units. */
function mattigTransverse(z: number, matter: number): number {
  const root = Math.sqrt(1 + matter * z);
  return (2 * z * (1 + z / (1 + root))) / ((1 + root) * (1 + z));
}

/** Age of an open matter-only universe (parametric solution; 1 + delta written directly to keep arccosh accurate). */
function openMatterAge(z: number, matter: number, curvature: number): number {
  const delta = (2 * curvature) / (matter * (1 + z));
  const arccosh = Math.log1p(delta + Math.sqrt(delta * (2 + delta)));
  return Math.sqrt(1 + matter * z) / (curvature * (1 + z)) - (matter / (2 * Math.pow(curvature, 1.5))) * arccosh;
}

function mapSorted(comoving: (z: number) => number): ExpansionIntegrals['comovingHubbleSorted'] {
  return (sortedRedshifts, out, count) => {
    for (let i = 0; i < count; i++) out[i] = comoving(sortedRedshifts[i]);
  };
}
