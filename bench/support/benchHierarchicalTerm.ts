/**
 * The hierarchical supernova term of the benchmarks and its parameter
 * points: flat w0waCDM, latent stretch and colour populations (one for all
 * samples), sharp host-mass step, lensing and peculiar-velocity scatter, a
 * global sigma_int, offset (abs_mag) marginalized. Every covariance input
 * (alpha, beta, the population widths, sigma_int) changes from point to
 * point, as in a fit, so a dense path refactorizes at every call.
 */
import type { CovarianceMatrix, SystematicModes } from '../../src/data/index.js';
import { createHierarchicalSupernovaTerm, type HierarchicalTerm } from '../../src/likelihood/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { BENCH_TERM_SETTINGS } from './benchTerm.js';
import { BENCH_TRUTH, type BenchSurvey } from './syntheticSurvey.js';

/** Builds the term: 'blocks' without coupling matrices (with modes: the Woodbury block path), 'dense' with one. */
export function benchHierarchicalTerm(survey: BenchSurvey, covariances: CovarianceMatrix[], systematicModes?: SystematicModes): HierarchicalTerm {
  return createHierarchicalSupernovaTerm({
    name: 'bench',
    table: survey.table,
    covariances,
    systematicModes,
    cosmologyModel: { ...BENCH_TERM_SETTINGS.cosmologyModel },
    standardization: {
      massStep: { ...BENCH_TERM_SETTINGS.massStep },
      scatter: { ...BENCH_TERM_SETTINGS.scatter },
      intrinsicScatter: 'global',
      alphaBetaCovariance: 'exact',
    },
    population: { perSample: false, redshiftDependentMeans: false },
    offset: 'marginalize',
  });
}

/**
 * `count` seeded parameter points near the truth of the synthetic survey:
 * Omega_m in [0.2, 0.4], w0 in [-1.2, -0.6], wa in [-1, 1], alpha in
 * [0.12, 0.16], beta in [2.9, 3.3], x1 width in [0.9, 1.1], colour width in
 * [0.09, 0.11] mag, sigma_int in [0.05, 0.15] mag.
 */
export function benchHierarchicalPoints(count: number, seed: string): Array<Record<string, number>> {
  const rng = createRandomStream(seed);
  return Array.from({ length: count }, () => ({
    omega_m: 0.2 + 0.2 * rng.uniform(),
    w0: -1.2 + 0.6 * rng.uniform(),
    wa: -1 + 2 * rng.uniform(),
    alpha: 0.12 + 0.04 * rng.uniform(),
    beta: 2.9 + 0.4 * rng.uniform(),
    mass_step: BENCH_TRUTH.massStep,
    sigma_int: 0.05 + 0.1 * rng.uniform(),
    x1_mean: 0,
    x1_width: 0.9 + 0.2 * rng.uniform(),
    color_mean: 0,
    color_width: 0.09 + 0.02 * rng.uniform(),
  }));
}
