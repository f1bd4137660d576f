import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { importanceWeights } from '../../../src/math/reweighting/importanceWeights.js';
import { reweightedShift } from '../../../src/math/reweighting/reweightedShift.js';
import { contributionError, varianceDifferenceError } from '../../../src/math/reweighting/varianceDifferenceError.js';

describe('varianceDifferenceError', () => {
  it('is 0 for the same weights twice, and matches the spread of s_q^2 - s_p^2 over 200 repetitions within 20%', () => {
    const same = Float64Array.of(0.25, 0.25, 0.25, 0.25);
    expect(varianceDifferenceError([1, 2, 3, 5], same, same)).toBe(0);
    // q = N(0, 1/2) from N(0, 1) draws: log ratio -x^2 / 2 (completing the square). Spread of 200 estimates: 5% uncertain.
    const differences: number[] = [];
    const errors: number[] = [];
    for (let repeat = 0; repeat < 200; repeat++) {
      const random = createRandomStream(`variance-spread-${repeat}`);
      const values = Float64Array.from({ length: 500 }, () => random.normal());
      const weights = importanceWeights(values.map((x) => -(x * x) / 2)).weights;
      const plain = new Float64Array(500).fill(1 / 500);
      const q = reweightedShift(values, weights);
      differences.push(q.sd ** 2 - q.baseSd ** 2);
      errors.push(varianceDifferenceError(values, weights, plain));
    }
    const mean = differences.reduce((a, b) => a + b, 0) / differences.length;
    const spread = Math.sqrt(differences.reduce((a, b) => a + (b - mean) ** 2, 0) / (differences.length - 1));
    const reported = Math.sqrt(errors.reduce((a, b) => a + b * b, 0) / errors.length);
    expect(Math.abs(reported / spread - 1)).toBeLessThan(0.2);
  });
});

describe('contributionError', () => {
  it('is e / (2 c) far from zero and sqrt(e) at zero (by hand)', () => {
    expect(contributionError(0.5, 1e-6) / 1e-6).toBeCloseTo(1, 5);
    expect(contributionError(0, 1e-4)).toBeCloseTo(0.01, 15);
    // c = 0.005, e = 1.5e-5: (sqrt(4.0e-5) - sqrt(1.0e-5)) / 2 = (0.0063246 - 0.0031623) / 2 (by hand).
    expect(contributionError(0.005, 1.5e-5)).toBeCloseTo(0.0015811, 6);
  });
});
