import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { EnsembleSampler, createInProcessEvaluator, resolveEnsembleOptions, type LogProbabilityModel } from '../../src/sampler/index.js';

describe('EnsembleSampler with ensembleIndices', () => {
  // A two-dimensional standard normal: any target shows the stream bookkeeping; the identity checked is exact.
  const model: LogProbabilityModel = {
    dimension: 2, blobCount: 0,
    evaluate: (theta) => -0.5 * (theta[0] * theta[0] + theta[1] * theta[1]),
  };
  const start = (k: number) => Float64Array.from({ length: 8 }, (_, i) => 0.1 * Math.sin(3 * i + k) + 0.01 * i);

  it('reproduces ensemble k of a full run bit for bit when it holds only ensemble k', async () => {
    const full = await EnsembleSampler.start({ dimension: 2, walkers: 4, ensembles: 3, seed: 'part-check' }, createInProcessEvaluator(model), [start(0), start(1), start(2)]);
    await full.advance(60);
    const alone = await EnsembleSampler.start({ dimension: 2, walkers: 4, ensembleIndices: [2], seed: 'part-check' }, createInProcessEvaluator(model), [start(2)]);
    await alone.advance(60);
    expect(alone.options.ensembles).toBe(1);
    expect(Array.from(alone.chain(0).positions)).toEqual(Array.from(full.chain(2).positions));
    expect(Array.from(alone.chain(0).positions)).not.toEqual(Array.from(full.chain(0).positions.subarray(0, 60 * 8)));
  });

  it('refuses repeated, negative or miscounted ensemble indices', () => {
    for (const ensembleIndices of [[1, 1], [-1], [0.5]]) {
      expect(() => resolveEnsembleOptions({ dimension: 2, walkers: 4, seed: '1', ensembleIndices })).toThrow();
    }
    try {
      resolveEnsembleOptions({ dimension: 2, walkers: 4, ensembles: 3, seed: '1', ensembleIndices: [0, 1] });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].path).toBe('ensembleIndices');
    }
  });
});
