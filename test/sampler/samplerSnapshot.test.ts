import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { EnsembleSampler, checkSnapshotShape, createInProcessEvaluator } from '../../src/sampler/index.js';
import type { EnsembleRunOptions, SamplerSnapshot } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';
import { sameBytes } from './support/chainStatistics.js';

const model = createGaussianTarget({ mean: [1, 2], covariance: [1, 0.9, 0.9, 1] });
const options: EnsembleRunOptions = { dimension: 2, walkers: 6, ensembles: 3, seed: 'checkpoint', differentialEvolutionWeight: 0.3 };
const starts = (): Float64Array[] => {
  const rng = createRandomStream('starts');
  return [0, 1, 2].map(() => Float64Array.from({ length: 12 }, () => 1 + 0.1 * rng.normal()));
};

/** What a checkpoint file does: typed arrays to plain arrays, through JSON text and back. */
function throughJson(snapshot: SamplerSnapshot): SamplerSnapshot<number[]> {
  return JSON.parse(JSON.stringify(snapshot, (_, value) => (value instanceof Float64Array ? Array.from(value) : value)));
}

describe('EnsembleSampler.snapshot and EnsembleSampler.restore', () => {
  it('continue exactly like an uninterrupted run (byte-identical chains, acceptance counts and step count)', async () => {
    const uninterrupted = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    await uninterrupted.advance(150);

    const first = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    await first.advance(70);
    const resumed = await EnsembleSampler.restore(throughJson(first.snapshot()), createInProcessEvaluator(model));
    expect(resumed.stepCount).toBe(70);
    await resumed.advance(30);
    const again = await EnsembleSampler.restore(resumed.snapshot(), createInProcessEvaluator(model)); // typed-array snapshot too
    await again.advance(50);

    expect(again.stepCount).toBe(150);
    for (let k = 0; k < 3; k++) {
      const expected = uninterrupted.chain(k);
      const found = again.chain(k);
      expect(sameBytes(found.positions, expected.positions)).toBe(true);
      expect(sameBytes(found.logProb, expected.logProb)).toBe(true);
      expect(sameBytes(found.blobs, expected.blobs)).toBe(true);
      expect(sameBytes(again.acceptanceFractions(k), uninterrupted.acceptanceFractions(k))).toBe(true);
      expect(sameBytes(again.currentPositions(k), uninterrupted.currentPositions(k))).toBe(true);
    }
  });

  it('round-trips through JSON without losing a bit (every stored number is finite)', async () => {
    const sampler = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    await sampler.advance(20);
    const snapshot = sampler.snapshot();
    const parsed = throughJson(snapshot);
    expect(sameBytes(Float64Array.from(parsed.ensembles[2].chainPositions), snapshot.ensembles[2].chainPositions)).toBe(true);
    expect(parsed.ensembles[1].randomState).toEqual(snapshot.ensembles[1].randomState);
    expect(parsed.options).toEqual({ dimension: 2, walkers: 6, ensembles: 3, seed: 'checkpoint', stretchScale: 2, differentialEvolutionWeight: 0.3 });
  });

  it('refuses a snapshot whose arrays do not fit, naming every bad field', async () => {
    const sampler = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    await sampler.advance(5);
    const broken = throughJson(sampler.snapshot());
    broken.ensembles[1].chainLogProb.pop();
    broken.ensembles[2].positions.push(0);
    expect(() => checkSnapshotShape(broken, 2)).toThrow(/does not fit/);
    await expect(EnsembleSampler.restore(broken, createInProcessEvaluator(model))).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) &&
      error.issues.map((issue) => issue.path).join(' ') === 'ensembles[1].chainLogProb ensembles[2].positions');
  });

  it('refuses a snapshot from a model with a different blob count', async () => {
    const sampler = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    const otherModel = createInProcessEvaluator({ dimension: 2, blobCount: 0, evaluate: () => 0 });
    await expect(EnsembleSampler.restore(sampler.snapshot(), otherModel)).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues.some((issue) => issue.path === 'blobCount'));
  });
});

describe('EnsembleSampler.snapshot', () => {
  it('is not changed by later advances (views of append-only storage, copies of the live state)', async () => {
    const sampler = await EnsembleSampler.start(options, createInProcessEvaluator(model), starts());
    await sampler.advance(10);
    const snapshot = sampler.snapshot();
    const frozen = throughJson(snapshot);
    await sampler.advance(200); // forces the chain storage to grow past its initial 64 steps
    expect(throughJson(snapshot)).toEqual(frozen);
    expect(snapshot.ensembles[0].chainLogProb).toHaveLength(10 * 6);
  });
});
