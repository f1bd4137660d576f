import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import type { Cosmology, CosmologyParameters } from '../../src/cosmology/index.js';

/*
 * Closed forms written out here from Hogg 1999 (arXiv:astro-ph/9905116) and
 * the standard parametric solutions of the Friedmann equation, compared with
 * candela's QUADRATURE (useClosedForms: false), so the numerical path is
 * checked against exact results, and with the closed-form path it selects.
 * All in Hubble units (D_H = c/H0, t_H = 1/H0); no radiation.
 */
const H0 = 70;
const REDSHIFTS = [1e-4, 0.001, 0.01, 0.1, 0.5, 1, 2, 3, 5, 10];
/** Quadrature vs exact formula: the engine targets ~1e-11 (a fast likelihood path needs ~1e-10); measured ~1e-15, so 1e-13. */
const QUADRATURE_RELATIVE = 1e-13;
/** Exact formula evaluated two ways in double precision (rounding only). */
const ROUNDING_RELATIVE = 1e-13;

function build(p: Omit<CosmologyParameters, 'h0KmPerSPerMpc'>, useClosedForms: boolean): Cosmology {
  const outcome = createCosmology({ ...p, h0KmPerSPerMpc: H0 }, { useClosedForms });
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

function expectRelative(actual: number, expected: number, tolerance: number, label: string): void {
  expect(Math.abs(actual - expected) / Math.abs(expected), `${label}: ${actual} vs ${expected}`).toBeLessThan(tolerance);
}

interface ClosedFormCase {
  name: string;
  parameters: Omit<CosmologyParameters, 'h0KmPerSPerMpc'>;
  method: string;
  comovingHubble?: (z: number) => number;
  transverseHubble?: (z: number) => number;
  ageHubble?: (z: number) => number;
}

const CASES: ClosedFormCase[] = [
  {
    // Einstein-de Sitter (Hogg 1999; ../shared/reference/README.md): Omega_M = 1 gives D_C = 2 D_H (1 - 1/sqrt(1+z)); age t = (2/3) t_H (1+z)^(-3/2).
    name: 'Einstein-de Sitter (Omega_m = 1)',
    parameters: { darkEnergy: 'lambda', flat: false, omegaMatter: 1, omegaDarkEnergy: 0 },
    method: 'einstein_de_sitter',
    // Written as 2 z / (S (1 + S)), S = sqrt(1+z): the same number without the cancellation of 1 - 1/S at small z.
    comovingHubble: (z) => (2 * z) / (Math.sqrt(1 + z) * (1 + Math.sqrt(1 + z))),
    ageHubble: (z) => (2 / 3) * Math.pow(1 + z, -1.5),
  },
  {
    // Empty universe (Hogg 1999; ../shared/reference/README.md): D_L = D_H z (1 + z/2); D_C = D_H ln(1+z); t = t_H/(1+z).
    name: 'empty / Milne (Omega_m = Omega_DE = 0)',
    parameters: { darkEnergy: 'lambda', flat: false, omegaMatter: 0, omegaDarkEnergy: 0 },
    method: 'empty',
    comovingHubble: (z) => Math.log1p(z),
    transverseHubble: (z) => (z * (1 + z / 2)) / (1 + z),
    ageHubble: (z) => 1 / (1 + z),
  },
  {
    // Mattig's formula as given by Hogg 1999 for Omega_Lambda = 0:
    // D_M = D_H 2 [2 - Om (1 - z) - (2 - Om) sqrt(1 + Om z)] / (Om^2 (1 + z)); open matter-only age (parametric solution,
    // ../shared/reference/README.md): H0 t = sqrt(1+Om z)/((1-Om)(1+z)) - Om/(2(1-Om)^1.5) arccosh((Om z - Om + 2)/(Om (1+z))).
    name: 'open, matter only (Omega_m = 0.3, Lambda = 0)',
    parameters: { darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 0 },
    method: 'mattig',
    transverseHubble: (z) => (2 * (2 - 0.3 * (1 - z) - (2 - 0.3) * Math.sqrt(1 + 0.3 * z))) / (0.3 * 0.3 * (1 + z)),
    ageHubble: (z) => Math.sqrt(1 + 0.3 * z) / (0.7 * (1 + z)) - (0.3 / (2 * Math.pow(0.7, 1.5))) * Math.acosh((0.3 * z - 0.3 + 2) / (0.3 * (1 + z))),
  },
  {
    // Flat LambdaCDM age (standard closed form, ../shared/reference/README.md): t = 2/(3 H0 sqrt(OL)) asinh(sqrt(OL/Om) (1+z)^(-3/2)).
    name: 'flat LambdaCDM (Omega_m = 0.3)',
    parameters: { darkEnergy: 'lambda', flat: true, omegaMatter: 0.3 },
    method: 'flat_lambda_age',
    ageHubble: (z) => (2 / (3 * Math.sqrt(0.7))) * Math.asinh(Math.sqrt(0.7 / 0.3) * Math.pow(1 + z, -1.5)),
  },
];

describe.each(CASES)('closed forms: $name', ({ parameters, method, comovingHubble, transverseHubble, ageHubble }) => {
  const numerical = build(parameters, false);
  const closed = build(parameters, true);
  const hubbleDistance = numerical.hubbleDistanceMpc;
  const hubbleTime = numerical.hubbleTimeGyr;

  it(`selects the closed form '${method}' at construction, and 'numerical' when asked not to`, () => {
    expect(closed.method).toBe(method);
    expect(numerical.method).toBe('numerical');
  });

  it('quadrature and closed-form path both reproduce the formula for z in [1e-4, 10]', () => {
    for (const z of REDSHIFTS) {
      // Mattig's formula as written loses digits to cancellation at small z (~1e-12 at z = 0.001, README; 8e-13 at z = 0.01
      // measured): compare it from z = 0.01 on, with 2e-12 below z = 0.1.
      const formulaUsable = method !== 'mattig' || z >= 0.01;
      const transverseTolerance = method === 'mattig' && z < 0.1 ? 2e-12 : QUADRATURE_RELATIVE;
      if (comovingHubble) {
        expectRelative(numerical.comovingDistanceMpc(z), hubbleDistance * comovingHubble(z), QUADRATURE_RELATIVE, `D_C quadrature z=${z}`);
        expectRelative(closed.comovingDistanceMpc(z), hubbleDistance * comovingHubble(z), ROUNDING_RELATIVE * 10, `D_C closed z=${z}`);
      }
      if (transverseHubble && formulaUsable) {
        expectRelative(numerical.transverseComovingDistanceMpc(z), hubbleDistance * transverseHubble(z), transverseTolerance, `D_M quadrature z=${z}`);
        expectRelative(closed.transverseComovingDistanceMpc(z), hubbleDistance * transverseHubble(z), transverseTolerance, `D_M closed z=${z}`);
      }
      if (ageHubble) {
        expectRelative(numerical.ageGyr(z), hubbleTime * ageHubble(z), QUADRATURE_RELATIVE, `age quadrature z=${z}`);
        expectRelative(closed.ageGyr(z), hubbleTime * ageHubble(z), ROUNDING_RELATIVE * 10, `age closed z=${z}`);
      }
    }
  });

  if (ageHubble) {
    it('gives the age at z = 1089 to 1e-10 by quadrature (brief: 1e-5)', () => {
      expectRelative(numerical.ageGyr(1089), hubbleTime * ageHubble(1089), 1e-10, 'age z=1089');
      expectRelative(closed.ageGyr(1089), hubbleTime * ageHubble(1089), 1e-10, 'age z=1089 closed');
    });
  }
});

describe('closed forms: lookback time', () => {
  it('equals t0 - t(z) from the exact ages (lookback time as defined by Hogg 1999) for Einstein-de Sitter and Milne', () => {
    const eds = build(CASES[0].parameters, true);
    const milne = build(CASES[1].parameters, true);
    for (const z of REDSHIFTS) {
      expectRelative(eds.lookbackTimeGyr(z), eds.hubbleTimeGyr * (2 / 3) * (1 - Math.pow(1 + z, -1.5)), 1e-12, `EdS z=${z}`);
      expectRelative(milne.lookbackTimeGyr(z), milne.hubbleTimeGyr * (z / (1 + z)), 1e-12, `Milne z=${z}`);
    }
  });
});
