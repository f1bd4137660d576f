import { describe, expect, it } from 'vitest';
import { akaikeInformationCriterion, bayesianInformationCriterion, devianceInformationCriterion } from '../../src/compare/index.js';
import { createRandomStream } from '../../src/math/index.js';

/*
 * Worked example: a straight line y = a + b x fitted to 5 points with known
 * sigma = 0.3 (k = 2, N = 5). The best fit comes from the normal equations
 * written out as in Press et al. (2007, Numerical Recipes 3rd ed., section
 * 15.2, with its covariance of a and b).
 */
const x = [1, 2, 3, 4, 5];
const y = [2.1, 3.9, 6.2, 7.8, 10.1];
const sigma = 0.3;
const weight = 1 / (sigma * sigma);
const S = 5 * weight;
const Sx = x.reduce((sum, value) => sum + value * weight, 0);
const Sy = y.reduce((sum, value) => sum + value * weight, 0);
const Sxx = x.reduce((sum, value) => sum + value * value * weight, 0);
const Sxy = x.reduce((sum, value, i) => sum + value * y[i] * weight, 0);
const Delta = S * Sxx - Sx * Sx;
const interceptBest = (Sxx * Sy - Sx * Sxy) / Delta;
const slopeBest = (S * Sxy - Sx * Sy) / Delta;
const chiSquare = (a: number, b: number): number => x.reduce((sum, value, i) => sum + ((y[i] - a - b * value) / sigma) ** 2, 0);
const chiSquareMinimum = chiSquare(interceptBest, slopeBest);
/** -2 ln L = chi2 + sum ln(2 pi sigma^2) for independent Gaussian errors. */
const normalization = 5 * Math.log(2 * Math.PI * sigma * sigma);
const deviance = (a: number, b: number): number => chiSquare(a, b) + normalization;

describe('akaikeInformationCriterion and bayesianInformationCriterion', () => {
  it('give -2 ln L_max + 2k and -2 ln L_max + k ln N for the 5-point straight-line fit', () => {
    // By hand (centred sums): x_bar = 3, y_bar = 6.02, sum (x - 3)(y - 6.02) = 19.9, sum (x - 3)^2 = 10,
    // so b = 1.99, a = 0.05; residuals 0.06, -0.13, 0.18, -0.21, 0.10 give chi2_min = 0.107 / 0.09.
    expect(interceptBest).toBeCloseTo(0.05, 12);
    expect(slopeBest).toBeCloseTo(1.99, 12);
    const handChiSquare = 0.107 / 0.09;
    expect(chiSquareMinimum).toBeCloseTo(handChiSquare, 12);
    const bestDeviance = deviance(interceptBest, slopeBest);
    expect(akaikeInformationCriterion(bestDeviance, 2)).toBeCloseTo(handChiSquare + normalization + 4, 12);
    expect(bayesianInformationCriterion(bestDeviance, 2, 5)).toBeCloseTo(handChiSquare + normalization + 2 * Math.log(5), 12);
  });

  it('penalize one extra parameter by 2 (AIC) and ln N (BIC) at equal fit (definitions, Akaike 1974; Schwarz 1978)', () => {
    expect(akaikeInformationCriterion(50, 3) - akaikeInformationCriterion(50, 2)).toBe(2);
    expect(bayesianInformationCriterion(50, 3, 1000) - bayesianInformationCriterion(50, 2, 1000)).toBeCloseTo(Math.log(1000), 14);
  });

  it('throw compare.invalid_argument for a non-finite deviance or a fractional k', () => {
    expect(() => akaikeInformationCriterion(Number.NaN, 2)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'compare.invalid_argument' })] }));
    expect(() => bayesianInformationCriterion(1, 1.5, 10)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ path: 'freeParameterCount' })] }));
    expect(() => bayesianInformationCriterion(1, 1, 0)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ path: 'dataCount' })] }));
  });
});

describe('devianceInformationCriterion', () => {
  it('gives p_D = D_bar - D(theta_bar) and p_V = var(D)/2 on a hand example', () => {
    // D = 10, 12, 14 and D(theta_bar) = 10: D_bar = 12, p_D = 2, var = 4 (n - 1 form), p_V = 2.
    const result = devianceInformationCriterion(Float64Array.of(10, 12, 14), 10);
    expect(result).toEqual({ dic: 14, meanDeviance: 12, devianceAtPosteriorMean: 10, effectiveParameters: 2, effectiveParametersFromVariance: 2, dicFromVariance: 14 });
    // Equal weights change nothing.
    expect(devianceInformationCriterion(Float64Array.of(10, 12, 14), 10, Float64Array.of(3, 3, 3)).effectiveParametersFromVariance).toBeCloseTo(2, 14);
  });

  it('finds p_D = p_V = k = 2 for the straight line under flat priors (Spiegelhalter et al. 2002)', () => {
    // Exact posterior: (a, b) ~ N(best fit, C), C = [[Sxx, -Sx], [-Sx, S]] / Delta (NR section 15.2).
    const varianceA = Sxx / Delta;
    const varianceB = S / Delta;
    const covariance = -Sx / Delta;
    const l11 = Math.sqrt(varianceA);
    const l21 = covariance / l11;
    const l22 = Math.sqrt(varianceB - l21 * l21);
    const random = createRandomStream('straight-line-posterior');
    const draws = 20_000;
    const deviances = new Float64Array(draws);
    let meanA = 0;
    let meanB = 0;
    for (let k = 0; k < draws; k++) {
      const z1 = random.normal();
      const z2 = random.normal();
      const a = interceptBest + l11 * z1;
      const b = slopeBest + l21 * z1 + l22 * z2;
      meanA += a / draws;
      meanB += b / draws;
      deviances[k] = deviance(a, b);
    }
    const result = devianceInformationCriterion(deviances, deviance(meanA, meanB));
    // D - D_min ~ chi2 with 2 dof: mean 2 (MC error 2/sqrt(20000) = 0.014), variance 4 (MC error of p_V ~ 0.04).
    expect(Math.abs(result.effectiveParameters - 2)).toBeLessThan(0.06);
    expect(Math.abs(result.effectiveParametersFromVariance - 2)).toBeLessThan(0.2);
    expect(Math.abs(result.meanDeviance - (chiSquareMinimum + normalization + 2))).toBeLessThan(0.06);
  });

  it('throws compare.invalid_argument for too few draws, NaN deviances or negative weights', () => {
    const code = expect.objectContaining({ issues: [expect.objectContaining({ code: 'compare.invalid_argument' })] });
    expect(() => devianceInformationCriterion(Float64Array.of(1), 0)).toThrow(code);
    expect(() => devianceInformationCriterion(Float64Array.of(1, Number.NaN), 0)).toThrow(code);
    expect(() => devianceInformationCriterion(Float64Array.of(1, 2), 0, Float64Array.of(1, -1))).toThrow(code);
  });
});
