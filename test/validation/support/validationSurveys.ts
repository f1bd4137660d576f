// Validation helper (not a test): the mock surveys of the recovery and calibration checks and the
// supernova-term options that model them. Inputs only: every expectation in the checks comes from
// probability (coverage, rank uniformity), never from these designs' outputs.
import type { SupernovaTable } from '../../../src/data/index.js';
import type { DarkEnergyLaw } from '../../../src/cosmology/index.js';
import type { SupernovaTermOptions } from '../../../src/likelihood/index.js';
import type { MockSampleDesign, MockSurveyOptions, MockTruth } from '../../../src/mock/index.js';

/**
 * One sample with small light-curve covariate errors. Small on purpose: the
 * conventional Tripp likelihood attenuates alpha and beta by the reliability
 * ratio var(true) / (var(true) + sigma^2) (errors in variables, Fuller 1987,
 * sec. 1.1, from memory); with sigma_c = 0.004-0.012 mag against a colour
 * population width of 0.09 mag the predicted beta bias is ~ -0.02, a fraction
 * of its posterior sd, so that coverage tests the code, not that known bias.
 */
export function quietCovariatesDesign(label: string, count: number, redshiftMin: number, redshiftMax: number): MockSampleDesign {
  return {
    label, count, redshift: { min: redshiftMin, max: redshiftMax, shape: 'uniform' },
    stretch: { mean: 0.1, sd: 1.0 },
    color: { mean: -0.02, sd: 0.09 },
    // Host masses measured to 0.02 dex, so that the sharp step is rarely misassigned.
    hostLogMass: { mean: 10.1, sd: 0.6, errorDex: 0.02 },
    errors: {
      peakMagMag: { atZero: 0.04, perRedshift: 0.06 },
      stretch: { atZero: 0.04, perRedshift: 0.1 },
      colorMag: { atZero: 0.004, perRedshift: 0.008 },
      correlationPeakMagStretch: 0.1,
      correlationPeakMagColor: 0.3,
      correlationStretchColor: -0.1,
    },
    calibrationOffsetMag: 0,
  };
}

/**
 * Predicted bias of the conventional (Tripp) fit of alpha and beta caused by
 * errors in the measured stretch and colour: the errors-in-variables
 * attenuation of a least-squares slope (Fuller 1987, sec. 1.1, from memory),
 * including the light-curve error correlation with m_B, as an
 * inverse-variance weighted average over the supernovae:
 *   delta beta  = (-beta <sigma_c^2> + <cov(m_B, c)>) / (<width_c^2> + <sigma_c^2>)
 *   delta alpha = (-alpha <sigma_x1^2> - <cov(m_B, x1)>) / (<width_x1^2> + <sigma_x1^2>)
 * A one-regressor approximation (it ignores the other regressors and the fit's
 * exact weights): good to tens of per cent, enough to tell a known bias from a bug.
 * Cost: O(N).
 * @param table light-curve table (colour and stretch errors and covariances are read).
 * @param truth true alpha, beta, intrinsic scatter (mag) and lensing scatter per unit redshift (mag).
 * @param widths true population widths of x1 and c (mag) of each supernova's sample.
 * @example predictedTrippAttenuation(table, truth, () => ({ stretch: 1, colorMag: 0.09 })).betaBias // about -0.4 for the Kestrel demo
 */
export function predictedTrippAttenuation(
  table: SupernovaTable, truth: { alpha: number; beta: number; sigmaIntMag: number; lensingPerRedshift: number },
  widths: (sample: string) => { stretch: number; colorMag: number },
): { alphaBias: number; betaBias: number } {
  let colorVariance = 0, colorCovariance = 0, colorWidth = 0, stretchVariance = 0, stretchCovariance = 0, stretchWidth = 0;
  for (let i = 0; i < table.count; i++) {
    const sigmaStretch = table.stretchErr![i];
    const sigmaColor = table.colorErr![i];
    const weight = 1 / (truth.sigmaIntMag ** 2 + table.peakMagErr![i] ** 2 + (truth.alpha * sigmaStretch) ** 2 + (truth.beta * sigmaColor) ** 2 + (truth.lensingPerRedshift * table.redshift[i]) ** 2);
    const width = widths(table.samples[i]);
    colorVariance += weight * sigmaColor ** 2;
    colorCovariance += weight * table.covPeakMagColor![i];
    colorWidth += weight * width.colorMag ** 2;
    stretchVariance += weight * sigmaStretch ** 2;
    stretchCovariance += weight * table.covPeakMagStretch![i];
    stretchWidth += weight * width.stretch ** 2;
  }
  return {
    alphaBias: (-truth.alpha * stretchVariance - stretchCovariance) / (stretchWidth + stretchVariance),
    betaBias: (-truth.beta * colorVariance + colorCovariance) / (colorWidth + colorVariance),
  };
}

/** A mock survey: the samples, the truth, and scatter terms that the likelihood models exactly (lensing Gaussian, velocities linearized). */
export function mockOptions(samples: MockSampleDesign[], truth: MockTruth, seed: string, scatter: { lensingPerRedshift: number; peculiarVelocityKmPerS: number }): MockSurveyOptions {
  return { samples, truth, ...scatter, redshiftDriftMag: 0, seed };
}

/** Options of the conventional supernova term for a mock table (diagonal per-supernova covariance, no dense matrix). */
export function mockTermOptions(table: SupernovaTable, model: { darkEnergy: DarkEnergyLaw; flat: boolean }, settings: {
  massStep: boolean; lensingPerRedshift: number; peculiarVelocityKmPerS: number; offset: 'marginalize' | 'sample'; fixed: Record<string, number>;
}): SupernovaTermOptions {
  return {
    name: 'mock', table, covariances: [],
    cosmologyModel: { darkEnergy: model.darkEnergy, flat: model.flat, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
    standardization: {
      massStep: { enabled: settings.massStep, splitLogMass: 10, shape: 'sharp', widthDex: 0 },
      scatter: { lensingPerRedshift: settings.lensingPerRedshift, peculiarVelocityKmPerS: settings.peculiarVelocityKmPerS, includeRedshiftErrors: false },
      intrinsicScatter: 'global', alphaBetaCovariance: 'exact',
    },
    offset: settings.offset, fixed: settings.fixed,
  };
}
