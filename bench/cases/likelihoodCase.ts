/**
 * One likelihood benchmark case, run in its own process by bench/likelihood.ts:
 *
 *   node dist/bench/cases/likelihoodCase.js --kind <kind> --count <N>
 *
 * kinds: baseline (modules loaded, nothing built), general_fixed (dense
 * C = D + U U^T factorized once; per call distances + triangular solve),
 * general_refactorize (C follows alpha and beta: a Cholesky per call),
 * compressed_dense, diagonal (C = D), compressed_diagonal, low_rank
 * (C = D + U U^T given as modes: the term's Woodbury path, distances at every
 * supernova), low_rank_refactorize (the same, with C following alpha and
 * beta: the Woodbury operator rebuilt every call), compressed_low_rank (the same C, compressed: whitened once by
 * the Woodbury operator), triangular_solve (one N x N forward substitution
 * on a synthetic factor: the per-call cost of the general path where
 * factorizing is out of reach).
 */
import { solveLowerInPlace } from '../../src/math/index.js';
import type { SupernovaTerm } from '../../src/likelihood/index.js';
import { peakRssMb, timeWithinBudget } from '../suite.js';
import { benchPoints, benchTerm, FIXED_NUISANCE } from '../support/benchTerm.js';
import { caseArguments, reportCase, runCaseMain, type CaseReport } from '../support/childCase.js';
import { benchSurvey, denseModeCovariance, modeCountFor } from '../support/syntheticSurvey.js';

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
  const alphaBeta = kind.endsWith('_refactorize') ? 'free' : 'fixed';
  const lowRank = kind.includes('low_rank');
  const systematicModes = lowRank ? { count, modeCount, values: survey.modes, sourceFile: 'bench modes' } : undefined;
  const path = kind.startsWith('compressed') ? 'compressed' : kind.startsWith('low_rank') ? 'low_rank' : kind === 'diagonal' ? 'diagonal' : 'general';
  const term = benchTerm(survey, { path, covariances, systematicModes, alphaBeta });
  const setupMs = since(start);
  const rssAfterSetupMb = peakRssMb();
  return reportCase({ kind, count, mode_count: dense || lowRank ? modeCount : 0, data_ms: dataMs, setup_ms: setupMs, peak_rss_after_setup_mb: rssAfterSetupMb, ...timeTerm(term, alphaBeta) });
});
