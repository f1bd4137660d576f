/** The truth a mock survey was drawn from (the configuration's survey truth has this shape). */
export interface MockTruthFacts {
  darkEnergy: string;
  curvature: string;
  omegaMatter: number;
  /** null when flat. */
  omegaDarkEnergy: number | null;
  w0: number;
  wa: number;
  h0KmPerSPerMpc: number;
  alpha: number;
  beta: number;
  absMagMag: number;
  massStepMag: number;
  splitLogMass: number;
  sigmaIntMag: number;
}

/** One sample's design (the configuration's survey sample has this shape); its ranges and populations are written as given. */
export interface MockSampleFacts {
  label: string;
  count: number;
  redshift: object;
  stretch: object;
  color: object;
  hostLogMass: { mean: number; sd: number; errorDex: number };
  errors: {
    peakMagMag: { base: number; perRedshift: number };
    stretch: { base: number; perRedshift: number };
    colorMag: { base: number; perRedshift: number };
    correlations: { peakMagStretch: number; peakMagColor: number; stretchColor: number };
  };
  calibrationOffsetMag: number;
}

/** What truth.json records besides the files: provenance, truth, scatter, analysis systematics, samples, drawn offsets. */
export interface MockSurveyFacts {
  /** candela's version, for the generator entry. */
  version: string;
  surveyFile: string;
  title: string;
  seed: number | string;
  truth: MockTruthFacts;
  scatter: { lensingPerRedshift: number; peculiarVelocityKmPerS: number; redshiftDriftMag: number };
  /** Written only when one of them is on (a standard deviation > 0). */
  analysisSystematics: { hostMassSplitDex: number; coherentVelocityKmPerS: number; coherentVelocityMaxRedshift: number };
  samples: readonly MockSampleFacts[];
  /** The drawn offsets: per sample calibration offsets and the drift coefficient, mag. */
  drawnSystematics: { calibrationOffsetMag: Record<string, number>; redshiftDriftMag: number };
}

/**
 * truth.json of a mock survey: the facts under snake_case keys (the truth
 * under the parameter names), then `files`, the entries of the files
 * written beside it (name, size, SHA-256), as given.
 * @param facts what the survey was drawn from.
 * @param files the `files` entries.
 * @returns the JSON text, ending in a line break.
 * @throws nothing.
 * @example JSON.parse(mockTruthJson(facts, {})).truth.omega_m // facts.truth.omegaMatter
 */
export function mockTruthJson(facts: MockSurveyFacts, files: Record<string, unknown>): string {
  const analysis = facts.analysisSystematics;
  const analysisOn = analysis.hostMassSplitDex > 0 || analysis.coherentVelocityKmPerS > 0;
  const record = {
    about: 'truth of a candela mock supernova survey (see docs/simulate.md)',
    generator: { program: 'candela simulate', version: facts.version },
    survey_file: facts.surveyFile,
    title: facts.title,
    seed: facts.seed,
    truth: truthRecord(facts.truth),
    scatter: {
      lensing_per_redshift: facts.scatter.lensingPerRedshift,
      peculiar_velocity_km_s: facts.scatter.peculiarVelocityKmPerS,
      redshift_drift_mag: facts.scatter.redshiftDriftMag,
    },
    ...(analysisOn ? {
      analysis_systematics: {
        host_mass_split_dex: analysis.hostMassSplitDex, coherent_velocity_km_s: analysis.coherentVelocityKmPerS,
        coherent_velocity_max_redshift: analysis.coherentVelocityMaxRedshift,
      },
    } : {}),
    samples: facts.samples.map(sampleRecord),
    drawn_systematics: {
      calibration_offset_mag: facts.drawnSystematics.calibrationOffsetMag,
      redshift_drift_mag: facts.drawnSystematics.redshiftDriftMag,
    },
    files,
  };
  return `${JSON.stringify(record, null, 2)}\n`;
}

function truthRecord(t: MockTruthFacts): Record<string, string | number> {
  return {
    dark_energy: t.darkEnergy, curvature: t.curvature, omega_m: t.omegaMatter,
    ...(t.omegaDarkEnergy === null ? {} : { omega_de: t.omegaDarkEnergy }),
    w0: t.w0, wa: t.wa, h0: t.h0KmPerSPerMpc, alpha: t.alpha, beta: t.beta, abs_mag: t.absMagMag,
    mass_step: t.massStepMag, split_log_mass: t.splitLogMass, sigma_int: t.sigmaIntMag,
  };
}

function sampleRecord(sample: MockSampleFacts) {
  const line = (model: { base: number; perRedshift: number }) => ({ base: model.base, per_z: model.perRedshift });
  return {
    label: sample.label,
    count: sample.count,
    redshift: { ...sample.redshift },
    stretch: { ...sample.stretch },
    color: { ...sample.color },
    host_log_mass: { mean: sample.hostLogMass.mean, sd: sample.hostLogMass.sd, error: sample.hostLogMass.errorDex },
    errors: {
      m_b: line(sample.errors.peakMagMag), x1: line(sample.errors.stretch), color: line(sample.errors.colorMag),
      correlations: {
        m_b_x1: sample.errors.correlations.peakMagStretch,
        m_b_color: sample.errors.correlations.peakMagColor,
        x1_color: sample.errors.correlations.stretchColor,
      },
    },
    calibration_offset_mag: sample.calibrationOffsetMag,
  };
}
