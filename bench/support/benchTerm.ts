/**
 * The supernova likelihood term of the benchmarks and its parameter points:
 * flat w0waCDM, Tripp standardization with a sharp host-mass step, lensing
 * and peculiar-velocity scatter, no intrinsic scatter, offset (abs_mag)
 * marginalized. With `alphaBeta: 'fixed'` the covariance is constant (one
 * factorization); with 'free' it follows alpha and beta (one per call).
 */
import type { CovarianceMatrix, SystematicModes } from '../../src/data/index.js';
import { createSupernovaTerm, type SupernovaPath, type SupernovaTerm } from '../../src/likelihood/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { BENCH_TRUTH, type BenchSurvey } from './syntheticSurvey.js';

/** The nuisance values held fixed when the covariance is constant. */
export const FIXED_NUISANCE = { alpha: BENCH_TRUTH.alpha, beta: BENCH_TRUTH.beta, mass_step: BENCH_TRUTH.massStep } as const;

/** The cosmology family, host-mass step and scatter terms shared by the benchmark terms (this file and benchHierarchicalTerm.ts). */
export const BENCH_TERM_SETTINGS = {
  cosmologyModel: { darkEnergy: 'cpl', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
  massStep: { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0 },
  scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, includeRedshiftErrors: false },
} as const;

/** How to build a benchmark term. */
export interface BenchTermOptions {
  path: SupernovaPath;
  /** Extra magnitude covariances (the dense U U^T, or none for a diagonal C). */
  covariances: CovarianceMatrix[];
  /** Systematic modes U given as modes (C = D + U U^T without an N x N matrix), or none. */
  systematicModes?: SystematicModes;
  alphaBeta: 'fixed' | 'free';
}

/** Builds the term (for the dense paths this factorizes C: N^3/3 multiply-adds; with modes, O(N K^2)). */
export function benchTerm(survey: BenchSurvey, options: BenchTermOptions): SupernovaTerm {
  return createSupernovaTerm({
    name: 'bench',
    table: survey.table,
    covariances: options.covariances,
    systematicModes: options.systematicModes,
    cosmologyModel: { ...BENCH_TERM_SETTINGS.cosmologyModel },
    standardization: {
      massStep: { ...BENCH_TERM_SETTINGS.massStep },
      scatter: { ...BENCH_TERM_SETTINGS.scatter },
      intrinsicScatter: 'off',
      alphaBetaCovariance: 'exact',
    },
    offset: 'marginalize',
    fastPath: options.path,
    fixed: options.alphaBeta === 'fixed' ? { ...FIXED_NUISANCE } : {},
  });
}

/**
 * `count` parameter points near the truth, seeded: Omega_m in [0.2, 0.4],
 * w0 in [-1.2, -0.6], wa in [-1, 1]; alpha and beta vary too when free (so
 * that a covariance that follows them is refactorized at every call).
 */
export function benchPoints(count: number, alphaBeta: 'fixed' | 'free', seed: string): Array<Record<string, number>> {
  const rng = createRandomStream(seed);
  return Array.from({ length: count }, () => ({
    omega_m: 0.2 + 0.2 * rng.uniform(),
    w0: -1.2 + 0.6 * rng.uniform(),
    wa: -1 + 2 * rng.uniform(),
    ...FIXED_NUISANCE,
    ...(alphaBeta === 'free' ? { alpha: 0.12 + 0.04 * rng.uniform(), beta: 2.9 + 0.4 * rng.uniform() } : {}),
  }));
}
