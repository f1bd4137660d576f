import { describe, expect, it } from 'vitest';
import { foldAboutMedian, rankNormalize, splitChains } from '../../src/diagnostics/index.js';
import { ascendingOrder } from '../../src/diagnostics/ascendingOrder.js';
import { averageRanks } from '../../src/diagnostics/rankNormalize.js';
import { createRandomStream } from '../../src/math/index.js';

describe('splitChains', () => {
  it('splits each chain in halves, first halves first (R package posterior .split_chains)', () => {
    const halves = splitChains([Float64Array.of(1, 2, 3, 4), Float64Array.of(5, 6, 7, 8)]);
    expect(halves.map((half) => Array.from(half))).toEqual([[1, 2], [5, 6], [3, 4], [7, 8]]);
  });
  it('drops the middle draw of an odd-length chain (posterior: x[1:floor(n/2)], x[ceiling(n/2 + 1):n])', () => {
    expect(splitChains([Float64Array.of(1, 2, 3, 4, 5)]).map((half) => Array.from(half))).toEqual([[1, 2], [4, 5]]);
  });
});

describe('ascendingOrder', () => {
  it('returns the stable sorting permutation, negatives, zeros and ties included', () => {
    expect(Array.from(ascendingOrder(Float64Array.of(0.5, -2, 3, -2)))).toEqual([1, 3, 0, 2]);
    expect(Array.from(ascendingOrder(Float64Array.of(1e-300, -0, 0, -1e308, 1e308, -1e-300)))).toEqual([3, 5, 1, 2, 0, 4]);
  });
  it('orders 100000 random draws like the built-in numeric sort (definition of sorting)', () => {
    const stream = createRandomStream('ascendingOrder');
    const values = Float64Array.from({ length: 100000 }, () => stream.normal() * 10 ** stream.integer(8));
    const order = ascendingOrder(values);
    const sorted = Float64Array.from(values).sort();
    let mismatches = 0;
    for (let position = 0; position < sorted.length; position++) if (values[order[position]] !== sorted[position]) mismatches++;
    expect(mismatches).toBe(0);
    expect(new Set(order).size).toBe(values.length);
  });
});

describe('averageRanks', () => {
  it('gives ties the average of their ranks, as R rank(c(2, 1, 2, 3, 2, 1)) = 4 1.5 4 6 4 1.5', () => {
    expect(Array.from(averageRanks(Float64Array.of(2, 1, 2, 3, 2, 1)))).toEqual([4, 1.5, 4, 6, 4, 1.5]);
  });
});

describe('rankNormalize', () => {
  it('maps pooled ranks r to qnorm((r - 3/8) / (S + 1/4)) (Vehtari et al. 2021 eq. 14; R 4.2.2 gives -1.049131398, 1.049131398, 0, 0)', () => {
    const scores = rankNormalize([Float64Array.of(10, 30), Float64Array.of(20, 20)]);
    expect(scores[0][0]).toBeCloseTo(-1.049131398, 9);
    expect(scores[0][1]).toBeCloseTo(1.049131398, 9);
    expect(Array.from(scores[1])).toEqual([0, 0]);
  });
  it('depends only on the order of the draws (any monotone transform gives the same scores)', () => {
    const draws = [Float64Array.of(0.3, -2, 4.5), Float64Array.of(1, 7, -0.2)];
    const transformed = draws.map((chain) => chain.map((value) => Math.exp(value)));
    expect(rankNormalize(transformed)).toEqual(rankNormalize(draws));
  });
});

describe('foldAboutMedian', () => {
  it('returns |x - median| with the pooled median (R: abs(x - median(x)) for c(1, 5, 2, 4) is 2 2 1 1)', () => {
    expect(foldAboutMedian([Float64Array.of(1, 5), Float64Array.of(2, 4)]).map((chain) => Array.from(chain))).toEqual([[2, 2], [1, 1]]);
  });
});
