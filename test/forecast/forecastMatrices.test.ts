// The matrix pieces of the forecast, against worked examples.
import { describe, expect, it } from 'vitest';
import { centralDifferenceHessian, covarianceInformation, marginalizeFisher } from '../../src/forecast/index.js';

describe('marginalizeFisher', () => {
  it('gives the figure of merit 1/sqrt(det) of the marginal w0-wa block of a 3x3 example (inverse by cofactors)', () => {
    // F on (omega_m, w0, wa); inverse by the adjugate formula, worked by hand:
    // det F = 400 (50 * 8 - 10 * 10) - 60 (60 * 8 - 10 * 30) + 30 (60 * 10 - 50 * 30) = 120000 - 10800 - 27000 = 82200
    // Cov(w0, w0) = (400 * 8 - 30 * 30) / det = 2300 / 82200; Cov(wa, wa) = (400 * 50 - 60 * 60) / det = 16400 / 82200;
    // Cov(w0, wa) = -(400 * 10 - 60 * 30) / det = -2200 / 82200.
    const fisher = Float64Array.of(400, 60, 30, 60, 50, 10, 30, 10, 8);
    const marginals = marginalizeFisher(fisher, ['omega_m', 'w0', 'wa']);
    const det = 82200;
    expect(marginals.covariance[4]).toBeCloseTo(2300 / det, 14);
    expect(marginals.covariance[8]).toBeCloseTo(16400 / det, 14);
    expect(marginals.covariance[5]).toBeCloseTo(-2200 / det, 14);
    const blockDeterminant = (2300 * 16400 - 2200 * 2200) / (det * det);
    expect(marginals.figureOfMerit).toBeCloseTo(1 / Math.sqrt(blockDeterminant), 10);
    expect(marginals.sigma[0]).toBeCloseTo(Math.sqrt((50 * 8 - 10 * 10) / det), 14);
    expect(marginals.correlation[5]).toBeCloseTo(-2200 / Math.sqrt(2300 * 16400), 12);
  });

  it('reports a degenerate matrix naming the parameter', () => {
    expect(() => marginalizeFisher(Float64Array.of(1, 1, 1, 1), ['abs_mag', 'h0'])).toThrow(/not positive definite.*h0/);
  });
});

describe('centralDifferenceHessian', () => {
  it('is exact for a quadratic (Abramowitz & Stegun 1964, 25.3.23 and 25.3.26, numbers from memory)', () => {
    const f = (x: Float64Array) => 3 * x[0] * x[0] - 2 * x[0] * x[1] + 5 * x[1] * x[1] + 7 * x[0] + 11;
    const hessian = centralDifferenceHessian(f, Float64Array.of(0.3, -1.2), Float64Array.of(0.01, 0.02), ['a', 'b'], () => null);
    expect(Array.from(hessian, (v) => Number(v.toFixed(8)))).toEqual([6, -2, -2, 10]);
  });

  it('names the parameter when the function is not finite', () => {
    const f = (x: Float64Array) => (x[1] > 1 ? Number.NaN : x[0] * x[1]);
    expect(() => centralDifferenceHessian(f, Float64Array.of(0, 0.99), Float64Array.of(0.1, 0.1), ['a', 'b'], () => 'past the edge')).toThrow(/\(b\): past the edge/);
  });
});

describe('covarianceInformation', () => {
  it('equals 1/2 tr(C^-1 D_i C^-1 D_j) computed with the explicit 2x2 inverse', () => {
    const c = [[2, 0.6], [0.6, 1]];
    const det = 2 * 1 - 0.6 * 0.6;
    const inv = [[1 / det, -0.6 / det], [-0.6 / det, 2 / det]];
    const d = [Float64Array.of(1, 0.5), Float64Array.of(-0.2, 2)];
    const { information, logDeterminant } = covarianceInformation(Float64Array.of(2, 0.6, 0.6, 1), 2, d);
    const trace = (a: Float64Array, b: Float64Array) => {
      let sum = 0;
      for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) sum += inv[i][j] * b[j] * inv[j][i] * a[i];
      return 0.5 * sum;
    };
    expect(information[0]).toBeCloseTo(trace(d[0], d[0]), 14);
    expect(information[1]).toBeCloseTo(trace(d[0], d[1]), 14);
    expect(information[3]).toBeCloseTo(trace(d[1], d[1]), 14);
    expect(logDeterminant).toBeCloseTo(Math.log(det), 14);
    expect(c[0][1]).toBe(0.6);
  });
});
