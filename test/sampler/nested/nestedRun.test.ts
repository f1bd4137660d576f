import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { NestedRun, runNestedSampling } from '../../../src/sampler/index.js';
import type { NestedOptions, NestedResult } from '../../../src/sampler/index.js';
import { boxPrior, twoModeLogLikelihood } from './support/gaussianProblems.js';

// Slicing a run into bounded numbers of likelihood calls (what lets `candela fit` notice Ctrl-C during nested
// sampling) must not change a single bit of its result: an identity of the implementation, checked on the two-mode
// problem of runNestedSampling.test.ts, whose bounds split and rebuild many times.
const problem = { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: twoModeLogLikelihood(4, 0.5) };
const options: NestedOptions = { livePoints: 100, maxUnexploredLnZ: 0.1, maxIterations: 100_000, seed: 'sliced' };

function sameResult(found: NestedResult, expected: NestedResult): void {
  const bytes = (array: Float64Array) => Buffer.from(array.buffer, array.byteOffset, array.byteLength);
  expect([found.logZ, found.logZError, found.iterations, found.likelihoodCalls, found.stopReason, found.remainingLogZ])
    .toEqual([expected.logZ, expected.logZError, expected.iterations, expected.likelihoodCalls, expected.stopReason, expected.remainingLogZ]);
  for (const key of ['samples', 'logLikelihoods', 'logWeights'] as const) expect(bytes(found[key]).equals(bytes(expected[key])), key).toBe(true);
}

describe('NestedRun', () => {
  it('gives the result of runNestedSampling bit for bit however its likelihood calls are sliced, never exceeding a slice', () => {
    const whole = runNestedSampling(problem, options);
    for (const budget of [1, 7, 250]) {
      const run = new NestedRun(problem, options);
      let slices = 0;
      for (;;) {
        const before = run.likelihoodCalls;
        const done = run.advance(budget);
        expect(run.likelihoodCalls - before).toBeLessThanOrEqual(budget);
        slices++;
        if (done) break;
      }
      expect(slices).toBeGreaterThanOrEqual(Math.floor(whole.likelihoodCalls / budget));
      sameResult(run.result(), whole);
    }
  });

  it('has no result before it finishes, and reports its errors from advance', () => {
    const run = new NestedRun(problem, options);
    run.advance(10);
    expect(() => run.result()).toThrow(/not finished/);
    const broken = new NestedRun({ ...problem, logLikelihood: () => Number.NaN }, options);
    let code = '';
    try { broken.advance(5); } catch (error) { code = isCandelaError(error) ? error.issues[0].code : String(error); }
    expect(code).toBe('sampler.nested_invalid_likelihood');
  });
});
