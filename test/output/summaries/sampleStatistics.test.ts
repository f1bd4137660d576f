import { sampleCorrelation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { createRandomStream } from '../../../src/math/index.js';
import {
  highestDensityInterval, ONE_SIGMA_MASS, sampleStatistics, summarizePosterior, TWO_SIGMA_MASS, weightedCorrelationMatrix,
} from '../../../src/output/index.js';
import { VALUES, OTHER, WEIGHTS, normalSample } from '../../math/statistics/referenceSample.js';

function exponentialSample(seed: string, count: number): Float64Array {
  const stream = createRandomStream(seed);
  return Float64Array.from({ length: count }, () => -Math.log(1 - stream.uniform()));
}

describe('weightedCorrelationMatrix', () => {
  it('matches R cov.wt(method = "unbiased") on a weighted sample', () => {
    // R 4.2.2 stats::cov.wt with weights / sum(weights) (make_summary_reference.R), to 1e-14 relative.
    expect(weightedCorrelationMatrix([VALUES, OTHER], WEIGHTS)[1]).toBeCloseTo(0.93886730577299693, 14);
  });

  it('matches simple-statistics sampleCorrelation without weights', () => {
    const x = normalSample('moments-x', 5000);
    const noise = normalSample('moments-noise', 5000);
    const y = x.map((value, i) => 0.6 * value + 0.8 * noise[i] + 3);
    const matrix = weightedCorrelationMatrix([x, y]);
    expect(matrix[0]).toBe(1);
    expect(matrix[1]).toBeCloseTo(sampleCorrelation(Array.from(x), Array.from(y)), 12);
    expect(matrix[2]).toBe(matrix[1]);
  });

  it('gives a constant column zero correlation instead of NaN', () => {
    const matrix = weightedCorrelationMatrix([[1, 2, 3], [5, 5, 5]]);
    expect(Array.from(matrix)).toEqual([1, 0, 0, 1]);
  });
});

describe('sampleStatistics of known distributions', () => {
  // Monte Carlo tolerance: 4 standard errors. Sample quantile: sqrt(p (1-p) / n) / f(q_p) (asymptotic
  // normality of sample quantiles, e.g. Stuart & Ord, Kendall's Advanced Theory of Statistics, ch. 10).
  const count = 100_000;
  const quantileTolerance = (p: number, densityAtQuantile: number): number => (4 * Math.sqrt((p * (1 - p)) / count)) / densityAtQuantile;
  const tail68 = (1 - ONE_SIGMA_MASS) / 2;
  const tail95 = (1 - TWO_SIGMA_MASS) / 2;
  const normalPdf = (x: number): number => Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);

  it('unit normal: mean 0, sd 1, median 0, 68.27% intervals [-1, 1], 95.45% interval [-2, 2]', () => {
    const stats = sampleStatistics(normalSample('normal-intervals', count));
    expect(Math.abs(stats.mean)).toBeLessThan(4 / Math.sqrt(count)); // 0.0126
    expect(Math.abs(stats.sd - 1)).toBeLessThan(4 / Math.sqrt(2 * count)); // 0.0089
    expect(Math.abs(stats.median)).toBeLessThan(quantileTolerance(0.5, normalPdf(0))); // 0.016
    const one = quantileTolerance(tail68, normalPdf(1)); // 0.019
    const two = quantileTolerance(tail95, normalPdf(2)); // 0.035
    expect(Math.abs(stats.ci68[0] + 1)).toBeLessThan(one);
    expect(Math.abs(stats.ci68[1] - 1)).toBeLessThan(one);
    expect(Math.abs(stats.ci95[0] + 2)).toBeLessThan(two);
    expect(Math.abs(stats.ci95[1] - 2)).toBeLessThan(two);
    // For a symmetric unimodal density the shortest interval is the equal-tailed one: [-1, 1].
    // Its width is a difference of two sample quantiles: sd = sqrt((p1 q1 + p2 q2 - 2 p1 q2) / n) / f(1)
    // with p1 = 1 - p2 = 0.158655 (quantile covariance p1 (1 - p2) / (n f1 f2)), i.e. 0.0061; 4 sd = 0.024.
    const p1 = tail68;
    const widthSd = Math.sqrt((2 * p1 * (1 - p1) - 2 * p1 * p1) / count) / normalPdf(1);
    expect(Math.abs(stats.hdi68[1] - stats.hdi68[0] - 2)).toBeLessThan(4 * widthSd);
    // Its centre is poorly fixed (the width is flat near the optimum; the location converges as n^(-1/3),
    // Kim & Pollard 1990, Ann. Stat. 18, 191): its spread measured over 30 seeds was 0.021; 4 x that = 0.085.
    expect(Math.abs(stats.hdi68[0] + stats.hdi68[1]) / 2).toBeLessThan(0.085);
    expect(stats.count).toBe(count);
  });

  it('unit exponential: HDI [0, -ln(1 - 0.6827)] and equal-tailed intervals from its quantile function', () => {
    // Exponential(1): quantile -ln(1 - p), density exp(-x); the shortest 68.27% interval starts at 0.
    const quantile = (p: number): number => -Math.log(1 - p);
    const stats = sampleStatistics(exponentialSample('exponential-intervals', count));
    const hdiUpper = quantile(ONE_SIGMA_MASS); // 1.1479
    expect(stats.hdi68[0]).toBeLessThan(1e-3); // the sample minimum, about 1/n
    expect(Math.abs(stats.hdi68[1] - hdiUpper)).toBeLessThan(quantileTolerance(ONE_SIGMA_MASS, 1 - ONE_SIGMA_MASS)); // 0.019
    const checks: Array<[number, number]> = [[stats.ci68[0], tail68], [stats.ci68[1], 1 - tail68], [stats.ci95[0], tail95], [stats.ci95[1], 1 - tail95]];
    for (const [estimate, p] of checks) {
      expect(Math.abs(estimate - quantile(p))).toBeLessThan(quantileTolerance(p, 1 - p));
    }
    expect(Math.abs(stats.median - Math.LN2)).toBeLessThan(quantileTolerance(0.5, 0.5));
  });
});

describe('highestDensityInterval', () => {
  it('returns the narrowest window of ceil(mass n) sorted samples', () => {
    // By hand: 3 of 5 samples; windows [0, 1.1], [1, 1.2], [1.1, 5] -> [1, 1.2].
    expect(highestDensityInterval([5, 0, 1.2, 1, 1.1], 0.6)).toEqual([1, 1.2]);
    // Weights: the value 5 holds 60% alone.
    expect(highestDensityInterval([5, 0, 1.2, 1, 1.1], 0.6, [6, 1, 1, 1, 1])).toEqual([5, 5]);
  });
});

describe('summarizePosterior', () => {
  it('takes the MAP from the highest finite log posterior and copies diagnostics', () => {
    const summary = summarizePosterior(
      [Float64Array.of(0.29, 0.31, 0.30, 0.28), Float64Array.of(-1.0, -0.9, -1.1, -0.95)], ['omega_m', 'w0'],
      { logPosterior: [-3, Number.NaN, -1, -Infinity], diagnostics: { omega_m: { rHat: 1.002, essBulk: 1500 } }, derived: ['w0'] },
    );
    expect(summary.maxLogPosterior).toBe(-1);
    expect(summary.parameters[0].stats.map).toBe(0.30);
    expect(summary.parameters[1].stats.map).toBe(-1.1);
    expect(summary.parameters[0].diagnostics).toEqual({ rHat: 1.002, essBulk: 1500 });
    expect(summary.parameters[1].derived).toBe(true);
    expect(summary.correlation?.length).toBe(4);
  });

  it('refuses non-finite samples with an issue naming the parameter and the row', () => {
    try {
      summarizePosterior([Float64Array.of(0.3, Number.NaN)], ['omega_m']);
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error)).toBe(true);
      if (isCandelaError(error)) expect(error.issues[0]).toMatchObject({ code: 'math.non_finite_sample', path: 'omega_m', row: 2 });
    }
  });
});
