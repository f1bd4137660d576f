import { describe, expect, it } from 'vitest';
import { quantileOfDraws, quantileOfSortedDraws } from '../../../src/math/index.js';

describe('quantileOfDraws', () => {
  it('is the type-7 sample quantile of Hyndman & Fan (1996), as R quantile() prints it', () => {
    // R 4.2.2: quantile(1:10, c(0.05, 0.95, 0.5)) = 1.45, 9.5499999999999989, 5.5
    const oneToTen = Float64Array.from({ length: 10 }, (_, index) => index + 1);
    expect(quantileOfDraws(oneToTen, 0.05)).toBe(1.45);
    expect(quantileOfDraws(oneToTen, 0.95)).toBe(9.5499999999999989);
    expect(quantileOfDraws(oneToTen, 0.5)).toBe(5.5);
    // R 4.2.2: quantile(c(0.3, -1.2, 5, 2.2, 2.2, 7.5, -0.1), c(0.05, 0.37, 0.95)) = -0.87, 0.71799999999999953, 6.74999999999999822
    const unsorted = Float64Array.of(0.3, -1.2, 5, 2.2, 2.2, 7.5, -0.1);
    expect(quantileOfDraws(unsorted, 0.05)).toBeCloseTo(-0.87, 15);
    expect(quantileOfDraws(unsorted, 0.37)).toBeCloseTo(0.71799999999999953, 15);
    expect(quantileOfDraws(unsorted, 0.95)).toBeCloseTo(6.74999999999999822, 14);
    expect(quantileOfDraws(Float64Array.of(4, 1, 3, 2), 0.5)).toBe(2.5);
  });
});

describe('quantileOfSortedDraws', () => {
  it('gives the same type-7 quantile on draws already sorted (R 4.2.2: quantile(1:10, 0.95) = 9.5499999999999989)', () => {
    const oneToTen = Float64Array.from({ length: 10 }, (_, index) => index + 1);
    expect(quantileOfSortedDraws(oneToTen, 0.95)).toBe(9.5499999999999989);
    expect(quantileOfSortedDraws(oneToTen, 0)).toBe(1);
    expect(quantileOfSortedDraws(oneToTen, 1)).toBe(10);
  });
});
