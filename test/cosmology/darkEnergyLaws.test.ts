import { describe, expect, it } from 'vitest';
import { chevallierPolarskiLinder, constantEquationOfState, cosmologicalConstant, createCosmology, darkEnergyEvolution } from '../../src/cosmology/index.js';
import type { CosmologyParameters, DarkEnergyEvolution } from '../../src/cosmology/index.js';

/*
 * Behaviour every dark-energy law must have, written once and run for each
 * law (flat and curved, with and without radiation). The expectations are
 * identities of FLRW cosmology (Hogg 1999, arXiv:astro-ph/9905116) and of the
 * continuity equation, not numbers from this code.
 */
interface LawCase { name: string; evolution: DarkEnergyEvolution; parameters: Pick<CosmologyParameters, 'darkEnergy' | 'w0' | 'wa'> }

const LAWS: LawCase[] = [
  { name: 'cosmological constant', evolution: cosmologicalConstant(), parameters: { darkEnergy: 'lambda' } },
  { name: 'constant w = -0.8', evolution: constantEquationOfState(-0.8), parameters: { darkEnergy: 'constant_w', w0: -0.8 } },
  { name: 'constant w = -1.2 (phantom)', evolution: constantEquationOfState(-1.2), parameters: { darkEnergy: 'constant_w', w0: -1.2 } },
  { name: 'CPL w0 = -0.9, wa = 0.3', evolution: chevallierPolarskiLinder(-0.9, 0.3), parameters: { darkEnergy: 'cpl', w0: -0.9, wa: 0.3 } },
  { name: 'CPL w0 = -0.7, wa = -0.8', evolution: chevallierPolarskiLinder(-0.7, -0.8), parameters: { darkEnergy: 'cpl', w0: -0.7, wa: -0.8 } },
];

const SHAPES = [
  { label: 'flat, no radiation', flat: true, omegaDarkEnergy: undefined, cmbTemperatureK: 0 },
  { label: 'open (Omega_DE = 0.6), radiation', flat: false, omegaDarkEnergy: 0.6, cmbTemperatureK: 2.7255 },
  { label: 'closed (Omega_DE = 0.8), no radiation', flat: false, omegaDarkEnergy: 0.8, cmbTemperatureK: 0 },
];

/** Central difference step in ln(1+z) and its accuracy: error ~ h^2 f''' / 6 ~ 1e-7 relative for h = 1e-3 (common practice). */
const STEP = 1e-3;
const DERIVATIVE_RELATIVE = 1e-6;

describe.each(LAWS)('dark-energy law: $name', ({ evolution, parameters }) => {
  it('has density 1 today and w(0) = w0', () => {
    expect(evolution.densityScaling(0, 1)).toBe(1);
    expect(Math.abs(evolution.logDensityScaling(0, 1))).toBe(0);
    expect(evolution.equationOfState(0)).toBe(parameters.w0 ?? -1);
  });

  it('obeys the continuity equation d ln rho / d ln(1+z) = 3 (1 + w(z))', () => {
    for (const z of [0.1, 0.5, 1, 3, 10, 100]) {
      const x = Math.log1p(z);
      const slope = (evolution.logDensityScaling(x + STEP, Math.exp(x + STEP)) - evolution.logDensityScaling(x - STEP, Math.exp(x - STEP))) / (2 * STEP);
      expect(Math.abs(slope - 3 * (1 + evolution.equationOfState(z)))).toBeLessThan(DERIVATIVE_RELATIVE * 10);
    }
  });

  it('has a density equal to exp(its log) and the stated high-redshift limit C (1+z)^p', () => {
    for (const z of [0.5, 2, 1e4]) {
      const x = Math.log1p(z);
      expect(evolution.densityScaling(x, 1 + z)).toBeCloseTo(Math.exp(evolution.logDensityScaling(x, 1 + z)), 12);
    }
    const z = 1e12;
    const limit = evolution.highRedshiftLogFactor + evolution.highRedshiftExponent * Math.log1p(z);
    expect(Math.abs(evolution.logDensityScaling(Math.log1p(z), 1 + z) - limit)).toBeLessThan(1e-9);
  });

  it('is what darkEnergyEvolution builds for its law name', () => {
    const built = darkEnergyEvolution(parameters.darkEnergy, parameters.w0 ?? -1, parameters.wa ?? 0);
    for (const z of [0, 1, 5]) expect(built.equationOfState(z)).toBe(evolution.equationOfState(z));
  });

  describe.each(SHAPES)('in a $label universe', ({ flat, omegaDarkEnergy, cmbTemperatureK }) => {
    const outcome = createCosmology({ ...parameters, flat, omegaMatter: 0.3, omegaDarkEnergy, cmbTemperatureK, h0KmPerSPerMpc: 70 });
    if (!outcome.ok) throw new Error(outcome.reason);
    const cosmology = outcome.cosmology;
    const hubble = cosmology.hubbleDistanceMpc;

    it('has E(0) = 1 and densities that sum to one', () => {
      expect(cosmology.expansionRate(0)).toBeCloseTo(1, 14);
      expect(cosmology.omegaMatter + cosmology.omegaDarkEnergy + cosmology.omegaCurvature + cosmology.omegaRadiation).toBeCloseTo(1, 14);
    });

    it('has dD_C/dz = D_H / E(z) (Hogg 1999 eq. 15) and distances that grow with z', () => {
      let previous = 0;
      for (const z of [0.05, 0.3, 1, 2.5, 8]) {
        const slope = (cosmology.comovingDistanceMpc(z + STEP) - cosmology.comovingDistanceMpc(z - STEP)) / (2 * STEP);
        expect(Math.abs(slope / (hubble / cosmology.expansionRate(z)) - 1)).toBeLessThan(DERIVATIVE_RELATIVE);
        const distance = cosmology.comovingDistanceMpc(z);
        expect(distance).toBeGreaterThan(previous);
        previous = distance;
      }
    });

    it('has q(z) = -1 + d ln E / d ln(1+z) (definition of the deceleration parameter)', () => {
      for (const z of [0, 0.5, 2, 20]) {
        const x = Math.log1p(z);
        const lnE = (y: number): number => Math.log(cosmology.expansionRate(Math.expm1(y)));
        const numeric = -1 + (lnE(x + STEP) - lnE(Math.max(0, x - STEP))) / (x + STEP - Math.max(0, x - STEP));
        expect(Math.abs(cosmology.decelerationParameter(z) - numeric)).toBeLessThan(z === 0 ? 1e-3 : 1e-6);
      }
      expect(cosmology.q0).toBe(cosmology.decelerationParameter(0));
    });

    it('keeps D_L = (1+z)^2 D_A (Etherington 1933) and age + lookback = age today', () => {
      for (const z of [0.01, 0.5, 2, 10]) {
        expect(cosmology.luminosityDistanceMpc(z) / ((1 + z) ** 2 * cosmology.angularDiameterDistanceMpc(z))).toBeCloseTo(1, 14);
        expect((cosmology.ageGyr(z) + cosmology.lookbackTimeGyr(z)) / cosmology.ageTodayGyr).toBeCloseTo(1, 12);
      }
    });

    it('gives the same distances through the vectorized path as the scalar one, in any order', () => {
      const z = Float64Array.of(2, 0.01, 1.5, 0.5, 0.5, 8, 0.2);
      const comoving = cosmology.comovingDistancesMpc(z);
      const transverse = cosmology.transverseComovingDistancesMpc(z);
      const helio = Float64Array.from(z, (value) => value + 0.001);
      const mu = cosmology.distanceModuliMag(z, helio);
      z.forEach((value, i) => {
        expect(comoving[i] / cosmology.comovingDistanceMpc(value)).toBeCloseTo(1, 13);
        expect(transverse[i] / cosmology.transverseComovingDistanceMpc(value)).toBeCloseTo(1, 13);
        expect(mu[i] - cosmology.distanceModulusMag(value, helio[i])).toBeCloseTo(0, 12);
      });
      const sorted = Float64Array.from(z).sort();
      const hubbleUnits = new Float64Array(sorted.length);
      cosmology.transverseComovingDistancesHubbleUnits(sorted, hubbleUnits);
      sorted.forEach((value, i) => expect(hubbleUnits[i] * hubble / cosmology.transverseComovingDistanceMpc(value)).toBeCloseTo(1, 13));
    });
  });
});
