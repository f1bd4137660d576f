import { CandelaError } from '../errors.js';
import type { LinearErrorModel, MockSampleDesign } from './mockSurveyOptions.js';

/** The 3 x 3 light-curve fit error covariance of one supernova, on (m_B, x1, c). */
export interface LightCurveErrors {
  /** Standard deviations of m_B (mag), x1 and c (mag). */
  peakMagSigma: number;
  stretchSigma: number;
  colorSigma: number;
  /** Covariances cov(m_B, x1), cov(m_B, c) (mag^2) and cov(x1, c) (mag). */
  covPeakMagStretch: number;
  covPeakMagColor: number;
  covStretchColor: number;
  /** Lower Cholesky factor, row major [l00, l10, l11, l20, l21, l22], for drawing correlated noise. */
  factor: Float64Array;
}

/**
 * The value of a linear error model at a redshift.
 * @param model sigma(z) = atZero + perRedshift z, in the quantity's units.
 * @param z redshift.
 * @example errorAtRedshift({ atZero: 0.02, perRedshift: 0.1 }, 0.5) // 0.07
 */
export function errorAtRedshift(model: LinearErrorModel, z: number): number {
  return model.atZero + model.perRedshift * z;
}

/**
 * The light-curve error covariance of a sample's supernova at redshift z,
 * with its Cholesky factor (the 3 x 3 case written out: l00 = s0,
 * l10 = c01/l00, l11 = sqrt(s1^2 - l10^2), ...). Cost O(1).
 * @param design the sample's error model and correlations.
 * @param z redshift at which the errors are evaluated.
 * @throws CandelaError `mock.error_model` when a sigma is not positive, or
 *   `mock.error_correlation` when the correlations do not form a
 *   positive-definite matrix.
 * @example lightCurveErrors(design, 0.3).peakMagSigma // design.errors.peakMagMag at z = 0.3
 */
export function lightCurveErrors(design: MockSampleDesign, z: number): LightCurveErrors {
  const e = design.errors;
  const s0 = errorAtRedshift(e.peakMagMag, z);
  const s1 = errorAtRedshift(e.stretch, z);
  const s2 = errorAtRedshift(e.colorMag, z);
  if (!(s0 > 0 && s1 > 0 && s2 > 0)) {
    throw new CandelaError({
      code: 'mock.error_model', path: `samples.${design.label}.errors`, message: `a light-curve error is not positive at z = ${z}`,
      found: `sigma(m_B) = ${s0}, sigma(x1) = ${s1}, sigma(c) = ${s2}`, fix: 'give error models that stay positive over the redshift range',
    });
  }
  const c01 = e.correlationPeakMagStretch * s0 * s1;
  const c02 = e.correlationPeakMagColor * s0 * s2;
  const c12 = e.correlationStretchColor * s1 * s2;
  const l10 = c01 / s0;
  const l20 = c02 / s0;
  const l11 = Math.sqrt(s1 * s1 - l10 * l10);
  const l21 = (c12 - l20 * l10) / l11;
  const l22 = Math.sqrt(s2 * s2 - l20 * l20 - l21 * l21);
  if (!(l11 > 0 && l22 > 0)) {
    throw new CandelaError({
      code: 'mock.error_correlation', path: `samples.${design.label}.errors`,
      message: 'the light-curve error correlations do not form a positive-definite matrix',
      fix: 'use correlations with |rho| < 1 that are mutually consistent',
    });
  }
  return {
    peakMagSigma: s0, stretchSigma: s1, colorSigma: s2,
    covPeakMagStretch: c01, covPeakMagColor: c02, covStretchColor: c12,
    factor: Float64Array.of(s0, l10, l11, l20, l21, l22),
  };
}
