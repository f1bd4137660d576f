import { afterEach, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator, createWorkerPoolEvaluator, initializeWalkers } from '../../src/sampler/index.js';
import type { BatchEvaluator, WorkerModelSpec } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';
import { sameBytes } from './support/chainStatistics.js';
import type { GaussianTargetInit } from './fixtures/gaussianTarget.mjs';

// The worker threads run the compiled worker script from dist/ (npm test builds first)
// and load this plain-JavaScript fixture, which needs no build.
const FIXTURE_URL = new URL('./fixtures/gaussianTarget.mjs', import.meta.url).href;
const TARGET: GaussianTargetInit = { mean: [0.3, -1, 2], covariance: [2, 0.5, 0.1, 0.5, 1, -0.3, 0.1, -0.3, 0.5] };
const spec = (exportName = 'createGaussianTarget', init: unknown = TARGET): WorkerModelSpec => ({ moduleUrl: FIXTURE_URL, exportName, init });


const open: BatchEvaluator[] = [];
afterEach(async () => {
  await Promise.all(open.splice(0).map((evaluator) => evaluator.close()));
});
async function pool(workers: number, modelSpec = spec(), withLocalModel = false): Promise<BatchEvaluator> {
  const localModel = withLocalModel ? createGaussianTarget(TARGET) : undefined;
  const evaluator = await createWorkerPoolEvaluator(modelSpec, workers, { localModel });
  open.push(evaluator);
  return evaluator;
}

describe('createWorkerPoolEvaluator', () => {
  it('returns bit-identical log posteriors and blobs to the in-process evaluator, for uneven chunk sizes', async () => {
    const rng = createRandomStream('points');
    const count = 37; // not a multiple of 3 workers
    const points = Float64Array.from({ length: count * 3 }, () => 3 * rng.normal());
    const expectedLogProb = new Float64Array(count);
    const expectedBlobs = new Float64Array(count * 2);
    await createInProcessEvaluator(createGaussianTarget(TARGET)).evaluate(points, count, expectedLogProb, expectedBlobs);
    const evaluator = await pool(3);
    expect([evaluator.dimension, evaluator.blobCount]).toEqual([3, 2]);
    for (const batch of [count, 2, 1]) { // buffers are reused and regrown between calls
      const logProb = new Float64Array(count).fill(NaN);
      const blobs = new Float64Array(count * 2).fill(NaN);
      await evaluator.evaluate(points, batch, logProb, blobs);
      expect(sameBytes(logProb.subarray(0, batch), expectedLogProb.subarray(0, batch))).toBe(true);
      expect(sameBytes(blobs.subarray(0, 2 * batch), expectedBlobs.subarray(0, 2 * batch))).toBe(true);
      expect(Number.isNaN(logProb[batch] ?? NaN)).toBe(true); // nothing written past the batch
    }
  });

  it('splits a batch between the calling thread (localModel) and the threads, bit-identical to in process', async () => {
    const rng = createRandomStream('local');
    const count = 41;
    const points = Float64Array.from({ length: count * 3 }, () => 3 * rng.normal());
    const expectedLogProb = new Float64Array(count);
    const expectedBlobs = new Float64Array(count * 2);
    await createInProcessEvaluator(createGaussianTarget(TARGET)).evaluate(points, count, expectedLogProb, expectedBlobs);
    for (const threads of [1, 2]) {
      const evaluator = await pool(threads, spec(), true);
      for (const batch of [1, 2, count, 5]) { // 1 point: only a thread works; the blocks grow and are reused
        const logProb = new Float64Array(count).fill(NaN);
        const blobs = new Float64Array(count * 2).fill(NaN);
        await evaluator.evaluate(points, batch, logProb, blobs);
        expect(sameBytes(logProb.subarray(0, batch), expectedLogProb.subarray(0, batch))).toBe(true);
        expect(sameBytes(blobs.subarray(0, 2 * batch), expectedBlobs.subarray(0, 2 * batch))).toBe(true);
        expect(Number.isNaN(logProb[batch] ?? NaN)).toBe(true);
      }
    }
  });

  it('rejects a local model whose shape differs from the threads\' models', async () => {
    const other = createGaussianTarget({ mean: [0, 0], covariance: [1, 0, 0, 1] });
    await expect(createWorkerPoolEvaluator(spec(), 1, { localModel: other })).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.worker_mismatch');
  });

  it('accepts an asynchronous model factory', async () => {
    const evaluator = await pool(2, spec('createDelayedGaussianTarget'));
    const logProb = new Float64Array(1);
    await evaluator.evaluate(Float64Array.of(0.3, -1, 2), 1, logProb, new Float64Array(2));
    expect(logProb[0] === 0).toBe(true); // at the mean: -0.5 x 0 (either sign of zero)
  });

  it('rejects with sampler.worker_model_failed when the factory export does not exist', async () => {
    await expect(createWorkerPoolEvaluator(spec('noSuchFactory'), 2)).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.worker_model_failed' && /noSuchFactory/.test(error.message));
  });

  it('rejects a worker count that is not a positive integer', async () => {
    await expect(createWorkerPoolEvaluator(spec(), 0)).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].path === 'workers');
  });

  it('passes an error thrown by the model in a worker to the caller, and stays failed', async () => {
    const evaluator = await pool(2, spec('createThrowingTarget', { dimension: 2, limit: 1 }));
    const points = Float64Array.of(0, 0, 0.5, 0, 5, 0, 0, 1);
    await expect(evaluator.evaluate(points, 4, new Float64Array(4), new Float64Array(0))).rejects.toThrow(/beyond 1/);
    await expect(evaluator.evaluate(points, 2, new Float64Array(4), new Float64Array(0))).rejects.toThrow(/beyond 1/);
  });
});

describe('EnsembleSampler determinism across evaluators', () => {
  it('stores byte-identical chains in process, with 1 or 2 threads, and with the caller sharing the work (same seed)', async () => {
    const options = { dimension: 3, walkers: 8, seed: 'workers', differentialEvolutionWeight: 0.25 };
    const run = async (evaluator: BatchEvaluator) => {
      // A small optimizer budget keeps the test quick; determinism does not depend on convergence.
      const start = await initializeWalkers({ walkers: 8, seed: 'workers', optimizerEvaluations: 120, sampleStart: (rng, out) => out.forEach((_, i) => { out[i] = 2 * rng.normal(); }) }, evaluator);
      const sampler = await EnsembleSampler.start(options, evaluator, start.positions);
      await sampler.advance(60);
      return Array.from({ length: 4 }, (_, k) => sampler.chain(k));
    };
    const reference = await run(createInProcessEvaluator(createGaussianTarget(TARGET)));
    for (const [workers, local] of [[1, false], [2, false], [1, true]] as const) {
      const chains = await run(await pool(workers, spec(), local));
      chains.forEach((chain, k) => {
        expect(chain.steps).toBe(60);
        expect(sameBytes(chain.positions, reference[k].positions)).toBe(true);
        expect(sameBytes(chain.logProb, reference[k].logProb)).toBe(true);
        expect(sameBytes(chain.blobs, reference[k].blobs)).toBe(true);
      });
    }
  });
});
