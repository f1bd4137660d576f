import { FIVE_OVER_LN10, SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';
import { errorAtRedshift } from './lightCurveErrors.js';
import type { MockSampleDesign, MockSurveyOptions } from './mockSurveyOptions.js';

/**
 * Expected variance of the Hubble residual of one mock supernova at the
 * truth (standardized with the true alpha, beta, M and step, compared with
 * the true cosmology at the observed redshift), mag^2:
 *
 *   sigma_mB^2 + alpha^2 sigma_x1^2 + beta^2 sigma_c^2 + 2 alpha C(mB,x1) - 2 beta C(mB,c) - 2 alpha beta C(x1,c)
 *   + sigma_int^2 + (lensing z)^2 + [(5 / ln 10) sigma_v / (c z)]^2
 *
 * the light-curve part of the JLA covariance (Betoule et al. 2014, eq. 13 from memory)
 * plus the scatter terms in their usual low-redshift form. The systematic
 * modes are not included (they are the off-diagonal covariance). Cost O(1).
 * @param options the survey (truth alpha, beta, sigma_int; lensing per unit z, mag; velocity dispersion, km/s).
 * @param design the supernova's sample (error models, correlations).
 * @param z redshift (> 0).
 * @example expectedResidualVariance(options, options.samples[0], 0.1) // about 0.02 for a typical design
 */
export function expectedResidualVariance(options: MockSurveyOptions, design: MockSampleDesign, z: number): number {
  const e = design.errors;
  const s0 = errorAtRedshift(e.peakMagMag, z);
  const s1 = errorAtRedshift(e.stretch, z);
  const s2 = errorAtRedshift(e.colorMag, z);
  const { alpha, beta } = options.truth;
  const lightCurve = s0 * s0 + alpha * alpha * s1 * s1 + beta * beta * s2 * s2 +
    2 * alpha * e.correlationPeakMagStretch * s0 * s1 - 2 * beta * e.correlationPeakMagColor * s0 * s2 -
    2 * alpha * beta * e.correlationStretchColor * s1 * s2;
  const velocity = (FIVE_OVER_LN10 * options.peculiarVelocityKmPerS) / (SPEED_OF_LIGHT_KM_PER_S * z);
  const lensing = options.lensingPerRedshift * z;
  return lightCurve + options.truth.sigmaIntMag ** 2 + velocity * velocity + lensing * lensing;
}
