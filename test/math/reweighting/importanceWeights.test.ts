import { describe, expect, it } from 'vitest';
import { importanceWeights } from '../../../src/math/reweighting/importanceWeights.js';

describe('importanceWeights', () => {
  it('turn log ratios 0 and ln 3 into weights 1/4 and 3/4 with Kish count 1.6 (by hand: 1 / (1/16 + 9/16))', () => {
    const result = importanceWeights([0, Math.log(3)]);
    expect(result.weights[0]).toBeCloseTo(0.25, 15);
    expect(result.weights[1]).toBeCloseTo(0.75, 15);
    expect(result.effectiveCount).toBeCloseTo(1.6, 14);
    expect(result.effectiveFraction).toBeCloseTo(0.8, 14);
  });

  it('give equal weights and a full effective count for a constant log ratio (by hand)', () => {
    const result = importanceWeights([-5000, -5000, -5000, -5000]);
    expect(Array.from(result.weights)).toEqual([0.25, 0.25, 0.25, 0.25]);
    expect(result.effectiveCount).toBeCloseTo(4, 14);
  });

  it('do not overflow for log ratios near 1000 nats (the largest is subtracted first)', () => {
    const result = importanceWeights([1000, 1000 + Math.log(3)]);
    // 1000 + ln 3 is rounded to the spacing of doubles near 1000 (1.1e-13), so 12 digits, not 15.
    expect(result.weights[1]).toBeCloseTo(0.75, 12);
  });

  it('give weight 0 to a draw the target excludes (-Infinity)', () => {
    const result = importanceWeights([0, -Infinity, 0]);
    expect(Array.from(result.weights)).toEqual([0.5, 0, 0.5]);
    expect(result.effectiveCount).toBeCloseTo(2, 14);
  });

  it('refuse NaN and +Infinity with the row, an empty set, and a target that excludes every draw', () => {
    expect(() => importanceWeights([0, Number.NaN])).toThrow(/draw 2/);
    expect(() => importanceWeights([Infinity])).toThrow(/not a number below/);
    expect(() => importanceWeights([])).toThrow(/no draws/);
    expect(() => importanceWeights([-Infinity, -Infinity])).toThrow(/excludes every draw/);
  });
});
