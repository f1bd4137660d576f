import { describe, expect, it } from 'vitest';
import {
  complementaryErrorFunction,
  logStandardNormalDensity,
  standardNormalCumulative,
  standardNormalSurvival,
  standardNormalSurvivalQuantile,
} from '../../../src/math/index.js';

describe('complementaryErrorFunction', () => {
  it('matches Abramowitz & Stegun (1964) Table 7.1 on both branches (series below 1.5, continued fraction above)', () => {
    // erf(0.5) = 0.5204998778, erf(1) = 0.8427007929, erf(2) = 0.9953222650 (A&S Table 7.1, 10 digits).
    expect(1 - complementaryErrorFunction(0.5)).toBeCloseTo(0.5204998778, 10);
    expect(1 - complementaryErrorFunction(1)).toBeCloseTo(0.8427007929, 10);
    expect(1 - complementaryErrorFunction(2)).toBeCloseTo(0.995322265, 10);
    // erfc(-x) = 2 - erfc(x) (symmetry of erf, A&S eq. 7.1.9).
    expect(complementaryErrorFunction(-1)).toBeCloseTo(2 - complementaryErrorFunction(1), 15);
  });

  it('keeps relative precision deep in the tail: erfc(10) = 2.088487583762545e-45 (mpmath 1.3.0 erfc, 16 digits)', () => {
    expect(Math.abs(complementaryErrorFunction(10) / 2.088487583762545e-45 - 1)).toBeLessThan(1e-14);
  });
});

describe('standard normal tail probabilities', () => {
  it('give the two-sided 95% point: Q(1.959963984540054) = 0.025 (scipy 1.17.1 norm.sf; qnorm(0.975) in R)', () => {
    expect(standardNormalSurvival(1.959963984540054)).toBeCloseTo(0.025, 15);
    expect(standardNormalCumulative(-1.959963984540054)).toBeCloseTo(0.025, 15);
    expect(standardNormalCumulative(1) - standardNormalCumulative(-1)).toBeCloseTo(0.6826894921370859, 15);
  });

  it('inverts in the far tail: the survival quantile of Q(8) returns 8 (round trip, common practice)', () => {
    const tail = standardNormalSurvival(8); // 6.22096057427178e-16 (scipy 1.17.1 norm.sf(8))
    expect(tail / 6.22096057427178e-16).toBeCloseTo(1, 12);
    expect(standardNormalSurvivalQuantile(tail)).toBeCloseTo(8, 12);
    expect(standardNormalSurvivalQuantile(0.025)).toBeCloseTo(1.959963984540054, 14);
  });

  it('has the log density -z^2/2 - ln(2 pi)/2 (normal law): phi(0) = 0.3989422804014327', () => {
    expect(Math.exp(logStandardNormalDensity(0))).toBeCloseTo(0.3989422804014327, 16);
    expect(logStandardNormalDensity(2) - logStandardNormalDensity(0)).toBeCloseTo(-2, 15);
  });
});
