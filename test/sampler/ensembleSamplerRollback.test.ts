import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator } from '../../src/sampler/index.js';
import type { BatchEvaluator } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';

// A step that fails half done (an interrupt, a model error) must leave the sampler exactly at the end of the step
// before: continuing it gives the chain of a sampler that never failed, bit for bit (the reproducibility contract
// of the random-stream design in ensembleStep.ts; common practice for resumable samplers).
const standardNormal = createGaussianTarget({ mean: [0, 0, 0], covariance: [1, 0, 0, 0, 1, 0, 0, 0, 1] });
const ball = (label: number, walkers: number) => {
  const rng = createRandomStream(`rollback-${label}`);
  return Float64Array.from({ length: walkers * 3 }, () => rng.normal());
};

/** An evaluator that rejects on its call number `failAt` (counted from 1 over its whole life), once. */
function failingOnce(inner: BatchEvaluator, failAt: number): BatchEvaluator {
  let calls = 0;
  return {
    dimension: inner.dimension,
    blobCount: inner.blobCount,
    async evaluate(points, count, logProb, blobs) {
      calls += 1;
      if (calls === failAt) {
        await inner.evaluate(points, count, logProb, blobs); // the points are evaluated, then the step is abandoned
        throw new Error('stopped half way');
      }
      return inner.evaluate(points, count, logProb, blobs);
    },
    close: () => inner.close(),
  };
}

describe('EnsembleSampler after a step that failed half done', () => {
  it.each([
    ['in the first half of a step', 1 + 2 * 20 + 1],
    ['in the second half of a step', 1 + 2 * 20 + 2],
    ['in the very first step', 2],
  ])('holds the steps before it and continues into the uninterrupted chain (%s)', async (_, failAt) => {
    const starts = [ball(0, 8), ball(1, 8)];
    const straight = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 2, seed: 'rb', differentialEvolutionWeight: 0.3 }, createInProcessEvaluator(standardNormal), starts);
    await straight.advance(60);
    // Call 1 evaluates the initial walkers; step s (from 1) makes calls 2s and 2s + 1.
    const failing = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 2, seed: 'rb', differentialEvolutionWeight: 0.3 }, failingOnce(createInProcessEvaluator(standardNormal), failAt), starts);
    await expect(failing.advance(60)).rejects.toThrow('stopped half way');
    const completed = Math.floor((failAt - 2) / 2);
    expect(failing.stepCount).toBe(completed);
    expect(failing.chain(0).steps).toBe(completed);
    const snapshot = failing.snapshot();
    await failing.advance(60 - completed);
    for (const k of [0, 1]) {
      expect(Buffer.from(failing.chain(k).positions.buffer, failing.chain(k).positions.byteOffset, failing.chain(k).positions.byteLength)
        .equals(Buffer.from(straight.chain(k).positions.buffer, straight.chain(k).positions.byteOffset, straight.chain(k).positions.byteLength))).toBe(true);
      expect(Array.from(failing.chain(k).logProb)).toEqual(Array.from(straight.chain(k).logProb));
      expect(Array.from(failing.acceptanceFractions(k))).toEqual(Array.from(straight.acceptanceFractions(k)));
    }
    // The snapshot taken right after the failure restores into the same continuation.
    const restored = await EnsembleSampler.restore(snapshot, createInProcessEvaluator(standardNormal));
    await restored.advance(60 - completed);
    expect(Array.from(restored.chain(1).positions)).toEqual(Array.from(straight.chain(1).positions));
  });
});
