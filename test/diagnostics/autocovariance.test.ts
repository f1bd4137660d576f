import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../src/math/index.js';
import { createAutocovarianceWorkspace } from '../../src/diagnostics/autocovariance.js';

/** Biased autocovariance by its definition (Geyer 1992): (1/n) sum_j (x_j - mean)(x_{j+t} - mean). */
function directAutocovariance(series: Float64Array): Float64Array {
  const n = series.length;
  const mean = series.reduce((sum, value) => sum + value, 0) / n;
  return Float64Array.from({ length: n }, (_, lag) => {
    let sum = 0;
    for (let index = 0; index + lag < n; index++) sum += (series[index] - mean) * (series[index + lag] - mean);
    return sum / n;
  });
}

describe('createAutocovarianceWorkspace', () => {
  it('gives the biased autocovariance of 1, 2, 3, 4 computed by hand: 1.25, 0.3125, -0.375, -0.5625', () => {
    const out = createAutocovarianceWorkspace(4).autocovarianceInto(Float64Array.of(1, 2, 3, 4), new Float64Array(4));
    expect(Array.from(out).map((value) => Number(value.toFixed(13)))).toEqual([1.25, 0.3125, -0.375, -0.5625]);
  });

  it('matches the direct lag sum for every lag of a 300-draw series (linear, not circular, correlation)', () => {
    const stream = createRandomStream('autocovariance/direct');
    const series = Float64Array.from({ length: 300 }, () => 3 + stream.normal());
    const workspace = createAutocovarianceWorkspace(300);
    const out = workspace.autocovarianceInto(series, new Float64Array(300));
    const expected = directAutocovariance(series);
    // Tolerance 1e-13 absolute on a unit variance: FFT rounding, log2(1024) steps (common practice).
    for (let lag = 0; lag < 300; lag++) expect(Math.abs(out[lag] - expected[lag])).toBeLessThan(1e-13);
    // The workspace is reusable: a second series gives its own result.
    const second = Float64Array.from({ length: 300 }, (_, index) => Math.sin(index / 7));
    const again = workspace.autocovarianceInto(second, new Float64Array(300));
    const expectedSecond = directAutocovariance(second);
    for (let lag = 0; lag < 300; lag++) expect(Math.abs(again[lag] - expectedSecond[lag])).toBeLessThan(1e-13);
  });

  it('gives zeros for a constant series (as the reference implementation does)', () => {
    expect(Array.from(createAutocovarianceWorkspace(5).autocovarianceInto(new Float64Array(5).fill(2.5), new Float64Array(5)))).toEqual([0, 0, 0, 0, 0]);
  });

  it('transforms two series at once to the direct lag sums of each (two real FFTs for the price of one, Numerical Recipes 12.3)', () => {
    const stream = createRandomStream('autocovariance/pair');
    const first = Float64Array.from({ length: 257 }, () => -2 + stream.normal());
    let state = 0;
    const second = Float64Array.from({ length: 257 }, () => (state = 0.9 * state + 0.5 * stream.normal()) + 40);
    const workspace = createAutocovarianceWorkspace(257);
    const outFirst = new Float64Array(257);
    const outSecond = new Float64Array(257);
    workspace.autocovariancePairInto(first, second, outFirst, outSecond);
    const expectedFirst = directAutocovariance(first);
    const expectedSecond = directAutocovariance(second);
    // Same tolerance as the single transform above (common practice).
    for (let lag = 0; lag < 257; lag++) {
      expect(Math.abs(outFirst[lag] - expectedFirst[lag])).toBeLessThan(1e-13);
      expect(Math.abs(outSecond[lag] - expectedSecond[lag])).toBeLessThan(1e-13);
    }
    // Variances 1e12 apart are done one by one: the small series keeps its relative accuracy.
    const tiny = Float64Array.from(first, (value) => 1e-6 * value);
    const huge = Float64Array.from(second, (value) => 1e3 * value);
    workspace.autocovariancePairInto(tiny, huge, outFirst, outSecond);
    for (let lag = 0; lag < 257; lag++) expect(Math.abs(outFirst[lag] - 1e-12 * expectedFirst[lag])).toBeLessThan(1e-25);
    // A constant partner gives zeros and leaves the other exact.
    workspace.autocovariancePairInto(new Float64Array(257).fill(3), first, outFirst, outSecond);
    expect(outFirst.every((value) => value === 0)).toBe(true);
    for (let lag = 0; lag < 257; lag++) expect(Math.abs(outSecond[lag] - expectedFirst[lag])).toBeLessThan(1e-13);
  });
});
