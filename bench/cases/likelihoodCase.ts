/**
 * One likelihood benchmark case, run in its own process by bench/likelihood.ts:
 *
 *   node dist/bench/cases/likelihoodCase.js --kind <kind> --count <N>
 *
 * kinds: baseline (modules loaded, nothing built), general_fixed (dense
 * C = D + U U^T factorized once; per call distances + triangular solve),
 * general_refactorize (C follows alpha and beta: a Cholesky per call),
 * compressed_dense, diagonal (C = D), compressed_diagonal, woodbury
 * (C = D + U U^T by createLowRankGaussian), low_rank_whitener (set-up of
 * createLowRankWhitener and one whitened vector: what a compressed path on
 * D + U U^T would pay per design column), triangular_solve (one N x N
 * forward substitution on a synthetic factor: the per-call cost of the
 * general path where factorizing is out of reach).
 */
import { solveLowerInPlace } from '../../src/math/index.js';
import { createLowRankWhitener, type SupernovaTerm } from '../../src/likelihood/index.js';
import { peakRssMb, timeWithinBudget } from '../suite.js';
import { benchPoints, benchTerm, FIXED_NUISANCE } from '../support/benchTerm.js';
import { caseArguments, reportCase, runCaseMain, type CaseReport } from '../support/childCase.js';
import { benchSurvey, denseModeCovariance, modeCountFor, type BenchSurvey } from '../support/syntheticSurvey.js';
import { createWoodburySupernova } from '../support/woodburySupernova.js';

/** Wall time spent timing the calls of one case, ms (the slow paths get at least 3 calls). */
const TIMING_BUDGET_MS = 3000;
/** Parameter points cycled through while timing, and points where chi^2 is compared between paths. */
const TIMING_POINTS = 64;
const REFERENCE_POINTS = 5;
/** Fewest timed calls per case; a refactorizing call (seconds at N = 1,829) gets fewer. */
const MIN_REPEATS = 5;
const MIN_REFACTORIZING_REPEATS = 3;

const since = (start: bigint): number => Number(process.hrtime.bigint() - start) / 1e6;

function timeTerm(term: SupernovaTerm, alphaBeta: 'fixed' | 'free'): CaseReport {
  const points = benchPoints(TIMING_POINTS, alphaBeta, 'timing');
  // The first call pays for what the paths defer to it (the general path factorizes C here).
  const start = process.hrtime.bigint();
  term.logLikelihood(points[0]);
  const firstCallMs = since(start);
  let next = 1;
  const timing = timeWithinBudget(() => term.logLikelihood(points[next++ % TIMING_POINTS]), TIMING_BUDGET_MS, alphaBeta === 'free' ? MIN_REFACTORIZING_REPEATS : MIN_REPEATS);
  const reference = benchPoints(REFERENCE_POINTS, 'fixed', 'reference').map((p) => term.bestFitExtras!(p).chi_square);
  return { path: term.path, first_call_ms: firstCallMs, ms_per_call: timing.medianMs, min_ms: timing.minMs, repeats: timing.repeats, chi_square_at_reference: reference, describe: term.describe() };
}

function triangularSolve(count: number): CaseReport {
  const lower = new Float64Array(count * count);
  for (let i = 0; i < count; i++) {
    lower[i * count + i] = 1;
    for (let j = 0; j < i; j++) lower[i * count + j] = 0.5 / count;
  }
  const vector = new Float64Array(count);
  const timing = timeWithinBudget(() => {
    vector.fill(1);
    solveLowerInPlace(lower, count, vector);
  }, TIMING_BUDGET_MS, MIN_REPEATS);
  return { ms_per_call: timing.medianMs, min_ms: timing.minMs, repeats: timing.repeats };
}

function lowRankWhitener(survey: BenchSurvey, diagonal: SupernovaTerm): CaseReport {
  const diagram = diagonal.hubbleDiagram({ omega_m: 0.3, w0: -0.9, wa: 0.3, ...FIXED_NUISANCE });
  const variance = Float64Array.from(diagram.distanceModulusErrorMag, (sigma) => sigma * sigma);
  const start = process.hrtime.bigint();
  const whitener = createLowRankWhitener({ diagonalVariance: variance, modes: survey.modes });
  const setupMs = since(start);
  const vector = new Float64Array(survey.table.count);
  const timing = timeWithinBudget(() => {
    vector.fill(1);
    whitener.whitenInPlace(vector);
  }, TIMING_BUDGET_MS, MIN_REPEATS);
  return { whitener_setup_ms: setupMs, ms_per_vector: timing.medianMs, min_ms: timing.minMs, repeats: timing.repeats };
}

runCaseMain(() => {
  const args = caseArguments();
  const kind = args.kind;
  const count = Number(args.count);
  const modeCount = modeCountFor(count);
  if (kind === 'baseline') return reportCase({ kind });
  if (kind === 'triangular_solve') return reportCase({ kind, count, ...triangularSolve(count) });
  let start = process.hrtime.bigint();
  const survey = benchSurvey(count, modeCount, `bench-${count}`);
  const dataMs = since(start);
  start = process.hrtime.bigint();
  const dense = kind === 'general_fixed' || kind === 'general_refactorize' || kind === 'compressed_dense';
  const covariances = dense ? [denseModeCovariance(survey)] : [];
  const alphaBeta = kind === 'general_refactorize' ? 'free' : 'fixed';
  const path = kind.startsWith('compressed') ? 'compressed' : kind === 'woodbury' || kind === 'low_rank_whitener' || kind === 'diagonal' ? 'diagonal' : 'general';
  const term = benchTerm(survey, { path, covariances, alphaBeta });
  if (kind === 'low_rank_whitener') return reportCase({ kind, count, mode_count: modeCount, data_ms: dataMs, ...lowRankWhitener(survey, term) });
  if (kind !== 'woodbury') {
    const setupMs = since(start);
    const rssAfterSetupMb = peakRssMb();
    return reportCase({ kind, count, mode_count: dense ? modeCount : 0, data_ms: dataMs, setup_ms: setupMs, peak_rss_after_setup_mb: rssAfterSetupMb, ...timeTerm(term, alphaBeta) });
  }
  const woodbury = createWoodburySupernova(survey, term);
  const setupMs = since(start);
  const rssAfterSetupMb = peakRssMb();
  const points = benchPoints(TIMING_POINTS, 'fixed', 'timing');
  let next = 0;
  const timing = timeWithinBudget(() => woodbury.evaluate(points[next++ % TIMING_POINTS]).logLikelihood, TIMING_BUDGET_MS, MIN_REPEATS);
  const reference = benchPoints(REFERENCE_POINTS, 'fixed', 'reference').map((p) => woodbury.evaluate(p).chiSquare);
  // The Woodbury part alone (without distances): one evaluation of a fixed residual.
  const residual = Float64Array.from({ length: count }, (_, i) => 0.1 * Math.sin(i));
  const record = { logLikelihood: 0, chiSquare: 0, logDeterminant: 0, bestOffset: 0, marginalizationTerm: 0, reason: null };
  const gaussianOnly = timeWithinBudget(() => woodbury.gaussian.evaluate(residual, 'marginalize', record), TIMING_BUDGET_MS / 2);
  return reportCase({
    kind, count, mode_count: modeCount, data_ms: dataMs, setup_ms: setupMs, woodbury_setup_ms: woodbury.setupMs, peak_rss_after_setup_mb: rssAfterSetupMb,
    path: 'woodbury', ms_per_call: timing.medianMs, min_ms: timing.minMs, repeats: timing.repeats,
    gaussian_only_ms_per_call: gaussianOnly.medianMs, chi_square_at_reference: reference,
  });
});
