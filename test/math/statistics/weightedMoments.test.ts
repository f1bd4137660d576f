import { mean as ssMean, sampleStandardDeviation, sampleVariance } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { meanOf, sampleVarianceOf, weightedMoments } from '../../../src/math/index.js';
import { VALUES, OTHER, WEIGHTS, normalSample } from './referenceSample.js';

describe('weightedMoments', () => {
  it('match R cov.wt(method = "unbiased") on a weighted sample', () => {
    // R 4.2.2 stats::cov.wt with weights / sum(weights) (make_summary_reference.R), to 1e-14 relative.
    const first = weightedMoments(VALUES, WEIGHTS);
    const second = weightedMoments(OTHER, WEIGHTS);
    expect(first.mean).toBeCloseTo(0.96428571428571419, 14);
    expect(second.mean).toBeCloseTo(0.82857142857142851, 14);
    expect(first.sd).toBeCloseTo(1.6242883056896025, 14);
    expect(second.sd).toBeCloseTo(1.0301698889018258, 14);
  });

  it('match simple-statistics mean, sampleStandardDeviation and sampleVariance without weights', () => {
    const x = normalSample('moments-x', 5000);
    const noise = normalSample('moments-noise', 5000);
    const y = x.map((value, i) => 0.6 * value + 0.8 * noise[i] + 3);
    const moments = weightedMoments(y);
    expect(moments.mean).toBeCloseTo(ssMean(Array.from(y)), 12);
    expect(moments.sd).toBeCloseTo(sampleStandardDeviation(Array.from(y)), 12);
    expect(moments.effectiveCount).toBe(5000);
    expect(meanOf(y)).toBe(moments.mean);
    expect(sampleVarianceOf(y)).toBeCloseTo(sampleVariance(Array.from(y)), 12);
  });

  it('give the n - 1 variance of R var(): var(c(1, 2, 3, 4)) = 5/3 (by hand)', () => {
    expect(sampleVarianceOf(Float64Array.of(1, 2, 3, 4))).toBe(1.6666666666666667);
    expect(meanOf(Float64Array.of(1e100, 1, -1e100, 2))).toBe(0.75); // compensated sum (Neumaier 1974) keeps the 1 and the 2
  });
});
