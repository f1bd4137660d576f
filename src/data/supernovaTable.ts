/**
 * The supernova sample as the numerical core sees it: one typed column per
 * field, all of length `count`, in file order after cuts. Missing optional
 * values are NaN in their column (a column that the file does not provide is
 * `undefined`). Magnitudes in mag, host masses in log10(M / M_sun).
 */
export interface SupernovaTable {
  /** `light_curves`: m_B, x1, c (+ errors, covariances); `magnitudes`: standardized magnitude or distance modulus. */
  kind: 'light_curves' | 'magnitudes';
  /** Number of supernovae (rows kept). */
  count: number;
  /** Identifier per supernova. */
  ids: string[];
  /** Sample (survey) label per supernova ('all' when the file has none). */
  samples: string[];
  /** The distinct sample labels, in first-seen order. */
  sampleNames: string[];
  /** Index into sampleNames per supernova. */
  sampleIndex: Int32Array;
  /** Redshift used for distances (CMB frame / Hubble-diagram redshift). */
  redshift: Float64Array;
  /** Heliocentric redshift for the (1+z_hel) factor; equals `redshift` when the file has none. */
  redshiftHelio: Float64Array;
  /** Redshift uncertainty (0 when absent). */
  redshiftErr: Float64Array;

  /** For `magnitudes`: standardized magnitude or distance modulus, mag. */
  magnitude?: Float64Array;
  /** For `magnitudes`: its uncertainty, mag. */
  magnitudeErr?: Float64Array;

  /** For `light_curves`: peak rest-frame B magnitude m_B, mag. */
  peakMag?: Float64Array;
  peakMagErr?: Float64Array;
  /** SALT stretch x1 (dimensionless). */
  stretch?: Float64Array;
  stretchErr?: Float64Array;
  /** SALT colour c, mag. */
  color?: Float64Array;
  colorErr?: Float64Array;
  /** Light-curve fit covariances, in the units of the pairs. */
  covPeakMagStretch?: Float64Array;
  covPeakMagColor?: Float64Array;
  covStretchColor?: Float64Array;
  /** log10 host stellar mass (NaN = unknown) and its uncertainty. */
  hostLogMass?: Float64Array;
  hostLogMassErr?: Float64Array;
  /** Bias correction to subtract from the standardized magnitude, mag (0 when absent). */
  biasCorrectionMag?: Float64Array;
  /** External (e.g. Cepheid) distance modulus for calibrators, mag; NaN for Hubble-flow supernovae. */
  calibratorMu?: Float64Array;

  /** 1-based line number in the source file, per supernova, for messages. */
  sourceLine: Int32Array;
  /** The file the rows came from (for a concatenation: the names joined with ' + '). */
  sourceFile: string;
  /** Set by concatenateTables: the files the rows came from, in order. */
  sourceFiles?: string[];
  /** Set by concatenateTables: per supernova, the index into `sourceFiles`. */
  sourceFileIndex?: Int32Array;
}

/**
 * A dense covariance matrix read from a file, after scaling.
 * `target: 'magnitudes'` is N x N on the standardized magnitudes;
 * `target: 'light_curves'` is 3N x 3N on (m_B, x1, c), stored in the
 * canonical interleaved order (m_B1, x1_1, c_1, m_B2, ...) whatever the file used.
 */
export interface CovarianceMatrix {
  target: 'magnitudes' | 'light_curves';
  /** Matrix dimension (N or 3N). */
  size: number;
  /** Row-major size x size values, already multiplied by the configured scale. */
  values: Float64Array;
  /** The file it came from. */
  sourceFile: string;
}

/**
 * Systematic uncertainties given as modes: each mode k is the shift (mag) of
 * every supernova's magnitude produced by a one-standard-deviation change of
 * one systematic, so that their covariance is C_sys = U U^T. Adding U U^T to
 * a diagonal covariance keeps it positive definite and lets the likelihood use
 * the Woodbury identity instead of an N x N matrix.
 */
export interface SystematicModes {
  /** Number of supernovae N (rows of U, in table order). */
  count: number;
  /** Number of modes K (columns of U). */
  modeCount: number;
  /** U, N x K row major (the K mode shifts of supernova i at i*K .. i*K+K-1), mag, already scaled. */
  values: Float64Array;
  /** The file(s) they came from. */
  sourceFile: string;
  /** The names of the K modes from the file's header line, when it has one (readSystematicModes only; cuts and joins drop them). */
  columnNames?: string[];
}
