/**
 * Sampler throughput case, run in its own process by bench/sampler.ts:
 *
 *   node dist/bench/cases/samplerCase.js --workers <0 | n> [--local 1] --count 1829 --burn 200 --steps 1000
 *
 * workers 0 evaluates in process (what the pipeline does for one worker);
 * n >= 1 uses the worker pool with n threads; with --local 1 this thread
 * evaluates a share of every batch too (what the pipeline does for n + 1 workers). Flat w0waCDM on the dense
 * 1,829-supernova sample (compressed path), 4 ensembles of 32 walkers
 * started in a small ball around the truth; after `burn` steps, `steps`
 * timed steps. Reports log-posterior calls per second, the bulk ESS of the
 * timed steps (worst parameter) per second, and the split of the wall time
 * into evaluation and sampler overhead.
 */
import { diagnoseEnsembleChains } from '../../src/diagnostics/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { createInProcessEvaluator, createWorkerPoolEvaluator, EnsembleSampler, type BatchEvaluator } from '../../src/sampler/index.js';
import { caseArguments, reportCase, runCaseMain } from '../support/childCase.js';
import { buildFitModel, fitModelUrl, type FitModelInit } from '../support/fitModel.js';
import { BENCH_TRUTH } from '../support/syntheticSurvey.js';
import { timedEvaluator } from '../support/timedEvaluator.js';

const WALKERS = 32;
const ENSEMBLES = 4;
/** Radius of the start ball around the truth, in parameter units. */
const START_RADIUS = 0.02;

const since = (start: bigint): number => Number(process.hrtime.bigint() - start) / 1e6;

/** The worst (smallest) bulk ESS over the parameters, after dropping `burn` steps. */
function smallestBulkEss(sampler: EnsembleSampler, burn: number): number {
  const { dimension, walkers, ensembles } = sampler.options;
  const steps = sampler.stepCount;
  let smallest = Infinity;
  for (let d = 0; d < dimension; d++) {
    const traces = Array.from({ length: ensembles }, (_, k) => {
      const positions = sampler.chain(k).positions;
      return { steps, walkers, values: Float64Array.from({ length: steps * walkers }, (_, i) => positions[i * dimension + d]) };
    });
    smallest = Math.min(smallest, diagnoseEnsembleChains(traces, burn).essBulk ?? NaN);
  }
  return smallest;
}

runCaseMain(async () => {
  const args = caseArguments();
  const workers = Number(args.workers ?? 0);
  const burn = Number(args.burn ?? 200);
  const steps = Number(args.steps ?? 1000);
  const init: FitModelInit = { count: Number(args.count ?? 1829), seed: 'bench-fit' };
  let start = process.hrtime.bigint();
  const local = args.local === '1';
  let model: ReturnType<typeof buildFitModel> | undefined;
  const pool = workers > 0
    ? createWorkerPoolEvaluator({ moduleUrl: fitModelUrl(), exportName: 'createBenchFitModel', init }, workers, { localModel: local ? () => model!.logProbability : undefined })
    : null;
  if (workers === 0 || local) model = buildFitModel(init); // in parallel with the threads' builds
  const inner: BatchEvaluator = pool ? await pool : createInProcessEvaluator(model!.logProbability);
  const setupMs = since(start);
  const evaluator = timedEvaluator(inner);
  try {
    const rng = createRandomStream('bench-start');
    const truth = [BENCH_TRUTH.omegaMatter, BENCH_TRUTH.w0, BENCH_TRUTH.wa];
    const starts = Array.from({ length: ENSEMBLES }, () => Float64Array.from({ length: WALKERS * 3 }, (_, i) => truth[i % 3] + START_RADIUS * rng.normal()));
    const sampler = await EnsembleSampler.start({ dimension: 3, walkers: WALKERS, ensembles: ENSEMBLES, seed: 'bench' }, evaluator, starts);
    await sampler.advance(burn);
    evaluator.reset();
    start = process.hrtime.bigint();
    await sampler.advance(steps);
    const wallMs = since(start);
    const evaluateMs = evaluator.evaluateMs;
    const calls = evaluator.points;
    start = process.hrtime.bigint();
    const ess = smallestBulkEss(sampler, burn);
    const diagnosticsMs = since(start);
    const overheadMs = wallMs - evaluateMs;
    reportCase({
      workers, local: local ? 1 : 0, walkers: WALKERS, ensembles: ENSEMBLES, burn_steps: burn, timed_steps: steps, setup_ms: setupMs,
      wall_ms: wallMs, evaluate_ms: evaluateMs, calls,
      calls_per_second: calls / (wallMs / 1000),
      ms_per_call_in_evaluator: evaluateMs / calls,
      sampler_overhead_ms_per_step: overheadMs / steps,
      sampler_overhead_share_of_evaluation: overheadMs / evaluateMs,
      min_bulk_ess: ess,
      min_bulk_ess_per_second: ess / (wallMs / 1000),
      diagnostics_ms: diagnosticsMs,
      acceptance_ensemble0: Array.from(sampler.acceptanceFractions(0)).reduce((a, b) => a + b, 0) / WALKERS,
    });
  } finally {
    await evaluator.close();
  }
});
