import type { SurveyDescription } from '../../config/index.js';
import type { MockSurveyOptions } from '../../mock/index.js';

/**
 * The mock generator's options for a validated survey description: the
 * configuration type stops here, the mock layer sees plain numbers. The
 * form of the systematics (output.systematics_form) is passed on, so that
 * the 'modes' form never forms the dense N x N matrix.
 * Cost O(samples).
 * @param survey the survey description.
 * @param seed the seed to draw with (the description's, or a command-line override), as text.
 * @param noiseless draw the expected data (see MockSurveyOptions.noiseless).
 * @example mockOptionsFromSurvey(survey, String(survey.seed), false).samples.length // survey.samples.length
 */
export function mockOptionsFromSurvey(survey: SurveyDescription, seed: string, noiseless: boolean): MockSurveyOptions {
  const { truth } = survey;
  return {
    seed,
    noiseless,
    lensingPerRedshift: survey.lensingPerRedshift,
    peculiarVelocityKmPerS: survey.peculiarVelocityKmPerS,
    redshiftDriftMag: survey.redshiftDriftMag,
    systematicsForm: survey.output.systematicsForm,
    truth: {
      darkEnergy: truth.darkEnergy,
      flat: truth.curvature === 'flat',
      omegaMatter: truth.omegaMatter,
      omegaDarkEnergy: truth.omegaDarkEnergy ?? undefined,
      w0: truth.darkEnergy === 'lambda' ? undefined : truth.w0,
      wa: truth.darkEnergy === 'cpl' ? truth.wa : undefined,
      h0KmPerSPerMpc: truth.h0KmPerSPerMpc,
      alpha: truth.alpha,
      beta: truth.beta,
      absMagMag: truth.absMagMag,
      massStepMag: truth.massStepMag,
      massSplitLogMass: truth.splitLogMass,
      sigmaIntMag: truth.sigmaIntMag,
    },
    samples: survey.samples.map((sample) => ({
      label: sample.label,
      count: sample.count,
      redshift: { ...sample.redshift },
      stretch: { ...sample.stretch },
      color: { ...sample.color },
      hostLogMass: { ...sample.hostLogMass },
      errors: {
        peakMagMag: { atZero: sample.errors.peakMagMag.base, perRedshift: sample.errors.peakMagMag.perRedshift },
        stretch: { atZero: sample.errors.stretch.base, perRedshift: sample.errors.stretch.perRedshift },
        colorMag: { atZero: sample.errors.colorMag.base, perRedshift: sample.errors.colorMag.perRedshift },
        correlationPeakMagStretch: sample.errors.correlations.peakMagStretch,
        correlationPeakMagColor: sample.errors.correlations.peakMagColor,
        correlationStretchColor: sample.errors.correlations.stretchColor,
      },
      calibrationOffsetMag: sample.calibrationOffsetMag,
    })),
  };
}
