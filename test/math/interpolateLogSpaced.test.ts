import { describe, expect, it } from 'vitest';
import { interpolateLogSpaced, logSpacedGrid, SPEED_OF_LIGHT_KM_PER_S } from '../../src/math/index.js';

describe('interpolateLogSpaced', () => {
  it('matches numpy.interp(log(x), log(grid), values) on a table of x^2 (numpy 2.4.6)', () => {
    // numpy.interp(np.log([2, 5, 30, 99]), np.log(grid), grid**2) with grid = 100**(arange(5)/4):
    // [6.418539921951662, 45.81460078048336, 958.8182584953925, 9921.433502755894].
    const grid = logSpacedGrid(1, 100, 5);
    const values = grid.map((x) => x * x);
    const result = interpolateLogSpaced(values, 1, 100, Float64Array.of(2, 5, 30, 99));
    const numpy = [6.418539921951662, 45.81460078048336, 958.8182584953925, 9921.433502755894];
    // Tolerance: a few ulps of the values (the grid points are rounded powers; numpy searches, this finds the position in closed form).
    numpy.forEach((expected, k) => expect(Math.abs(result[k] - expected)).toBeLessThan(1e-12 * expected));
  });

  it('reproduces a quantity linear in ln z exactly: the low-redshift distance modulus 5 log10(cz / H0) + 25 (Hubble law; common practice)', () => {
    const h0KmPerSPerMpc = 70;
    const muMag = (z: number) => 5 * Math.log10(SPEED_OF_LIGHT_KM_PER_S * z / h0KmPerSPerMpc) + 25;
    const grid = logSpacedGrid(0.01, 2, 50);
    const values = grid.map(muMag);
    const redshifts = Float64Array.of(0.0123, 0.05, 0.1, 0.333, 1, 1.99);
    const result = interpolateLogSpaced(values, 0.01, 2, redshifts);
    // Tolerance: rounding of mu ~ 40 mag through a few operations (1e-12 mag is ~1e4 ulps of 40: ample, and far below any fit's interest).
    redshifts.forEach((z, k) => expect(Math.abs(result[k] - muMag(z))).toBeLessThan(1e-12));
  });

  it('returns the tabulated values at the grid points and halfway (in ln x) the mean of the neighbours', () => {
    const values = Float64Array.of(3, -1, 4, 1.5);
    const grid = logSpacedGrid(0.5, 4, 4); // 0.5, 1, 2, 4
    const atNodes = interpolateLogSpaced(values, 0.5, 4, grid);
    atNodes.forEach((value, i) => expect(value).toBeCloseTo(values[i], 12));
    const halfway = interpolateLogSpaced(values, 0.5, 4, Float64Array.of(Math.SQRT1_2, Math.SQRT2, 2 * Math.SQRT2));
    expect(Array.from(halfway, (v) => Number(v.toFixed(12)))).toEqual([1, 1.5, 2.75]);
  });

  it('holds the end values outside the grid (constant extrapolation), also for points at or below zero', () => {
    const values = Float64Array.of(10, 20, 30);
    expect(Array.from(interpolateLogSpaced(values, 1, 9, Float64Array.of(0.5, 0, -2, 9, 50)))).toEqual([10, 10, 10, 30, 30]);
  });
});
