import { describe, expect, it } from 'vitest';
import { SIGNIFICANCE_CAUTION, deltaChiSquareSignificance, twoSidedGaussianSigma } from '../../src/compare/index.js';

describe('deltaChiSquareSignificance', () => {
  it('turns delta chi2 = 1, 4, 9 with one extra parameter into 1, 2, 3 sigma (P(|Z| > sqrt(delta chi2)), common practice)', () => {
    expect(deltaChiSquareSignificance(1, 1).sigma).toBeCloseTo(1, 12);
    expect(deltaChiSquareSignificance(4, 1).sigma).toBeCloseTo(2, 12);
    expect(deltaChiSquareSignificance(9, 1).sigma).toBeCloseTo(3, 12);
    // p-values: 2 (1 - Phi(n)) = 0.31731050786291415, 0.04550026389635839 (scipy 1.17.1 norm.sf).
    expect(deltaChiSquareSignificance(1, 1).pValue).toBeCloseTo(0.31731050786291415, 14);
    expect(deltaChiSquareSignificance(4, 1).pValue).toBeCloseTo(0.04550026389635839, 14);
  });

  it('reproduces the delta chi2 table of Press et al. (Numerical Recipes section 15.6, from memory; confirmed with scipy chi2.isf) to its 3 digits', () => {
    // [delta chi2, m, sigma]: 68.27% -> 2.30 (m = 2), 3.53 (m = 3); 95.45% -> 6.18 (m = 2); 99.73% -> 11.8 (m = 2), 14.2 (m = 3).
    const rows: Array<[number, number, number]> = [[2.3, 2, 1], [3.53, 3, 1], [6.18, 2, 2], [11.8, 2, 3], [14.2, 3, 3]];
    for (const [deltaChiSquare, m, sigma] of rows) expect(Math.abs(deltaChiSquareSignificance(deltaChiSquare, m).sigma - sigma), `${deltaChiSquare}, m = ${m}`).toBeLessThan(0.01);
    // Exact: scipy gives 2.2957489288986 for 1 sigma with 2 dof.
    expect(deltaChiSquareSignificance(2.295748928898636, 2).sigma).toBeCloseTo(1, 10);
  });

  it('stays finite when the p-value underflows: m = 1 gives exactly sqrt(delta chi2)', () => {
    const far = deltaChiSquareSignificance(2000, 1);
    expect(far.pValue).toBe(0);
    // ln p from mpmath 1.3.0: ln erfc(sqrt(1000)) = -1004.026741958951945.
    expect(far.logPValue).toBeCloseTo(-1004.026741958951945, 9);
    expect(far.sigma).toBeCloseTo(Math.sqrt(2000), 8);
    // m = 3, delta chi2 = 1500: mpmath 1.3.0 (50 digits) root of ln erfc(z / sqrt 2) = ln Q(3/2, 750) = -746.5685151578195
    // is z = 38.540636697468940528.
    expect(deltaChiSquareSignificance(1500, 3).sigma).toBeCloseTo(38.540636697468940528, 8);
  });

  it('counts a negative delta chi2 as no improvement and carries the caution about priors', () => {
    const result = deltaChiSquareSignificance(-0.2, 2);
    expect(result.pValue).toBe(1);
    expect(result.sigma).toBe(0);
    expect(result.caution).toBe(SIGNIFICANCE_CAUTION);
    expect(result.caution).toMatch(/ignores the priors/);
  });

  it('throws compare.invalid_argument for a fractional m or an infinite delta chi2', () => {
    const code = expect.objectContaining({ issues: [expect.objectContaining({ code: 'compare.invalid_argument' })] });
    expect(() => deltaChiSquareSignificance(3, 1.5)).toThrow(code);
    expect(() => deltaChiSquareSignificance(Infinity, 1)).toThrow(code);
    expect(() => twoSidedGaussianSigma(0.1)).toThrow(code);
  });
});
