/**
 * The supernova likelihood with C = D + U U^T through the Woodbury path
 * (createLowRankGaussian), assembled in the benchmark because the supernova
 * term has no hook for it yet (see bench/RESULTS.md). D and the standardized
 * magnitudes y come from the diagonal supernova term (its Hubble diagram at
 * the fixed alpha, beta, mass step); each call builds the cosmology, the
 * distances at every supernova and d = y - 5 log10[(1 + z_hel) D_M H0/c],
 * then the offset-marginalized Gaussian. The constant 5 log10(c/H0) + 25 is
 * left out: a marginalized offset absorbs it (chi^2 and ln L do not change).
 */
import { createCosmology } from '../../src/cosmology/index.js';
import { createLowRankEvaluation, createLowRankGaussian, type GaussianLogLikelihood, type LowRankGaussian, type SupernovaTerm } from '../../src/likelihood/index.js';
import { BENCH_TRUTH, type BenchSurvey } from './syntheticSurvey.js';
import { FIXED_NUISANCE } from './benchTerm.js';

/** The assembled evaluation and what building it cost. */
export interface WoodburySupernova {
  gaussian: LowRankGaussian;
  /** Milliseconds to build the Woodbury factors (createLowRankGaussian only). */
  setupMs: number;
  /** ln L and chi^2 at the parameter point (flat w0waCDM: omega_m, w0, wa). Reuses one record. */
  evaluate(p: Readonly<Record<string, number>>): GaussianLogLikelihood;
}

/** Builds the Woodbury evaluation of `survey` from its diagonal term. Cost: N K^2/2 (Woodbury set-up) + one Hubble diagram. */
export function createWoodburySupernova(survey: BenchSurvey, diagonalTerm: SupernovaTerm): WoodburySupernova {
  const n = survey.table.count;
  const diagram = diagonalTerm.hubbleDiagram({ omega_m: BENCH_TRUTH.omegaMatter, w0: BENCH_TRUTH.w0, wa: BENCH_TRUTH.wa, ...FIXED_NUISANCE });
  const standardized = Float64Array.from(diagram.distanceModulusMag, (mu) => mu + diagram.absoluteMagnitudeMag);
  const variance = Float64Array.from(diagram.distanceModulusErrorMag, (sigma) => sigma * sigma);
  const started = process.hrtime.bigint();
  const gaussian = createLowRankGaussian({ diagonalVariance: variance, modes: survey.modes });
  const setupMs = Number(process.hrtime.bigint() - started) / 1e6;
  const order = Int32Array.from({ length: n }, (_, i) => i).sort((a, b) => survey.table.redshift[a] - survey.table.redshift[b]);
  const sortedRedshift = Float64Array.from(order, (row) => survey.table.redshift[row]);
  const maxRedshift = sortedRedshift[n - 1];
  const distances = new Float64Array(n);
  const residual = new Float64Array(n);
  const record = createLowRankEvaluation();
  const helio = survey.table.redshiftHelio;
  return {
    gaussian,
    setupMs,
    evaluate(p) {
      const outcome = createCosmology({ darkEnergy: 'cpl', flat: true, omegaMatter: p.omega_m, w0: p.w0, wa: p.wa, h0KmPerSPerMpc: BENCH_TRUTH.h0KmPerSPerMpc }, { maxRedshift });
      if (!outcome.ok) throw new Error(outcome.reason);
      outcome.cosmology.transverseComovingDistancesHubbleUnits(sortedRedshift, distances);
      for (let k = 0; k < n; k++) {
        const row = order[k];
        residual[row] = standardized[row] - 5 * Math.log10((1 + helio[row]) * distances[k]);
      }
      return gaussian.evaluate(residual, 'marginalize', record);
    },
  };
}
