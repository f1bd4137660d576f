/**
 * Messaging cost of the worker pool, run in its own process by bench/sampler.ts:
 *
 *   node dist/bench/cases/poolRoundTripCase.js --workers <0 | n> [--local 1] --batch 64
 *
 * Evaluates batches of `batch` points (the sampler's batch: half of 32
 * walkers in each of 4 ensembles) of a model that costs almost nothing, in
 * process (0) or with a pool of n threads, so that the time per batch is the
 * pool's round trip (split, copy into shared memory, wake, wait, copy back).
 */
import { createInProcessEvaluator, createWorkerPoolEvaluator, type BatchEvaluator } from '../../src/sampler/index.js';
import { caseArguments, reportCase, runCaseMain } from '../support/childCase.js';
import { createTrivialModel, trivialModelUrl } from '../support/trivialModel.js';

/** Wall time of the timed batches, ms. */
const TIMING_BUDGET_MS = 2000;

runCaseMain(async () => {
  const args = caseArguments();
  const workers = Number(args.workers ?? 0);
  const batch = Number(args.batch ?? 64);
  const evaluator: BatchEvaluator = workers === 0
    ? createInProcessEvaluator(createTrivialModel())
    : await createWorkerPoolEvaluator({ moduleUrl: trivialModelUrl(), exportName: 'createTrivialModel', init: null }, workers, { localModel: args.local === '1' ? createTrivialModel() : undefined });
  try {
    const points = Float64Array.from({ length: batch * 3 }, (_, i) => Math.sin(i));
    const logProb = new Float64Array(batch);
    const blobs = new Float64Array(batch * 2);
    // Batches are awaited one after another, as the sampler does, and timed in chunks of 100 (median chunk / 100).
    const chunk = async (): Promise<void> => { for (let i = 0; i < 100; i++) await evaluator.evaluate(points, batch, logProb, blobs); };
    for (let i = 0; i < 5; i++) await chunk();
    const samples: number[] = [];
    const started = process.hrtime.bigint();
    while (Number(process.hrtime.bigint() - started) / 1e6 < TIMING_BUDGET_MS) {
      const start = process.hrtime.bigint();
      await chunk();
      samples.push(Number(process.hrtime.bigint() - start) / 1e8);
    }
    samples.sort((a, b) => a - b);
    reportCase({ workers, batch, ms_per_batch: samples[Math.floor(samples.length / 2)], min_ms_per_batch: samples[0], chunks_of_100: samples.length });
  } finally {
    await evaluator.close();
  }
});
