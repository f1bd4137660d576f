import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { runNestedSampling } from '../../../src/sampler/index.js';
import type { NestedOptions, NestedProblem, NestedResult } from '../../../src/sampler/index.js';
import { axisGaussianLogLikelihood, boxPrior, correlatedGaussianLogLikelihood, twoModeLogLikelihood } from './support/gaussianProblems.js';

/*
 * Evidence of a normalized Gaussian likelihood under a uniform prior on a box
 * of volume V: Z = (Gaussian mass inside the box) / V. For an axis-aligned
 * Gaussian the mass is prod_i [Phi((b - mu_i)/s_i) - Phi((a - mu_i)/s_i)]
 * (the erf form); values below were computed with scipy 1.17.1
 * scipy.stats.norm.cdf and multivariate_normal.cdf. A run passes when
 * |ln Z - truth| < 3 x its reported sqrt(H/N) error (Skilling 2006), which
 * fails by chance about 0.3% of the time per check; seeds are fixed labels,
 * never tuned (40-seed statistics are in test/validation/nested.test.ts).
 */
const ERROR_MULTIPLE = 3;

function run(problem: NestedProblem, overrides: Partial<NestedOptions> = {}): NestedResult {
  return runNestedSampling(problem, { livePoints: 200, maxUnexploredLnZ: 0.05, maxIterations: 200_000, seed: 'nested-test', ...overrides });
}

function sumOfWeights(result: NestedResult, select: (row: number) => boolean = () => true): number {
  let sum = 0;
  for (let row = 0; row < result.logWeights.length; row++) if (select(row)) sum += Math.exp(result.logWeights[row]);
  return sum;
}

describe('runNestedSampling', () => {
  it('finds ln Z of a correlated 2-D Gaussian inside a box that holds all its mass (ln Z = -ln 400)', () => {
    // Box [-10, 10]^2, mean (1, -0.5), s = (1, 1.5), rho = 0.8: mass inside 1 - 1.2e-10
    // (scipy multivariate_normal.cdf), so ln Z = -ln 400 = -5.991464547107982.
    const truth = -5.991464547107982;
    const result = run({ dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: correlatedGaussianLogLikelihood([1, -0.5], 1, 1.5, 0.8) });
    expect(Math.abs(result.logZ - truth)).toBeLessThan(ERROR_MULTIPLE * result.logZError);
    expect(result.stopReason).toBe('evidence_settled');
    expect(result.remainingLogZ).toBeLessThan(0.05);
    // Skilling (2006): about N x H iterations are needed; sqrt(H/N) must be the reported error.
    expect(result.logZError).toBeCloseTo(Math.sqrt(result.information / 200), 12);
    expect(result.iterations).toBeGreaterThan(200 * result.information);
  });

  it('finds ln Z of a 5-D Gaussian cut by the prior box (erf masses, scipy 1.17.1: ln Z = -11.702351632653556)', () => {
    // Box [-5, 5]^5; mean (0, 1, -2, 4, 0.5), s = (1, 0.5, 1, 1, 2). Masses inside per axis
    // (scipy.stats.norm.cdf): 0.99999943, 1 - 7e-16, 0.99865010, 0.84134475, 0.98479576; minus 5 ln 10.
    const truth = -11.702351632653556;
    const problem = { dimension: 5, priorTransform: boxPrior(5, -5, 5), logLikelihood: axisGaussianLogLikelihood([0, 1, -2, 4, 0.5], [1, 0.5, 1, 1, 2]) };
    const result = run(problem, { seed: 'five-d' });
    expect(Math.abs(result.logZ - truth)).toBeLessThan(ERROR_MULTIPLE * result.logZError);
    // Posterior mean of the 4th parameter: truncated normal mean 4 - phi(1)/Phi(1) = 3.712421 (common practice; phi(1)/Phi(1) = 0.287579).
    let mean = 0;
    for (let row = 0; row < result.logWeights.length; row++) mean += Math.exp(result.logWeights[row]) * result.samples[row * 5 + 3];
    expect(Math.abs(mean - 3.712421)).toBeLessThan(0.05);
  });

  it('finds both modes of a two-Gaussian mixture with half the posterior weight each and the right evidence', () => {
    // Equal mixture of N((-4,-4), 0.5^2 I) and N((4,4), 0.5^2 I), normalized, box [-10,10]^2: ln Z = -ln 400.
    // Each mode's weight should be 0.5 by symmetry; its run-to-run scatter measured over 40 seeds with
    // N = 200 is 0.018 (test/validation/nested.test.ts), so 0.08 is more than 4 times that.
    const truth = -5.991464547107982;
    const result = run({ dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: twoModeLogLikelihood(4, 0.5) }, { seed: 'two-modes' });
    expect(Math.abs(result.logZ - truth)).toBeLessThan(ERROR_MULTIPLE * result.logZError);
    const lowerMode = sumOfWeights(result, (row) => result.samples[2 * row] < 0);
    expect(Math.abs(lowerMode - 0.5)).toBeLessThan(0.08);
    // Ellipsoids around each mode keep the replacement efficient; one ellipsoid over both would accept < 5%.
    expect(result.iterations / (result.likelihoodCalls - 200)).toBeGreaterThan(0.3);
  });

  it('treats -Infinity as zero likelihood: a Gaussian cut in half has half the evidence (ln Z - ln 1/2)', () => {
    // Same 2-D Gaussian as above but L = 0 where theta_0 < 1 (its mean): Z = 0.5 / 400 exactly by symmetry.
    const gaussian = correlatedGaussianLogLikelihood([1, -0.5], 1, 1.5, 0);
    const truth = Math.log(0.5) - Math.log(400);
    const result = run({ dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: (x) => (x[0] < 1 ? -Infinity : gaussian(x)) }, { seed: 'half' });
    expect(Math.abs(result.logZ - truth)).toBeLessThan(ERROR_MULTIPLE * result.logZError);
    for (const value of result.logWeights) expect(Number.isNaN(value)).toBe(false);
  });

  it('returns normalized weights, matching array lengths and a Kish effective sample size between 1 and the row count', () => {
    const result = run({ dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: correlatedGaussianLogLikelihood([0, 0], 1, 1, 0.3) });
    const rows = result.iterations + 200;
    expect(result.samples.length).toBe(rows * 2);
    expect(result.logLikelihoods.length).toBe(rows);
    expect(result.logWeights.length).toBe(rows);
    expect(sumOfWeights(result)).toBeCloseTo(1, 12);
    expect(result.effectiveSampleSize).toBeGreaterThan(1);
    expect(result.effectiveSampleSize).toBeLessThan(rows);
    for (let row = 1; row < result.iterations; row++) expect(result.logLikelihoods[row]).toBeGreaterThanOrEqual(result.logLikelihoods[row - 1]);
  });

  it('is deterministic for a seed and changes with it', () => {
    const problem = { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: twoModeLogLikelihood(3, 0.7) };
    const first = run(problem, { livePoints: 60, seed: 'same' });
    const second = run(problem, { livePoints: 60, seed: 'same' });
    const other = run(problem, { livePoints: 60, seed: 'other' });
    expect(second.logZ).toBe(first.logZ);
    expect(second.likelihoodCalls).toBe(first.likelihoodCalls);
    expect(Array.from(second.samples)).toEqual(Array.from(first.samples));
    expect(other.logZ).not.toBe(first.logZ);
  });

  it('stops at maxIterations with stopReason "iterations" and reports progress every iteration', () => {
    const seen: number[] = [];
    const result = run(
      { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: correlatedGaussianLogLikelihood([0, 0], 1, 1, 0) },
      { maxIterations: 50 },
    );
    const withProgress = runNestedSampling(
      { dimension: 2, priorTransform: boxPrior(2, -10, 10), logLikelihood: correlatedGaussianLogLikelihood([0, 0], 1, 1, 0) },
      { livePoints: 200, maxUnexploredLnZ: 0.05, maxIterations: 50, seed: 'nested-test' },
      (iteration, logZ, remaining) => {
        expect(Number.isFinite(logZ)).toBe(true);
        expect(remaining).toBeGreaterThan(0);
        seen.push(iteration);
      },
    );
    expect(result.stopReason).toBe('iterations');
    expect(result.iterations).toBe(50);
    expect(result.remainingLogZ).toBeGreaterThan(0.05);
    expect(seen).toEqual(Array.from({ length: 50 }, (_, k) => k + 1));
    expect(withProgress.logZ).toBe(result.logZ);
  });

  it('throws sampler.invalid_option for every bad option at once', () => {
    const problem = { dimension: 3, priorTransform: boxPrior(3, 0, 1), logLikelihood: () => 0 };
    try {
      runNestedSampling(problem, { livePoints: 5, maxUnexploredLnZ: 0, maxIterations: 1.5, seed: '', enlargement: 0.5 });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error)).toBe(true);
      const paths = (error as { issues: Array<{ code: string; path: string }> }).issues.map((issue) => `${issue.code}:${issue.path}`);
      expect(paths).toEqual(['livePoints', 'maxUnexploredLnZ', 'maxIterations', 'seed', 'enlargement'].map((path) => `sampler.invalid_option:${path}`));
    }
  });

  it('throws sampler.nested_invalid_likelihood when the log-likelihood returns NaN', () => {
    const problem = { dimension: 1, priorTransform: boxPrior(1, 0, 1), logLikelihood: (x: Float64Array) => (x[0] > 0.9 ? Number.NaN : -x[0]) };
    expect(() => run(problem, { livePoints: 50 })).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'sampler.nested_invalid_likelihood' })] }));
  });

  it('throws sampler.nested_zero_evidence when the likelihood is zero everywhere', () => {
    const problem = { dimension: 1, priorTransform: boxPrior(1, 0, 1), logLikelihood: () => -Infinity };
    expect(() => run(problem, { livePoints: 10, maxIterations: 20 })).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'sampler.nested_zero_evidence' })] }));
  });
});
