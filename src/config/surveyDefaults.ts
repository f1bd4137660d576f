/**
 * Defaults of the survey description (`candela simulate`). docs/simulate.md
 * lists the same values. A key the user leaves out takes the value here.
 */

/** Title used when the survey file gives none. */
export const DEFAULT_SURVEY_TITLE = 'untitled mock survey';

/**
 * Defaults of the top-level scatter settings: lensing 0.055 z mag (Jonsson
 * et al. 2010), 250 km/s peculiar velocities (common practice), no drift.
 */
export const DEFAULT_SURVEY_SCATTER = {
  lensingPerRedshift: 0.055,
  peculiarVelocityKmPerS: 250,
  redshiftDriftMag: 0,
} as const;

/** Defaults of the truth's optional entries: H0 70 km/s/Mpc, flat, no host-mass step, split at 10^10 M_sun (Sullivan et al. 2010). */
export const DEFAULT_SURVEY_TRUTH = {
  curvature: 'flat',
  h0KmPerSPerMpc: 70,
  massStepMag: 0,
  splitLogMass: 10,
} as const;

/** Defaults of a sample's optional entries. */
export const DEFAULT_SURVEY_SAMPLE = {
  shape: 'volume',
  correlation: 0,
  calibrationOffsetMag: 0,
} as const;

/**
 * Output folder (relative to the survey file), file names and the form of
 * the systematics file: `covariance` is the default name of the dense
 * matrix, `modesFile` the default name of the same key with
 * `systematics_form: modes` (a CSV of N rows x K modes).
 */
export const DEFAULT_SURVEY_OUTPUT = {
  dir: 'mock-survey',
  table: 'supernovae.csv',
  covariance: 'systematics.txt',
  modesFile: 'systematic_modes.csv',
  truth: 'truth.json',
  systematicsForm: 'matrix',
  namedModes: null,
} as const;

/** Systematics of the analysis: none by default; a coherent velocity moves z < 0.1 (the local volume, common practice). */
export const DEFAULT_ANALYSIS_SYSTEMATICS = {
  hostMassSplitDex: 0,
  coherentVelocityKmPerS: 0,
  coherentVelocityMaxRedshift: 0.1,
} as const;
