/**
 * Full-fit case, run in its own process by bench/fit.ts:
 *
 *   node dist/bench/cases/fitCase.js --workers <0 | n> [--local 1] --count 1829 --check-every 500 --stop ess [--de 0.2] [--progress 1]
 *
 * Flat w0waCDM (Omega_m, w0, wa; offset marginalized) on the dense
 * 1,829-supernova sample, driven the way the pipeline's runFit drives it:
 * walkers started by initializeWalkers from prior draws (Nelder-Mead mode
 * search, curvature widths), 4 ensembles of 32 walkers, and the pipeline's
 * own diagnostics (checkConvergence: burn-in 2 max tau, then bulk ESS and
 * R-hat per parameter) every `check-every` steps. `--stop ess` ends at the
 * first check with bulk ESS >= 2,000 for every parameter (the benchmark
 * target; R-hat is reported), `--stop rule` at the pipeline's full rule
 * (also R-hat <= 1.01). `--de w` mixes in the differential-evolution move
 * with weight w (sampler.differential_evolution_weight). The wall time (from
 * nothing built to the stop) is split into set-up, walker start,
 * evaluation, sampler overhead and diagnostics. Writing the run's output
 * files is not included.
 */
import { samplePrior } from '../../src/likelihood/index.js';
import { createInProcessEvaluator, createWorkerPoolEvaluator, EnsembleSampler, initializeWalkers, type BatchEvaluator } from '../../src/sampler/index.js';
import { checkConvergence, type ConvergenceCheck } from '../../src/pipeline/fit/samplingLoop.js';
import { caseArguments, reportCase, runCaseMain } from '../support/childCase.js';
import { buildFitModel, FIT_FREE, fitModelUrl, type FitModelInit } from '../support/fitModel.js';
import { timedEvaluator } from '../support/timedEvaluator.js';

const WALKERS = 32;
const ENSEMBLES = 4;
/** The pipeline's default stopping rule (src/config/defaults.ts). */
const RULE = { targetEss: 2000, maxRhat: 1.01 };
/** Give up after this many steps. */
const MAX_STEPS = 40_000;

const since = (start: bigint): number => Number(process.hrtime.bigint() - start) / 1e6;

runCaseMain(async () => {
  const args = caseArguments();
  const workers = Number(args.workers ?? 0);
  const checkEvery = Number(args['check-every'] ?? 500);
  const stopAtEss = (args.stop ?? 'ess') === 'ess';
  const differentialEvolutionWeight = Number(args.de ?? 0);
  const init: FitModelInit = { count: Number(args.count ?? 1829), seed: 'bench-fit' };
  const begin = process.hrtime.bigint();
  let start = begin;
  // With --local 1 this thread takes a share of every batch as well, as the pipeline runs `--workers n + 1`,
  // and builds its model while the worker threads build theirs (as runFit does).
  const local = args.local === '1';
  let model: ReturnType<typeof buildFitModel> | undefined;
  const pool = workers > 0
    ? createWorkerPoolEvaluator({ moduleUrl: fitModelUrl(), exportName: 'createBenchFitModel', init }, workers, { localModel: local ? () => model!.logProbability : undefined })
    : null;
  model = buildFitModel(init);
  const inner: BatchEvaluator = pool ? await pool : createInProcessEvaluator(model.logProbability);
  const setupMs = since(start);
  const evaluator = timedEvaluator(inner);
  try {
    start = process.hrtime.bigint();
    const walkerStart = await initializeWalkers({
      walkers: WALKERS, ensembles: ENSEMBLES, seed: 'bench-fit',
      sampleStart: (rng, out) => FIT_FREE.forEach((entry, d) => { out[d] = samplePrior(entry.prior, rng); }),
    }, evaluator);
    const sampler = await EnsembleSampler.start({ dimension: FIT_FREE.length, walkers: WALKERS, ensembles: ENSEMBLES, seed: 'bench-fit', differentialEvolutionWeight }, evaluator, walkerStart.positions);
    const startMs = since(start);
    const startCalls = evaluator.points;
    evaluator.reset();
    let advanceMs = 0;
    let diagnosticsMs = 0;
    let checks = 0;
    let check: ConvergenceCheck | null = null;
    const done = (c: ConvergenceCheck | null): boolean => (stopAtEss ? (c?.minEssBulk ?? 0) >= RULE.targetEss : Boolean(c?.converged));
    while (sampler.stepCount < MAX_STEPS && !done(check)) {
      start = process.hrtime.bigint();
      await sampler.advance(checkEvery);
      advanceMs += since(start);
      start = process.hrtime.bigint();
      check = checkConvergence(sampler, RULE);
      diagnosticsMs += since(start);
      checks++;
      if (args.progress) {
        process.stderr.write(`step ${sampler.stepCount}: min ESS ${check.minEssBulk?.toFixed(0)}, max R-hat ${check.maxRhat?.toFixed(4)}, max tau ${check.maxTau?.toFixed(1)}, ` +
          `calls ${evaluator.points}, evaluation ${(evaluator.evaluateMs / 1000).toFixed(1)} s, diagnostics ${(diagnosticsMs / 1000).toFixed(1)} s; ${model.term.describe().at(-1)}\n`);
      }
    }
    const wallMs = since(begin);
    reportCase({
      workers, local: local ? 1 : 0, count: init.count, check_every: checkEvery, stop: stopAtEss ? 'bulk ESS >= 2000' : 'bulk ESS >= 2000 and R-hat <= 1.01',
      differential_evolution_weight: differentialEvolutionWeight, reached: done(check) ? 'yes' : 'no',
      wall_s: wallMs / 1000, setup_s: setupMs / 1000, walker_start_s: startMs / 1000, walker_start_calls: startCalls,
      steps: sampler.stepCount, burn_in_steps: check?.burnInSteps ?? 0, calls: evaluator.points,
      evaluation_s: evaluator.evaluateMs / 1000, sampler_overhead_s: (advanceMs - evaluator.evaluateMs) / 1000,
      diagnostics_s: diagnosticsMs / 1000, checks,
      min_bulk_ess: check?.minEssBulk ?? null, max_rhat: check?.maxRhat ?? null, max_tau_steps: check?.maxTau ?? null,
      mean_acceptance: check?.meanAcceptance ?? null, path: model.term.path, describe: model.term.describe(),
    });
  } finally {
    await evaluator.close();
  }
});
