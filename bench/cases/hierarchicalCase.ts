/**
 * One hierarchical-likelihood benchmark case, run in its own process by
 * bench/hierarchical.ts:
 *
 *   node dist/bench/cases/hierarchicalCase.js --kind <kind> --count <N> --modes <K>
 *
 * kinds: blocks (per-supernova 3 x 3 blocks, no modes: O(N)), modes (the
 * same plus K systematic modes on m_B through the Woodbury identity:
 * O(N K^2)), dense (the same U U^T handed over as an N x N magnitude matrix,
 * so the 3N x 3N covariance is factorized by Cholesky at every call),
 * interleaved (blocks and modes built in one process and called in turn, so
 * that a busy machine slows both alike: their ratio is the fair one).
 */
import { timeWithinBudget } from '../suite.js';
import { benchHierarchicalPoints, benchHierarchicalTerm } from '../support/benchHierarchicalTerm.js';
import { caseArguments, reportCase, runCaseMain } from '../support/childCase.js';
import { benchSurvey, denseModeCovariance } from '../support/syntheticSurvey.js';

/** Wall time spent timing the calls of one case, ms; fewest timed calls (a dense call takes seconds at 3N = 1,800). */
const TIMING_BUDGET_MS = 3000;
const MIN_REPEATS = 5;
const MIN_DENSE_REPEATS = 3;
/** Parameter points cycled through while timing, and points where ln L is compared between kinds. */
const TIMING_POINTS = 64;
const REFERENCE_POINTS = 5;

/** Rounds of the interleaved kind (one blocks call and one modes call each), after as many warm-up rounds / 10. */
const INTERLEAVED_ROUNDS = 300;

const since = (start: bigint): number => Number(process.hrtime.bigint() - start) / 1e6;

const median = (values: number[]): number => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
};

/** Blocks and modes terms on one survey, called in turn: medians and minima of each, ms per call. */
function interleaved(count: number, modeCount: number): void {
  const survey = benchSurvey(count, modeCount, `bench-hierarchical-${count}`);
  const blocks = benchHierarchicalTerm(survey, []);
  const modes = benchHierarchicalTerm(survey, [], { count, modeCount, values: survey.modes, sourceFile: 'bench modes' });
  const points = benchHierarchicalPoints(TIMING_POINTS, 'timing');
  const times: [number[], number[]] = [[], []];
  for (let round = -INTERLEAVED_ROUNDS / 10; round < INTERLEAVED_ROUNDS; round++) {
    const p = points[(round + TIMING_POINTS) % TIMING_POINTS];
    [blocks, modes].forEach((term, k) => {
      const start = process.hrtime.bigint();
      term.logLikelihood(p);
      if (round >= 0) times[k].push(since(start));
    });
  }
  reportCase({
    kind: 'interleaved', count, mode_count: modeCount, repeats: INTERLEAVED_ROUNDS,
    blocks_ms_per_call: median(times[0]), blocks_min_ms: Math.min(...times[0]), modes_ms_per_call: median(times[1]), modes_min_ms: Math.min(...times[1]),
  });
}

runCaseMain(() => {
  const args = caseArguments();
  const kind = args.kind;
  const count = Number(args.count);
  const modeCount = Number(args.modes);
  if (kind === 'interleaved') return interleaved(count, modeCount);
  const survey = benchSurvey(count, modeCount, `bench-hierarchical-${count}`);
  let start = process.hrtime.bigint();
  const covariances = kind === 'dense' ? [denseModeCovariance(survey)] : [];
  const systematicModes = kind === 'modes' ? { count, modeCount, values: survey.modes, sourceFile: 'bench modes' } : undefined;
  const term = benchHierarchicalTerm(survey, covariances, systematicModes);
  const setupMs = since(start);
  const points = benchHierarchicalPoints(TIMING_POINTS, 'timing');
  start = process.hrtime.bigint();
  term.logLikelihood(points[0]);
  const firstCallMs = since(start);
  let next = 1;
  const timing = timeWithinBudget(() => term.logLikelihood(points[next++ % TIMING_POINTS]), TIMING_BUDGET_MS, kind === 'dense' ? MIN_DENSE_REPEATS : MIN_REPEATS);
  const reference = benchHierarchicalPoints(REFERENCE_POINTS, 'reference').map((p) => term.logLikelihood(p));
  reportCase({
    kind, count, mode_count: kind === 'blocks' ? 0 : modeCount, path: term.path, setup_ms: setupMs, first_call_ms: firstCallMs,
    ms_per_call: timing.medianMs, min_ms: timing.minMs, repeats: timing.repeats, log_likelihood_at_reference: reference,
  });
});
