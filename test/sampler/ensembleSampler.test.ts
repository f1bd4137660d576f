import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator, initializeWalkers } from '../../src/sampler/index.js';
import type { BatchEvaluator, EnsembleRunOptions, LogProbabilityModel } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';
import { checkExpectations, describeCheck } from './support/chainStatistics.js';
import type { ExpectationCheck } from './support/chainStatistics.js';
import { covarianceFromEigen, fixedRotation, planeRotation } from './support/gaussianTargets.js';

/*
 * Tolerances. Every expectation E[f] is estimated from the post-burn-in
 * chains of all ensembles; its Monte Carlo standard error (MCSE) comes from
 * batch means (Flegal, Haran & Jones 2008), 10 batches per ensemble, so 40
 * batch means and a t distribution with 39 degrees of freedom. A deviation
 * beyond 4 MCSE has probability about 3e-4 per quantity, about 1e-2 for the
 * 35 quantities of this file together. Batch means are only trustworthy when
 * a batch spans many autocorrelation times; each check therefore also
 * asserts batch length >= MIN_BATCH_OVER_TAU x tau, with tau from Sokal's
 * adaptive window (the batch-means variance is then biased low by at most
 * ~tau/batch ~ 20%). Run lengths were chosen from the expected tau before
 * the first run; seeds are arbitrary labels, never changed to make a test pass.
 */
const MCSE_TOLERANCE = 4;
const MIN_BATCH_OVER_TAU = 5;
const BATCHES_PER_ENSEMBLE = 10;

function expectWithinMcse(checks: ExpectationCheck[]): void {
  for (const check of checks) {
    expect(check.estimate.batchLength, describeCheck(check)).toBeGreaterThanOrEqual(MIN_BATCH_OVER_TAU * check.tauSteps);
    expect(Math.abs(check.estimate.mean - check.truth), describeCheck(check)).toBeLessThanOrEqual(MCSE_TOLERANCE * check.estimate.standardError);
  }
}

/** Expectations of x_i (truth mean_i) and (x_i - mean_i)(x_j - mean_j) (truth covariance_ij) for a normal target. */
function gaussianExpectations(mean: number[], covariance: Float64Array) {
  const n = mean.length;
  const list: Array<{ label: string; truth: number; f: (x: Float64Array) => number }> = [];
  for (let i = 0; i < n; i++) list.push({ label: `mean ${i}`, truth: mean[i], f: (x) => x[i] });
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) list.push({ label: `covariance ${i},${j}`, truth: covariance[i * n + j], f: (x) => (x[i] - mean[i]) * (x[j] - mean[j]) });
  }
  return list;
}

async function runFromMode(model: LogProbabilityModel, options: EnsembleRunOptions, startSpread: number, steps: number): Promise<EnsembleSampler> {
  const evaluator = createInProcessEvaluator(model);
  const start = await initializeWalkers({
    walkers: options.walkers, ensembles: options.ensembles, seed: options.seed,
    sampleStart: (rng, out) => { for (let i = 0; i < out.length; i++) out[i] = startSpread * rng.normal(); },
  }, evaluator);
  const sampler = await EnsembleSampler.start(options, evaluator, start.positions);
  await sampler.advance(steps);
  return sampler;
}

const chainsOf = (sampler: EnsembleSampler) => Array.from({ length: sampler.options.ensembles }, (_, k) => sampler.chain(k));

describe('EnsembleSampler on Gaussian targets (mean and covariance are the distribution parameters)', () => {
  it('reproduces mean and covariance of a rotated 2-D Gaussian with condition number 1e4 (stretch move)', async () => {
    // Covariance: eigenvalues 100 and 0.01 (condition number 1e4), axes rotated by 30 degrees.
    const mean = [1, -2];
    const covariance = covarianceFromEigen(planeRotation(Math.PI / 6), [100, 0.01]);
    const model = createGaussianTarget({ mean, covariance: Array.from(covariance) });
    const sampler = await runFromMode(model, { dimension: 2, walkers: 16, seed: 'gaussian-2d' }, 10, 9000);
    expectWithinMcse(checkExpectations(chainsOf(sampler), 1000, BATCHES_PER_ENSEMBLE, 1, gaussianExpectations(mean, covariance)));
  });

  it('reproduces mean and covariance of a rotated 6-D Gaussian with condition number 1e4 (stretch move)', async () => {
    // Eigenvalues 10^(-2 + 4k/5), k = 0..5: condition number 1e4; eigenvectors from a fixed rotation.
    const mean = [1, -2, 3, 0.5, -1, 2];
    const covariance = covarianceFromEigen(fixedRotation(6), [0, 1, 2, 3, 4, 5].map((k) => 10 ** (-2 + (4 * k) / 5)));
    const model = createGaussianTarget({ mean, covariance: Array.from(covariance) });
    const sampler = await runFromMode(model, { dimension: 6, walkers: 16, seed: 'gaussian-6d' }, 10, 16000);
    expectWithinMcse(checkExpectations(chainsOf(sampler), 2000, BATCHES_PER_ENSEMBLE, 4, gaussianExpectations(mean, covariance)));
  });

  it('stays correct with the differential-evolution move mixed in and an odd walker count', async () => {
    // Same 2-D target; 9 walkers (halves of 4 and 5), half of the proposals by differential evolution (ter Braak 2006).
    const mean = [1, -2];
    const covariance = covarianceFromEigen(planeRotation(Math.PI / 6), [100, 0.01]);
    const model = createGaussianTarget({ mean, covariance: Array.from(covariance) });
    const sampler = await runFromMode(model, { dimension: 2, walkers: 9, seed: 'gaussian-mixed', differentialEvolutionWeight: 0.5 }, 10, 9000);
    expectWithinMcse(checkExpectations(chainsOf(sampler), 1000, BATCHES_PER_ENSEMBLE, 1, gaussianExpectations(mean, covariance)));
  });

  it('stays correct with the differential-evolution move alone', async () => {
    const mean = [0.5, 0.25];
    const covariance = covarianceFromEigen(planeRotation(-Math.PI / 5), [4, 0.04]);
    const model = createGaussianTarget({ mean, covariance: Array.from(covariance) });
    const sampler = await runFromMode(model, { dimension: 2, walkers: 12, seed: 'gaussian-de', differentialEvolutionWeight: 1 }, 3, 9000);
    expectWithinMcse(checkExpectations(chainsOf(sampler), 1000, BATCHES_PER_ENSEMBLE, 1, gaussianExpectations(mean, covariance)));
  });
});

/**
 * Twisted ("banana") Gaussian of Haario, Saksman & Tamminen (1999,
 * Computational Statistics 14, 375), formula from memory: density
 * proportional to exp(-x1^2 / 200 - (x2 + b x1^2 - 100 b)^2 / 2), b = 0.03.
 */
const TWIST = 0.03;
const twistedGaussian: LogProbabilityModel = {
  dimension: 2,
  blobCount: 0,
  evaluate(theta) {
    const y = theta[1] + TWIST * theta[0] * theta[0] - 100 * TWIST;
    return -(theta[0] * theta[0]) / 200 - (y * y) / 2;
  },
};

/** Composite Simpson weights for `intervals` (even) equal intervals of width h. */
function simpsonWeight(index: number, intervals: number, h: number): number {
  if (index === 0 || index === intervals) return h / 3;
  return ((index % 2 === 1 ? 4 : 2) * h) / 3;
}

/**
 * Moments of the twisted Gaussian by grid integration: composite Simpson in
 * x1 over +-12 sigma (sigma = 10) and, for each x1, in x2 over +-12 around
 * the ridge x2 = 100 b - b x1^2 (the density is negligible beyond).
 */
function twistedGaussianGridMoments(): { meanX1: number; meanX2: number; varianceX1: number; varianceX2: number } {
  const outer = 2400;
  const inner = 480;
  const h1 = 240 / outer;
  const h2 = 24 / inner;
  let z = 0, s1 = 0, s2 = 0, s11 = 0, s22 = 0;
  for (let i = 0; i <= outer; i++) {
    const x1 = -120 + i * h1;
    const ridge = 100 * TWIST - TWIST * x1 * x1;
    for (let j = 0; j <= inner; j++) {
      const x2 = ridge - 12 + j * h2;
      const weight = simpsonWeight(i, outer, h1) * simpsonWeight(j, inner, h2) * Math.exp(twistedGaussian.evaluate(Float64Array.of(x1, x2), new Float64Array(0), 0));
      z += weight; s1 += weight * x1; s2 += weight * x2; s11 += weight * x1 * x1; s22 += weight * x2 * x2;
    }
  }
  const meanX1 = s1 / z;
  const meanX2 = s2 / z;
  return { meanX1, meanX2, varianceX1: s11 / z - meanX1 ** 2, varianceX2: s22 / z - meanX2 ** 2 };
}

describe('EnsembleSampler on a banana-shaped target', () => {
  it('matches grid-integrated marginal means and variances of the twisted Gaussian (Haario et al. 1999, b = 0.03)', async () => {
    const grid = twistedGaussianGridMoments();
    // Cross-check of the grid itself against the closed form: x1 ~ N(0, 100) and x2 = y - b x1^2 + 100 b with
    // y ~ N(0, 1), so E x2 = 0 and Var x2 = 1 + b^2 Var(x1^2) = 1 + 2 b^2 100^2 = 19 (normal moments, by hand).
    expect(grid.meanX1).toBeCloseTo(0, 9);
    expect(grid.varianceX1).toBeCloseTo(100, 6);
    expect(grid.meanX2).toBeCloseTo(0, 8);
    expect(grid.varianceX2).toBeCloseTo(1 + 2 * TWIST ** 2 * 1e4, 6);
    // tau of the walker averages is ~100-300 steps here, so 40000 steps give batches of 4000 >> 5 tau.
    const sampler = await runFromMode(twistedGaussian, { dimension: 2, walkers: 16, seed: 'banana' }, 10, 43000);
    expectWithinMcse(checkExpectations(chainsOf(sampler), 3000, BATCHES_PER_ENSEMBLE, 4, [
      { label: 'mean x1', truth: grid.meanX1, f: (x) => x[0] },
      { label: 'mean x2', truth: grid.meanX2, f: (x) => x[1] },
      { label: 'variance x1', truth: grid.varianceX1, f: (x) => (x[0] - grid.meanX1) ** 2 },
      { label: 'variance x2', truth: grid.varianceX2, f: (x) => (x[1] - grid.meanX2) ** 2 },
    ]));
  });
});

describe('EnsembleSampler bookkeeping', () => {
  const standardNormal = createGaussianTarget({ mean: [0, 0, 0], covariance: [1, 0, 0, 0, 1, 0, 0, 0, 1] });
  const ball = (label: number, walkers: number) => {
    const rng = createRandomStream(`ball-${label}`);
    return Float64Array.from({ length: walkers * 3 }, () => rng.normal());
  };

  it('counts acceptances exactly as the stored positions change, and stores blobs of the accepted points', async () => {
    const sampler = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 2, seed: 'book' }, createInProcessEvaluator(standardNormal), [ball(0, 8), ball(1, 8)]);
    const seen: number[] = [];
    await sampler.advance(200, (step) => { seen.push(step); });
    expect(seen).toEqual(Array.from({ length: 200 }, (_, i) => i + 1));
    expect(sampler.stepCount).toBe(200);
    const chain = sampler.chain(1);
    expect([chain.steps, chain.walkers, chain.dimension, chain.blobCount]).toEqual([200, 8, 3, 2]);
    const fractions = sampler.acceptanceFractions(1);
    for (let w = 0; w < 8; w++) {
      let moves = 0;
      let previous = ball(1, 8).slice(w * 3, w * 3 + 3);
      for (let s = 0; s < 200; s++) {
        const here = chain.positions.slice((s * 8 + w) * 3, (s * 8 + w + 1) * 3);
        if (here.some((v, k) => v !== previous[k])) moves += 1;
        previous = here;
        // Blob 0 is the log density, blob 1 the coordinate sum (see the fixture).
        expect(chain.blobs[(s * 8 + w) * 2]).toBe(chain.logProb[s * 8 + w]);
        expect(chain.blobs[(s * 8 + w) * 2 + 1]).toBeCloseTo(here[0] + here[1] + here[2], 12);
      }
      expect(fractions[w]).toBe(moves / 200);
    }
  });

  it('stops advancing after the step at which onStep returns false, and continues later', async () => {
    const sampler = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 1, seed: 'stop' }, createInProcessEvaluator(standardNormal), [ball(0, 8)]);
    await sampler.advance(100, (step) => step < 7);
    expect([sampler.stepCount, sampler.chain(0).steps]).toEqual([7, 7]);
    await sampler.advance(3);
    expect(sampler.stepCount).toBe(10);
  });

  it('refuses fewer than 2 x dimension walkers with a CandelaError naming the minimum', async () => {
    const evaluator = createInProcessEvaluator(standardNormal);
    const attempt = EnsembleSampler.start({ dimension: 3, walkers: 5, seed: 'x' }, evaluator, [ball(0, 5)]);
    await expect(attempt).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.too_few_walkers' && error.issues[0].expected === '>= 6');
  });

  it('refuses walkers that all sit on one line (the ensemble could never leave it)', async () => {
    const line = Float64Array.from({ length: 24 }, (_, i) => Math.floor(i / 3) * (1 + (i % 3)));
    const attempt = EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 1, seed: 'x' }, createInProcessEvaluator(standardNormal), [line]);
    await expect(attempt).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].code === 'sampler.degenerate_start');
  });

  it('refuses a start where a walker has -Infinity log posterior', async () => {
    const bounded = createGaussianTarget({ mean: [0, 0, 0], covariance: [1, 0, 0, 0, 1, 0, 0, 0, 1], upperBound: 0.5 });
    const attempt = EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 1, seed: 'x' }, createInProcessEvaluator(bounded), [ball(0, 8)]);
    await expect(attempt).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].code === 'sampler.invalid_start');
  });

  it('stops with sampler.invalid_log_probability when the model returns NaN', async () => {
    let calls = 0;
    const broken: BatchEvaluator = createInProcessEvaluator({ dimension: 3, blobCount: 0, evaluate: () => (++calls > 40 ? NaN : 0) });
    const sampler = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 2, seed: 'x' }, broken, [ball(0, 8), ball(1, 8)]);
    await expect(sampler.advance(10)).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].code === 'sampler.invalid_log_probability');
  });

  it('refuses a second advance while one is running', async () => {
    const sampler = await EnsembleSampler.start({ dimension: 3, walkers: 8, ensembles: 1, seed: 'x' }, createInProcessEvaluator(standardNormal), [ball(0, 8)]);
    const first = sampler.advance(20);
    await expect(sampler.advance(1)).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].code === 'sampler.busy');
    await first;
    expect(sampler.stepCount).toBe(20);
  });
});
