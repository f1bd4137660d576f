import { describe, expect, it } from 'vitest';
import { errorAtRedshift, expectedResidualVariance, lightCurveErrors } from '../../src/mock/index.js';
import { sampleDesign, surveyOptions } from './mockDesigns.js';

describe('lightCurveErrors', () => {
  it('returns sigma = base + slope z and a Cholesky factor with L L^T = C (Golub & Van Loan, algorithm 4.2.1)', () => {
    const design = sampleDesign('a', 1, 0.1, 1);
    const errors = lightCurveErrors(design, 0.5);
    expect(errors.peakMagSigma).toBeCloseTo(errorAtRedshift(design.errors.peakMagMag, 0.5), 15);
    expect(errors.stretchSigma).toBeCloseTo(0.1 + 0.9 * 0.5, 15);
    const [l00, l10, l11, l20, l21, l22] = errors.factor;
    const product = [
      [l00 * l00, l00 * l10, l00 * l20],
      [l10 * l00, l10 * l10 + l11 * l11, l10 * l20 + l11 * l21],
      [l20 * l00, l20 * l10 + l21 * l11, l20 * l20 + l21 * l21 + l22 * l22],
    ];
    const s = [errors.peakMagSigma, errors.stretchSigma, errors.colorSigma];
    const expected = [
      [s[0] ** 2, errors.covPeakMagStretch, errors.covPeakMagColor],
      [errors.covPeakMagStretch, s[1] ** 2, errors.covStretchColor],
      [errors.covPeakMagColor, errors.covStretchColor, s[2] ** 2],
    ];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(product[i][j]).toBeCloseTo(expected[i][j], 14);
    expect(errors.covPeakMagColor).toBeCloseTo(0.4 * s[0] * s[2], 15);
  });

  it('rejects correlations that are not jointly positive definite', () => {
    const design = sampleDesign('a', 1, 0.1, 1);
    design.errors.correlationPeakMagStretch = 0.9;
    design.errors.correlationPeakMagColor = 0.9;
    design.errors.correlationStretchColor = -0.9;
    expect(() => lightCurveErrors(design, 0.5)).toThrow(/positive-definite/);
  });
});

describe('expectedResidualVariance', () => {
  it('follows the light-curve part of the JLA covariance (Betoule et al. 2014, eq. 13 from memory) plus the scatter terms', () => {
    // Written out by hand at z = 0.5: sigma_mB 0.07, sigma_x1 0.55, sigma_c 0.055, alpha 0.14, beta 3.1.
    const options = surveyOptions([sampleDesign('a', 1, 0.1, 1)]);
    const sm = 0.07; const sx = 0.55; const sc = 0.055;
    const lightCurve = sm ** 2 + (0.14 * sx) ** 2 + (3.1 * sc) ** 2 + 2 * 0.14 * 0.15 * sm * sx - 2 * 3.1 * 0.4 * sm * sc - 2 * 0.14 * 3.1 * -0.2 * sx * sc;
    const velocity = ((5 / Math.LN10) * 300) / (299792.458 * 0.5);
    const expected = lightCurve + 0.1 ** 2 + (0.055 * 0.5) ** 2 + velocity ** 2;
    expect(expectedResidualVariance(options, options.samples[0], 0.5)).toBeCloseTo(expected, 14);
  });
});
