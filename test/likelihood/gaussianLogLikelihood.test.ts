import { describe, expect, it } from 'vitest';
import { createOffsetMarginal, gaussianLogLikelihood, marginalizeOffset } from '../../src/likelihood/index.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

describe('gaussianLogLikelihood', () => {
  it('is -(r^2/var + ln var + ln 2 pi)/2 in one dimension (closed form of the normal density)', () => {
    const result = gaussianLogLikelihood(Float64Array.of(1.5), Float64Array.of(0.25));
    expect(result.chiSquare).toBeCloseTo(9, 14);
    expect(result.logLikelihood).toBeCloseTo(-0.5 * (9 + Math.log(0.25) + LOG_TWO_PI), 14);
  });
  it('matches a 2x2 case worked by hand (C = [[4,2],[2,3]], r = (1,2): r^T C^-1 r = 11/8, det C = 8)', () => {
    const result = gaussianLogLikelihood(Float64Array.of(1, 2), Float64Array.of(4, 2, 2, 3));
    expect(result.chiSquare).toBeCloseTo(11 / 8, 14);
    expect(result.logDeterminant).toBeCloseTo(Math.log(8), 14);
    expect(result.logLikelihood).toBeCloseTo(-0.5 * (11 / 8 + Math.log(8) + 2 * LOG_TWO_PI), 14);
  });
  it('gives the same value from a dense diagonal matrix and from the variances alone (identity)', () => {
    const residual = Float64Array.of(0.1, -0.3, 0.2);
    const dense = gaussianLogLikelihood(residual, Float64Array.of(0.01, 0, 0, 0, 0.04, 0, 0, 0, 0.09));
    const diagonal = gaussianLogLikelihood(residual, Float64Array.of(0.01, 0.04, 0.09), { diagonal: true });
    expect(diagonal.logLikelihood).toBeCloseTo(dense.logLikelihood, 12);
    expect(diagonal.chiSquare).toBeCloseTo(1 + 2.25 + 4 / 9, 12); // sum r_i^2 / var_i by hand
  });
  it('returns -Infinity with a reason, never NaN, for a covariance that is not positive definite', () => {
    const result = gaussianLogLikelihood(Float64Array.of(1, 1), Float64Array.of(1, 2, 2, 1));
    expect(result.logLikelihood).toBe(-Infinity);
    expect(result.reason).toMatch(/not positive definite/);
  });
});

describe('marginalizeOffset', () => {
  it('finds M* = B/E and chi^2_min = A - B^2/E (unit covariance, d = (1, 3): M* = 2, chi^2 = 2; by hand)', () => {
    const out = marginalizeOffset(Float64Array.of(1, 3), Float64Array.of(1, 1), NaN, 2, createOffsetMarginal());
    expect(out.bestOffset).toBe(2);
    expect(out.chiSquareAtBest).toBe(2);
    expect(out.templatePrecision).toBe(2);
    expect(out.marginalizationTerm).toBeCloseTo(Math.log(2 / (2 * Math.PI)), 15);
  });
  it('equals numerical integration of L(M) over the offset (Simpson rule, 4001 points over +-12 sigma; tol 1e-9)', () => {
    // Goliath et al. 2001 / Conley et al. 2011 appendix C: the integral of exp(-chi^2(M)/2) dM with a
    // flat unit-density prior is exp(-(A - B^2/E)/2) sqrt(2 pi / E). Checked here by brute-force quadrature.
    const residual = Float64Array.of(-19.21, -19.46, -19.30, -19.38, -19.12);
    const covariance = Float64Array.of(
      0.0225, 0.004, 0.002, 0.000, 0.001,
      0.004, 0.0400, 0.003, 0.002, 0.000,
      0.002, 0.003, 0.0169, 0.001, 0.002,
      0.000, 0.002, 0.001, 0.0289, 0.003,
      0.001, 0.000, 0.002, 0.003, 0.0196,
    );
    const analytic = gaussianLogLikelihood(residual, covariance, { marginalizeOffset: true });
    const sigmaOffset = 1 / Math.sqrt(Math.exp(analytic.marginalizationTerm) * 2 * Math.PI);
    const steps = 4000;
    const lower = analytic.bestOffset - 12 * sigmaOffset;
    const h = (24 * sigmaOffset) / steps;
    const shifted = new Float64Array(residual.length);
    const peak = gaussianLogLikelihood(residual.map((r) => r - analytic.bestOffset), covariance).logLikelihood;
    let sum = 0;
    for (let i = 0; i <= steps; i++) {
      const offset = lower + i * h;
      for (let k = 0; k < residual.length; k++) shifted[k] = residual[k] - offset;
      const weight = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
      sum += weight * Math.exp(gaussianLogLikelihood(shifted, covariance).logLikelihood - peak);
    }
    const numeric = peak + Math.log((sum * h) / 3);
    expect(analytic.logLikelihood).toBeCloseTo(numeric, 9);
    // The best offset also minimizes chi^2: the profile at M* equals chi^2_min.
    expect(analytic.chiSquare).toBeCloseTo(-2 * peak - analytic.logDeterminant - 5 * LOG_TWO_PI, 9);
  });
});
