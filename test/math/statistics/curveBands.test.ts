import { describe, expect, it } from 'vitest';
import { CURVE_BAND_PROBABILITIES, curveBands } from '../../../src/math/index.js';

describe('curveBands', () => {
  it('gives at each abscissa the type-2 quantiles (Hyndman & Fan 1996) of the curves there', () => {
    // Abscissa 0 holds 1..10 in shuffled curve order. Type 2 from its definition: the value of
    // rank ceil(10 p), the mean of ranks 10p and 10p + 1 when 10p is whole: median 5.5,
    // 0.158655 -> rank 2, 0.841345 -> rank 9, 0.02275 -> rank 1, 0.97725 -> rank 10.
    const order = [7, 3, 10, 1, 5, 9, 2, 8, 4, 6];
    const curves = order.map((v) => Float64Array.of(v, -v));
    const bands = curveBands(curves, 2);
    expect([bands.median[0], bands.low68[0], bands.high68[0], bands.low95[0], bands.high95[0]]).toEqual([5.5, 2, 9, 1, 10]);
    expect([bands.median[1], bands.low68[1], bands.high68[1]]).toEqual([-5.5, -9, -2]);
  });

  it('uses the cumulative probabilities of the 68.27% and 95.45% equal-tailed bands (Gaussian 1 and 2 sigma, common practice)', () => {
    expect(CURVE_BAND_PROBABILITIES[2] - CURVE_BAND_PROBABILITIES[1]).toBeCloseTo(0.6827, 4);
    expect(CURVE_BAND_PROBABILITIES[4] - CURVE_BAND_PROBABILITIES[3]).toBeCloseTo(0.9545, 4);
  });

  it('leaves non-finite values out at an abscissa and gives NaN where none is left', () => {
    const curves = [Float64Array.of(1, Number.NaN), Float64Array.of(Number.POSITIVE_INFINITY, Number.NaN), Float64Array.of(3, Number.NaN)];
    const bands = curveBands(curves, 2);
    expect(bands.median[0]).toBe(2);
    expect(Number.isNaN(bands.median[1])).toBe(true);
  });
});
