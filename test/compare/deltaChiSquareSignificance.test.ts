import { describe, expect, it } from 'vitest';
import {
  SIGNIFICANCE_CAUTION,
  deltaChiSquareSignificance,
  logGamma,
  logRegularizedGammaQ,
  regularizedGammaP,
  regularizedGammaQ,
  twoSidedGaussianSigma,
} from '../../src/compare/index.js';

describe('logGamma', () => {
  it('matches Gamma(x) of Abramowitz & Stegun (1964) Table 6.1 and mpmath 1.3.0 (30 digits) to 1e-14', () => {
    // [x, ln Gamma(x)] from mpmath.loggamma. A&S Table 6.1 tabulates Gamma on 1 <= x <= 2; its entries
    // Gamma(1.25) = 0.9064024771, Gamma(1.5) = 0.8862269255, Gamma(1.75) = 0.9190625268 (from memory) agree with mpmath.
    const reference: Array<[number, number]> = [
      [1e-8, 18.420680738180208905],
      [0.1, 2.2527126517342059599],
      [0.5, 0.57236494292470008707],
      [1.25, -0.098271836421813161464],
      [1.5, -0.12078223763524522235],
      [1.75, -0.084401121020485555958],
      [3.7, 1.4280723266653879219],
      [14.99, 25.164481163825505879],
      [15, 25.1912211827386815],
      [30.5, 72.953471184169408324],
      [1000, 5905.2204232091812118],
      [1e6, 12815504.56914761166],
    ];
    for (const [x, expected] of reference) expect(Math.abs(logGamma(x) - expected), `x = ${x}`).toBeLessThan(1e-14 * Math.max(1, Math.abs(expected)));
    expect(Math.exp(logGamma(1.25))).toBeCloseTo(0.9064024771, 10);
  });

  it('gives ln (n-1)! at the integers (Gamma(n) = (n-1)!, A&S eq. 6.1.6)', () => {
    let factorial = 1;
    for (let n = 1; n <= 20; n++) {
      expect(Math.abs(logGamma(n) - Math.log(factorial))).toBeLessThan(4e-15 * Math.max(1, Math.log(factorial)));
      factorial *= n;
    }
  });

  it('throws compare.invalid_argument for x <= 0', () => {
    expect(() => logGamma(0)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'compare.invalid_argument' })] }));
  });
});

describe('regularized incomplete gamma functions (Press et al. 2007, Numerical Recipes section 6.2)', () => {
  it('match mpmath 1.3.0 gammainc(regularized=True) at 30 digits on both branches, including deep tails', () => {
    // [a, x, Q(a, x), ln Q(a, x)]
    const reference: Array<[number, number, number, number]> = [
      [0.5, 0.5, 0.31731050786291410283, -1.1478744644493181964],
      [1, 2, 0.13533528323661269189, -2.0],
      [2.5, 0.1, 0.99911386121118755739, -0.00088653164188767325286],
      [2.5, 20, 1.4933679000503951839e-7, -15.717061746112256231],
      [5, 4.5, 0.53210357637471547756, -0.63091711615692923461],
      [5, 30, 3.6243009520614880262e-9, -19.435604408046576944],
      [0.5, 50, 1.5239706048321052132e-23, -52.538137969952525269],
      [10, 9, 0.58740824433194140624, -0.53203522502169271116],
      [50, 60, 0.084406681093691829623, -2.4721087206353381371],
      [0.5, 200, 5.5072482372124673902e-89, -203.22400819053731863],
    ];
    for (const [a, x, q, logQ] of reference) {
      expect(Math.abs(regularizedGammaQ(a, x) - q), `Q(${a}, ${x})`).toBeLessThan(1e-13 * q);
      expect(Math.abs(logRegularizedGammaQ(a, x) - logQ), `ln Q(${a}, ${x})`).toBeLessThan(1e-13 * Math.max(1, Math.abs(logQ)));
      expect(regularizedGammaP(a, x) + q).toBeCloseTo(1, 14);
    }
  });

  it('reproduce the chi-square percentage points of A&S (1964) Table 26.8: Q(nu/2, chi2/2) = tail probability', () => {
    // Full-precision points from scipy 1.17.1 scipy.stats.chi2.isf; A&S Table 26.8 prints them to 6 digits
    // (e.g. 3.84146, 5.99146, 7.81473, 11.0705, 18.3070, 43.7730 at Q = 0.05).
    const points: Array<[number, number, number]> = [
      [1, 0.05, 3.8414588206941285], [1, 0.01, 6.634896601021217], [2, 0.1, 4.605170185988092], [2, 0.05, 5.991464547107983],
      [3, 0.05, 7.814727903251178], [3, 0.5, 2.3659738843753377], [5, 0.05, 11.070497693516355], [5, 0.01, 15.086272469388991],
      [10, 0.05, 18.30703805327515], [10, 0.01, 23.20925115895436], [30, 0.05, 43.77297182574217], [30, 0.5, 29.336031516661585],
    ];
    for (const [nu, tail, chiSquare] of points) expect(regularizedGammaQ(nu / 2, chiSquare / 2), `nu = ${nu}, Q = ${tail}`).toBeCloseTo(tail, 12);
  });

  it('gives erf through P(1/2, x^2) (A&S section 6.5): P(1/2, 1/2) = erf(1/sqrt 2) = 0.6826894921370859 (common practice)', () => {
    expect(regularizedGammaP(0.5, 0.5)).toBeCloseTo(0.6826894921370859, 15);
  });
});

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
