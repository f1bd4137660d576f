/**
 * The validated description of a mock survey (`candela simulate`): the true
 * cosmology and nuisance parameters, the scatter and systematic modes, the
 * samples, and where the files go. YAML keys are snake_case; the same
 * settings here are camelCase with units in the names. docs/simulate.md
 * explains every key; defaults live in surveyDefaults.ts.
 */
import type { ResolvedPath } from './candelaConfig.js';

/** The parameter values the survey is drawn from. */
export interface SurveyTruth {
  darkEnergy: 'lambda' | 'constant_w' | 'cpl';
  curvature: 'flat' | 'free';
  omegaMatter: number;
  /** Omega_DE; given only with `curvature: free` (null when flat: 1 - Omega_m). */
  omegaDarkEnergy: number | null;
  /** -1 for `lambda`. */
  w0: number;
  /** 0 for `lambda` and `constant_w`. */
  wa: number;
  h0KmPerSPerMpc: number;
  /** Tripp (1998) stretch coefficient. */
  alpha: number;
  /** Tripp (1998) colour coefficient. */
  beta: number;
  /** Absolute magnitude of a supernova with x1 = 0, c = 0, halfway between the host-mass classes, mag. */
  absMagMag: number;
  /** Host-mass step (high-mass hosts' distance moduli raised by step/2, low-mass lowered by step/2), mag. */
  massStepMag: number;
  /** log10(M / M_sun) of the host-mass split. */
  splitLogMass: number;
  /** Intrinsic magnitude scatter, mag. */
  sigmaIntMag: number;
}

/** An uncertainty growing linearly with redshift: sigma(z) = base + perRedshift z, in the quantity's units. */
export interface SurveyErrorLine {
  base: number;
  perRedshift: number;
}

/** One sample (programme) of the survey. */
export interface SurveySample {
  /** Unique; names the sample column and per-sample parameters. */
  label: string;
  count: number;
  redshift: { min: number; max: number; shape: 'volume' | 'uniform' };
  /** Gaussian population of the true stretch x1. */
  stretch: { mean: number; sd: number };
  /** Gaussian population of the true colour c, mag. */
  color: { mean: number; sd: number };
  /** Gaussian population of log10 host mass and its measurement error, dex. */
  hostLogMass: { mean: number; sd: number; errorDex: number };
  /** Light-curve fit errors: m_B (mag), x1, c (mag), and their correlation coefficients. */
  errors: {
    peakMagMag: SurveyErrorLine;
    stretch: SurveyErrorLine;
    colorMag: SurveyErrorLine;
    correlations: { peakMagStretch: number; peakMagColor: number; stretchColor: number };
  };
  /** Standard deviation of the sample's coherent calibration offset, mag (0 = none). */
  calibrationOffsetMag: number;
}

/** Where `candela simulate` writes and under which names (plain file names inside `dir`). */
export interface SurveyOutput {
  dir: ResolvedPath;
  table: string;
  /** The systematics file (the matrix or the modes, by systematicsForm). */
  covariance: string;
  truth: string;
  /**
   * How the systematics are written: 'matrix', the dense N x N covariance
   * (at most 10,000 supernovae); 'modes', the N x K shifts U with C = U U^T
   * (no size limit).
   */
  systematicsForm: 'matrix' | 'modes';
  /**
   * A CSV of every systematic as a named mode (header line of names, one
   * column per mode: the drawn calibration and drift modes, then the analysis
   * systematics), for the systematic budget; null: not written.
   */
  namedModes: string | null;
}

/** Systematics of the analysis, written as modes but not drawn into the data (their truth is zero). */
export interface SurveyAnalysisSystematics {
  /** Standard deviation of the host-mass split, dex (0 = none). */
  hostMassSplitDex: number;
  /** Standard deviation of one coherent line-of-sight velocity of the local volume, km/s (0 = none). */
  coherentVelocityKmPerS: number;
  /** That velocity moves supernovae below this redshift only. */
  coherentVelocityMaxRedshift: number;
}

/** The whole validated survey description. */
export interface SurveyDescription {
  title: string;
  /** Seed of the random stream (integer or text, as written). */
  seed: number | string;
  truth: SurveyTruth;
  /** Lensing dispersion per unit redshift, mag. */
  lensingPerRedshift: number;
  /** Line-of-sight peculiar-velocity dispersion, km/s. */
  peculiarVelocityKmPerS: number;
  /** Standard deviation of the magnitude drift coefficient (drift = eps z), mag per unit redshift. */
  redshiftDriftMag: number;
  analysisSystematics: SurveyAnalysisSystematics;
  samples: SurveySample[];
  output: SurveyOutput;
  /** The survey file as given to the loader. */
  sourceFile: string;
}
