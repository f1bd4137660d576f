import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createInProcessEvaluator, initializeWalkers } from '../../src/sampler/index.js';
import type { LogProbabilityModel, WalkerStartOptions } from '../../src/sampler/index.js';
import { createGaussianTarget } from './fixtures/gaussianTarget.mjs';
import { sameBytes } from './support/chainStatistics.js';

const wideStart = (spread: number): WalkerStartOptions['sampleStart'] => (rng, out) => {
  for (let i = 0; i < out.length; i++) out[i] = spread * rng.normal();
};

// Correlated 3-D normal. Its precision matrix (inverse covariance) was inverted by hand:
// covariance [[4, 1.2, 0], [1.2, 1, 0.3], [0, 0.3, 0.25]] has determinant 4 x 0.16 - 1.2 x 0.3 = 0.28 and
// inverse diagonal = cofactors / determinant = (0.25 - 0.09, 1, 4 - 1.44) / 0.28 = (0.5714..., 3.5714..., 9.1428...).
const MEAN = [2, -1, 0.5];
const COVARIANCE = [4, 1.2, 0, 1.2, 1, 0.3, 0, 0.3, 0.25];
const PRECISION_DIAGONAL = [0.16 / 0.28, 1 / 0.28, 2.56 / 0.28];

describe('initializeWalkers', () => {
  it('finds the mode of a correlated Gaussian and its conditional widths 1 / sqrt(precision_ii)', async () => {
    const evaluator = createInProcessEvaluator(createGaussianTarget({ mean: MEAN, covariance: COVARIANCE }));
    const start = await initializeWalkers({ walkers: 32, seed: 'mode', sampleStart: wideStart(5) }, evaluator);
    // Nelder-Mead stops when the simplex is within 1e-6 of its initial steps (0.1 x the start spread ~ 0.5)
    // and the log posterior spread is below 1e-8, so the mode is good to ~1e-4 of the posterior widths.
    start.mode.forEach((value, i) => expect(Math.abs(value - MEAN[i])).toBeLessThan(1e-4));
    expect(start.modeLogProb).toBeGreaterThan(-1e-8); // the log density is 0 at the mean
    // Second differences of a quadratic are exact up to rounding (about 1e-12 relative here).
    start.widths.forEach((width, i) => expect(width).toBeCloseTo(1 / Math.sqrt(PRECISION_DIAGONAL[i]), 8));
    expect(start.optimizer).toMatchObject({ searches: 4, converged: 4 });
    expect(start.positions).toHaveLength(4);
  });

  it('draws each ensemble from a Gaussian ball of radius ballScale x width around the mode', async () => {
    const evaluator = createInProcessEvaluator(createGaussianTarget({ mean: MEAN, covariance: COVARIANCE }));
    const start = await initializeWalkers({ walkers: 32, seed: 'ball', sampleStart: wideStart(5), ballScale: 0.5 }, evaluator);
    const all = start.positions.flatMap((positions) => Array.from({ length: 32 }, (_, w) => positions.slice(3 * w, 3 * w + 3)));
    for (let i = 0; i < 3; i++) {
      const values = all.map((walker) => walker[i]);
      const mean = values.reduce((a, b) => a + b, 0) / values.length;
      const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) ** 2, 0) / (values.length - 1));
      const radius = 0.5 * start.widths[i];
      // 128 normal draws: the standard error of the mean is radius / sqrt(128), of the sd about radius / sqrt(256);
      // 4 standard errors allowed (normal sampling theory).
      expect(Math.abs(mean - start.mode[i])).toBeLessThan((4 * radius) / Math.sqrt(128));
      expect(Math.abs(sd - radius)).toBeLessThan((4 * radius) / Math.sqrt(256));
    }
  });

  it('is fully determined by the seed', async () => {
    const evaluator = createInProcessEvaluator(createGaussianTarget({ mean: MEAN, covariance: COVARIANCE }));
    const options: WalkerStartOptions = { walkers: 8, seed: 'same', sampleStart: wideStart(5) };
    const [a, b, c] = await Promise.all([initializeWalkers(options, evaluator), initializeWalkers(options, evaluator), initializeWalkers({ ...options, seed: 'other' }, evaluator)]);
    a.positions.forEach((positions, k) => expect(sameBytes(positions, b.positions[k])).toBe(true));
    expect(sameBytes(a.positions[0], c.positions[0])).toBe(false);
  });

  it('starts every walker inside the support when the mode sits on its boundary', async () => {
    // Exponential in x0 (x0 >= 0) times a normal of sd 0.25 in x1: the mode (0, 0) is on the edge x0 = 0.
    // (The start draws have sd ~1, so the cap of widths at the start-draw spread does not bind.)
    const halfSpace: LogProbabilityModel = { dimension: 2, blobCount: 0, evaluate: (t) => (t[0] < 0 ? -Infinity : -t[0] - 8 * t[1] * t[1]) };
    const start = await initializeWalkers({ walkers: 8, seed: 'edge', sampleStart: (rng, out) => { out[0] = -Math.log(1 - rng.uniform()); out[1] = rng.normal(); } }, createInProcessEvaluator(halfSpace));
    expect(start.mode[0]).toBeGreaterThanOrEqual(0);
    expect(start.mode[0]).toBeLessThan(1e-4);
    expect(start.widths[1]).toBeCloseTo(0.25, 8); // curvature of -8 x1^2 is exactly -16, width 1/4
    for (const positions of start.positions) for (let w = 0; w < 8; w++) expect(positions[2 * w]).toBeGreaterThanOrEqual(0);
  });

  it('fails with sampler.no_valid_start and the last rejection when no start draw has a finite log posterior', async () => {
    const nowhere: LogProbabilityModel = { dimension: 2, blobCount: 0, evaluate: () => -Infinity };
    const attempt = initializeWalkers({
      walkers: 4, seed: 'none', sampleStart: wideStart(1),
      describeRejection: (theta) => `Omega_m = ${theta[0].toFixed(2)} is outside the prior [0, 1]`,
    }, createInProcessEvaluator(nowhere));
    await expect(attempt).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.no_valid_start' &&
      /^no walker could be started with a finite log-posterior after 100 attempts; the last rejection: Omega_m = -?\d+\.\d\d is outside the prior \[0, 1\]$/.test(error.issues[0].message));
  });

  it('fails with sampler.no_valid_start when the start draws are valid but no walker of the ball is', async () => {
    // Finite only on the integer lattice: the draws (rounded) are valid, every continuous ball draw is not.
    const lattice: LogProbabilityModel = { dimension: 2, blobCount: 0, evaluate: (t) => (Number.isInteger(t[0]) && Number.isInteger(t[1]) ? 0 : -Infinity) };
    const attempt = initializeWalkers({ walkers: 4, seed: 'lattice', maxAttempts: 5, sampleStart: (rng, out) => { out[0] = Math.round(5 * rng.normal()); out[1] = Math.round(5 * rng.normal()); } }, createInProcessEvaluator(lattice));
    await expect(attempt).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.no_valid_start' && / after 5 attempts; /.test(error.issues[0].message));
  });

  it('refuses too few walkers before any evaluation', async () => {
    const evaluator = createInProcessEvaluator(createGaussianTarget({ mean: MEAN, covariance: COVARIANCE }));
    await expect(initializeWalkers({ walkers: 5, seed: 'x', sampleStart: wideStart(1) }, evaluator)).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'sampler.too_few_walkers');
  });
});
