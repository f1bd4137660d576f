// Survey designs for the mock tests: inputs only (the expected numbers come
// from the formulas named in each test, never from these designs' outputs).
import type { MockSampleDesign, MockSurveyOptions } from '../../src/mock/index.js';

/** A sample with typical light-curve error models (values chosen for the tests, common practice in size). */
export function sampleDesign(label: string, count: number, min: number, max: number, shape: 'volume' | 'uniform' = 'uniform'): MockSampleDesign {
  return {
    label, count, redshift: { min, max, shape },
    stretch: { mean: 0.2, sd: 1.1 },
    color: { mean: -0.02, sd: 0.09 },
    hostLogMass: { mean: 10.1, sd: 0.6, errorDex: 0.1 },
    errors: {
      peakMagMag: { atZero: 0.03, perRedshift: 0.08 },
      stretch: { atZero: 0.1, perRedshift: 0.9 },
      colorMag: { atZero: 0.02, perRedshift: 0.07 },
      correlationPeakMagStretch: 0.15,
      correlationPeakMagColor: 0.4,
      correlationStretchColor: -0.2,
    },
    calibrationOffsetMag: 0,
  };
}

/** A flat w0waCDM truth with typical nuisance values. */
export function surveyOptions(samples: MockSampleDesign[], extra: Partial<MockSurveyOptions> = {}): MockSurveyOptions {
  return {
    samples,
    truth: {
      darkEnergy: 'cpl', flat: true, omegaMatter: 0.3, w0: -0.9, wa: 0.2, h0KmPerSPerMpc: 70,
      alpha: 0.14, beta: 3.1, absMagMag: -19.3, massStepMag: 0.08, massSplitLogMass: 10, sigmaIntMag: 0.1,
    },
    lensingPerRedshift: 0.055,
    peculiarVelocityKmPerS: 300,
    redshiftDriftMag: 0,
    seed: 'mock-tests',
    ...extra,
  };
}
