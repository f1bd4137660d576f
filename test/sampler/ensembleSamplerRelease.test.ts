import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator } from '../../src/sampler/index.js';
import type { EnsembleRunOptions } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';
import { sameBytes } from './support/chainStatistics.js';

// A sampler that releases the steps its caller has saved must sample exactly as one that keeps them all (the
// release touches storage only), and after a restore whose earlier steps are replayed its diagnostic traces must
// equal the uninterrupted run's. Identity checks of the sampler's own design; no statistics involved.
const model = createGaussianTarget({ mean: [0, 1], covariance: [1, 0.5, 0.5, 2] });
const options: EnsembleRunOptions = { dimension: 2, walkers: 6, ensembles: 3, seed: 'release' };
const storage = { traceCapacitySteps: 16 };
const starts = (): Float64Array[] => {
  const rng = createRandomStream('release-starts');
  return [0, 1, 2].map(() => Float64Array.from({ length: 12 }, () => 0.1 * rng.normal()));
};

/** Steps saved by the caller, per ensemble: what a chain record holds. */
type Saved = Float64Array[][];

function saveAndRelease(sampler: EnsembleSampler, saved: Saved): void {
  for (let k = 0; k < sampler.options.ensembles; k++) {
    const view = sampler.chain(k);
    const size = view.walkers * view.dimension;
    for (let j = 0; j < view.steps; j++) saved[k][view.firstStep + j] = view.positions.slice(j * size, (j + 1) * size);
  }
  sampler.releaseStoredSteps(sampler.stepCount);
}

describe('EnsembleSampler.releaseStoredSteps and restore with earlier steps replayed', () => {
  it('samples the same chains, and a restore that replays the saved steps rebuilds the uninterrupted traces', async () => {
    const straight = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts(), storage);
    await straight.advance(150);

    const saved: Saved = [[], [], []];
    const first = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts(), storage);
    for (let done = 0; done < 70; done += 10) {
      await first.advance(10);
      saveAndRelease(first, saved);
    }
    await first.advance(5); // five steps not yet saved: they travel in the snapshot
    const snapshot = first.snapshot();
    expect([snapshot.chainFirstStep, snapshot.ensembles[0].chainLogProb.length]).toEqual([70, 5 * 6]);
    const resumed = await EnsembleSampler.restore(snapshot, createInProcessEvaluator(model), {
      ...storage,
      earlierSteps: (visit) => { for (let step = 0; step < 70; step++) for (let k = 0; k < 3; k++) visit(step, k, saved[k][step]); },
    });
    await resumed.advance(75);
    saveAndRelease(resumed, saved);

    for (let k = 0; k < 3; k++) {
      const whole = straight.chain(k).positions;
      const size = 12;
      for (let step = 0; step < 150; step++) expect(sameBytes(saved[k][step], whole.subarray(step * size, (step + 1) * size)), `ensemble ${k} step ${step}`).toBe(true);
      const expected = straight.trace(k);
      const found = resumed.trace(k);
      expect([found.steps, found.stride]).toEqual([expected.steps, expected.stride]);
      expect(expected.stride).toBe(16); // 150 steps into 16 kept: stride 16 keeps steps 0, 16, ..., 144
      expect(sameBytes(found.positions, expected.positions)).toBe(true);
      expect(sameBytes(resumed.acceptanceFractions(k), straight.acceptanceFractions(k))).toBe(true);
    }
  });

  it('refuses a restore whose earlier steps are not replayed, or replayed short', async () => {
    const sampler = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts(), storage);
    await sampler.advance(8);
    sampler.releaseStoredSteps(8);
    const snapshot = sampler.snapshot();
    const codeOf = async (promise: Promise<unknown>): Promise<string> => promise.then(() => 'none', (error: unknown) => (isCandelaError(error) ? error.issues[0].code : String(error)));
    expect(await codeOf(EnsembleSampler.restore(snapshot, createInProcessEvaluator(model)))).toBe('sampler.snapshot_invalid');
    const short = (visit: (step: number, ensemble: number, positions: Float64Array) => void): void => {
      for (let step = 0; step < 7; step++) for (let k = 0; k < 3; k++) visit(step, k, new Float64Array(12));
    };
    expect(await codeOf(EnsembleSampler.restore(snapshot, createInProcessEvaluator(model), { earlierSteps: short }))).toBe('sampler.snapshot_invalid');
  });
});
