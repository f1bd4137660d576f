import { describe, expect, it } from 'vitest';
import { runNestedSampling } from '../../src/sampler/index.js';
import type { NestedProblem } from '../../src/sampler/index.js';
import { axisGaussianLogLikelihood, boxPrior, correlatedGaussianLogLikelihood, twoModeLogLikelihood } from '../sampler/nested/support/gaussianProblems.js';

/*
 * Statistical validation of nested sampling against analytic evidences of
 * Gaussian likelihoods in uniform prior boxes (Z = Gaussian mass inside the box
 * / box volume; masses from scipy 1.17.1 scipy.stats.norm.cdf). Over many
 * seeds the pulls (ln Z - truth) / logZError should have mean ~0 and spread
 * ~1 if sqrt(H/N) (Skilling 2006) is an honest error. Set CANDELA_VERBOSE=1 to
 * print the measured statistics.
 */

interface Case {
  name: string;
  problem: NestedProblem;
  truth: number;
}

const CASES: Case[] = [
  { name: '2-D correlated Gaussian', problem: { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: correlatedGaussianLogLikelihood([1, -0.5], 1, 1.5, 0.8) }, truth: -5.991464547107982 },
  { name: '5-D truncated Gaussian', problem: { dimension: 5, priorTransform: boxPrior(5, -5, 5), logLikelihood: axisGaussianLogLikelihood([0, 1, -2, 4, 0.5], [1, 0.5, 1, 1, 2]) }, truth: -11.702351632653556 },
  { name: '2-D two modes', problem: { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: twoModeLogLikelihood(4, 0.5) }, truth: -5.991464547107982 },
  // 10-D isotropic Gaussian, sigma = 0.5, means -1 + 0.3 i, well inside [-5, 5]^10: ln Z = -10 ln 10 (mass 1 - 1e-15).
  { name: '10-D Gaussian', problem: { dimension: 10, priorTransform: boxPrior(10, -5, 5), logLikelihood: axisGaussianLogLikelihood(Array.from({ length: 10 }, (_, i) => -1 + 0.3 * i), new Array(10).fill(0.5)) }, truth: -10 * Math.log(10) },
];

function pullStatistics(test: Case, seeds: number, livePoints: number): { mean: number; spread: number; calls: number; milliseconds: number; modeWeights: number[] } {
  const pulls: number[] = [];
  const modeWeights: number[] = [];
  let calls = 0;
  const start = performance.now();
  for (let s = 0; s < seeds; s++) {
    const result = runNestedSampling(test.problem, { livePoints, maxUnexploredLnZ: 0.05, maxIterations: 1_000_000, seed: `validate/${test.name}/${s}` });
    pulls.push((result.logZ - test.truth) / result.logZError);
    calls += result.likelihoodCalls;
    let lower = 0;
    for (let row = 0; row < result.logWeights.length; row++) if (result.samples[row * test.problem.dimension] < 0) lower += Math.exp(result.logWeights[row]);
    modeWeights.push(lower);
  }
  const mean = pulls.reduce((sum, value) => sum + value, 0) / seeds;
  const spread = Math.sqrt(pulls.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (seeds - 1));
  const summary = { mean, spread, calls: calls / seeds, milliseconds: (performance.now() - start) / seeds, modeWeights };
  if (process.env.CANDELA_VERBOSE) console.log(test.name, JSON.stringify({ ...summary, modeWeights: undefined }));
  return summary;
}

describe('nested sampling evidence, fast subset', () => {
  it('is unbiased on the 2-D correlated Gaussian over 6 seeds (mean pull within 3 / sqrt(6))', () => {
    const { mean } = pullStatistics(CASES[0], 6, 100);
    expect(Math.abs(mean)).toBeLessThan(3 / Math.sqrt(6));
  });
});

describe.skipIf(!process.env.CANDELA_VALIDATE)('nested sampling evidence over 40 seeds (CANDELA_VALIDATE)', () => {
  for (const test of CASES) {
    it(`${test.name}: pulls have mean 0 (within 3 / sqrt(n)) and spread between 0.5 and 1.5`, () => {
      const seeds = test.problem.dimension >= 10 ? 12 : 40;
      const { mean, spread, modeWeights } = pullStatistics(test, seeds, 200);
      expect(Math.abs(mean)).toBeLessThan(3 / Math.sqrt(seeds));
      expect(spread).toBeGreaterThan(0.5);
      expect(spread).toBeLessThan(1.5);
      if (test.name === '2-D two modes') {
        const average = modeWeights.reduce((sum, value) => sum + value, 0) / seeds;
        const scatter = Math.sqrt(modeWeights.reduce((sum, value) => sum + (value - average) ** 2, 0) / (seeds - 1));
        if (process.env.CANDELA_VERBOSE) console.log('mode weight', average, scatter);
        expect(Math.abs(average - 0.5)).toBeLessThan((3 * scatter) / Math.sqrt(seeds) + 0.01);
        expect(scatter).toBeLessThan(0.1);
      }
    });
  }
});
