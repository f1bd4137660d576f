import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { importanceWeights } from '../../../src/math/reweighting/importanceWeights.js';
import { reweightedShift } from '../../../src/math/reweighting/reweightedShift.js';

/** n independent N(0, 1) draws and the log ratio that turns N(0, 1) into N(mu, 1): mu x - mu^2 / 2. */
function unitNormalDraws(n: number, mu: number, seed: string): { values: Float64Array; logRatio: Float64Array } {
  const random = createRandomStream(seed);
  const values = Float64Array.from({ length: n }, () => random.normal());
  return { values, logRatio: values.map((x) => mu * x - (mu * mu) / 2) };
}

describe('reweightedShift', () => {
  it('give the weighted minus the plain mean on a two-draw case (by hand: 0.75 - 0.5)', () => {
    const result = reweightedShift([0, 1], [0.25, 0.75]);
    expect(result.baseMean).toBe(0.5);
    expect(result.mean).toBe(0.75);
    expect(result.shift).toBe(0.25);
  });

  it('recover the shift mu = 0.3 of N(0, 1) -> N(0.3, 1) within 4 of its Monte Carlo errors, and sd 1', () => {
    // Closed form: the product N(0, 1) exp(mu x) is N(mu, 1) (completing the square).
    const { values, logRatio } = unitNormalDraws(20_000, 0.3, 'shift-recovery');
    const result = reweightedShift(values, importanceWeights(logRatio).weights);
    // The mean of the draws is not 0 exactly; the shift is measured from it, so the truth is mu.
    expect(Math.abs(result.shift - 0.3)).toBeLessThan(4 * result.shiftMcError);
    // sd of a reweighted sd: about sd / sqrt(2 n_eff); n_eff ~ n exp(-mu^2) = 18,280 (Kish count of lognormal weights).
    expect(Math.abs(result.sd - 1)).toBeLessThan(4 / Math.sqrt(2 * 18_000));
  });

  it('report a Monte Carlo error that matches the spread of the shift over 200 independent repetitions', () => {
    // The spread of 200 estimates is itself uncertain by 1/sqrt(2 x 199) = 5%: the two must agree within 4 x 5% = 20%.
    const shifts: number[] = [];
    const errors: number[] = [];
    for (let repeat = 0; repeat < 200; repeat++) {
      const { values, logRatio } = unitNormalDraws(500, 0.5, `shift-spread-${repeat}`);
      const result = reweightedShift(values, importanceWeights(logRatio).weights);
      shifts.push(result.shift);
      errors.push(result.shiftMcError);
    }
    const mean = shifts.reduce((a, b) => a + b, 0) / shifts.length;
    const spread = Math.sqrt(shifts.reduce((a, b) => a + (b - mean) ** 2, 0) / (shifts.length - 1));
    const reported = Math.sqrt(errors.reduce((a, b) => a + b * b, 0) / errors.length);
    expect(Math.abs(reported / spread - 1)).toBeLessThan(0.2);
  });
});
