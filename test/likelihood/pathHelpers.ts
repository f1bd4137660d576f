// Test helper (not a test): options builder and the path-agreement check shared by the path tests.
import { expect } from 'vitest';
import type { DarkEnergyLaw } from '../../src/cosmology/index.js';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import type { RandomStream } from '../../src/math/index.js';
import type { SupernovaTerm, SupernovaTermOptions } from '../../src/likelihood/index.js';

// Contract: every fast path equals the general path within |delta chi^2| <= 1e-6 (and so |delta ln L| <= 5e-7).
export const CHI_SQUARE_AGREEMENT = 1e-6;

export function options(table: SupernovaTable, covariances: CovarianceMatrix[], extra: Partial<SupernovaTermOptions> & { darkEnergy?: DarkEnergyLaw; flat?: boolean } = {}): SupernovaTermOptions {
  const { darkEnergy = 'lambda', flat = true, ...rest } = extra;
  return {
    name: 'sn', table, covariances,
    cosmologyModel: { darkEnergy, flat, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
    standardization: {
      massStep: { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0 },
      scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, includeRedshiftErrors: false },
      intrinsicScatter: 'off', alphaBetaCovariance: 'exact',
    },
    offset: 'marginalize',
    ...rest,
  };
}

export type Draw = (rng: RandomStream) => Record<string, number>;
export const uniform = (rng: RandomStream, min: number, max: number) => min + (max - min) * rng.uniform();

/** Compares chi^2, ln L and the best-fit offset of a fast term with the general term at `count` random points. */
export function expectSamePaths(fast: SupernovaTerm, general: SupernovaTerm, draw: Draw, rng: RandomStream, count: number): number {
  let worst = 0;
  for (let k = 0; k < count; k++) {
    const p = draw(rng);
    const a = fast.bestFitExtras!(p);
    const b = general.bestFitExtras!(p);
    expect(Number.isFinite(b.chi_square)).toBe(true);
    const difference = Math.abs(a.chi_square - b.chi_square);
    worst = Math.max(worst, difference);
    expect(difference, `chi^2 at ${JSON.stringify(p)}`).toBeLessThanOrEqual(CHI_SQUARE_AGREEMENT);
    expect(Math.abs(fast.logLikelihood(p) - general.logLikelihood(p))).toBeLessThanOrEqual(CHI_SQUARE_AGREEMENT / 2);
    expect(a.abs_mag_best_fit).toBeCloseTo(b.abs_mag_best_fit, 8);
  }
  return worst;
}

