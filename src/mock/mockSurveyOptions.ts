import type { DarkEnergyLaw } from '../cosmology/index.js';

/** A linear error model sigma(z) = atZero + perRedshift * z, in the quantity's units. */
export interface LinearErrorModel {
  atZero: number;
  perRedshift: number;
}

/** One sample (survey) of a mock: how many supernovae, where, and how well measured. */
export interface MockSampleDesign {
  label: string;
  count: number;
  /** Redshift range and shape: `volume` draws from a constant volumetric rate, dN/dz ∝ D_C^2 / (E(z) (1+z)); `uniform` is flat in z. */
  redshift: { min: number; max: number; shape: 'volume' | 'uniform' };
  /** Population of true stretch x1 (Gaussian). */
  stretch: { mean: number; sd: number };
  /** Population of true colour c (Gaussian), mag. */
  color: { mean: number; sd: number };
  /** Population of host log10 stellar mass (Gaussian), and its measurement error, dex. */
  hostLogMass: { mean: number; sd: number; errorDex: number };
  /** Measurement errors growing with redshift. */
  errors: {
    peakMagMag: LinearErrorModel;
    stretch: LinearErrorModel;
    colorMag: LinearErrorModel;
    /** Correlation coefficients of the light-curve fit errors. */
    correlationPeakMagStretch: number;
    correlationPeakMagColor: number;
    correlationStretchColor: number;
  };
  /** Standard deviation of a coherent calibration offset of this sample, mag (a systematic mode; 0 = none). */
  calibrationOffsetMag: number;
}

/** The true values a mock is drawn from. */
export interface MockTruth {
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  omegaMatter: number;
  omegaDarkEnergy?: number;
  w0?: number;
  wa?: number;
  h0KmPerSPerMpc: number;
  alpha: number;
  beta: number;
  /** Absolute magnitude M_B of a fiducial supernova (x1 = 0, c = 0, halfway between host-mass classes), mag. */
  absMagMag: number;
  /** Host-mass step, added to mu as +step/2 (high mass) and -step/2 (low mass), mag. */
  massStepMag: number;
  /** Split of the host-mass step, log10 M_sun. */
  massSplitLogMass: number;
  /** Intrinsic scatter of the standardized magnitude, mag. */
  sigmaIntMag: number;
}

/** Everything needed to draw one mock survey. */
export interface MockSurveyOptions {
  samples: MockSampleDesign[];
  truth: MockTruth;
  /** Weak-lensing scatter per unit redshift, mag (0.055 following Jonsson et al. 2010). */
  lensingPerRedshift: number;
  /** Line-of-sight peculiar-velocity dispersion, km/s. */
  peculiarVelocityKmPerS: number;
  /** Standard deviation of a redshift-proportional magnitude drift eps * z, mag per unit z (a systematic mode; 0 = none). */
  redshiftDriftMag: number;
  /** Seed of the random stream. */
  seed: string;
  /**
   * Expected data instead of a realisation: every deviate of measurement
   * noise, intrinsic, lensing and peculiar-velocity scatter and every
   * systematic offset is set to zero, while the redshifts, the true
   * populations and the error columns are drawn exactly as with noise
   * (the same seed gives the same supernovae). Default false.
   */
  noiseless?: boolean;
  /**
   * How the systematics are returned: 'matrix' (default) also forms the
   * dense N x N covariance (at most MAX_COVARIANCE_SUPERNOVAE supernovae);
   * 'modes' returns only the N x K modes U (C = U U^T), with no size limit.
   */
  systematicsForm?: 'matrix' | 'modes';
}
