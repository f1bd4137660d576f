import type { SystematicModes } from '../data/index.js';
import type { MockSurveyOptions } from './mockSurveyOptions.js';

/** Column name of the redshift drift mode (the last column). */
export const REDSHIFT_DRIFT_MODE = 'redshift_drift';
/** Prefix of the calibration mode of a sample: `calibration_<label>`. */
export const CALIBRATION_MODE_PREFIX = 'calibration_';

/**
 * The names of the mock's systematic modes, in column order: one
 * `calibration_<label>` per sample with calibrationOffsetMag > 0 (in sample
 * order), then `redshift_drift` when redshiftDriftMag > 0. Empty when no mode is on.
 * Cost O(samples).
 * @param options the survey design (calibration offsets per sample, drift; mag).
 * @example systematicModeNames(surveyWith([near 0.01, far 0]), drift 0.02) // ['calibration_near', 'redshift_drift']
 */
export function systematicModeNames(options: MockSurveyOptions): string[] {
  const names = options.samples.filter((s) => s.calibrationOffsetMag > 0).map((s) => `${CALIBRATION_MODE_PREFIX}${s.label}`);
  if (options.redshiftDriftMag > 0) names.push(REDSHIFT_DRIFT_MODE);
  return names;
}

/**
 * The mock's systematics as modes U (N x K, mag), so that the systematic
 * covariance is C_sys = U U^T (the form the likelihood evaluates through
 * the Woodbury identity, Woodbury 1950, without an N x N matrix):
 *
 *   U_ik = s_cal(k) [sample_i = k]     for each sample k with s_cal(k) > 0,
 *   U_iK = s_drift z_i                 (last column, when s_drift > 0),
 *
 * one coherent calibration offset per sample (standard deviation s_cal of
 * that sample on its own rows, 0 elsewhere) and one magnitude drift eps z
 * with eps ~ N(0, s_drift^2). Column order: {@link systematicModeNames}.
 * U U^T equals systematicCovariance element by element up to rounding of
 * the products (s z_i)(s z_j) against s^2 (z_i z_j), a few units in the
 * last place. No size limit.
 * Cost O(N K) time and memory.
 * @param options the survey design (calibration offsets per sample, drift; mag).
 * @param redshift the Hubble-diagram redshift per supernova (the one systematicCovariance uses).
 * @param sampleIndex index into options.samples per supernova.
 * @returns the modes (sourceFile 'mock systematic modes'), or null when no mode is on.
 * @example systematicModes(options, Float64Array.of(0.1, 0.5), Int32Array.of(0, 0)).values // [s, d 0.1, s, d 0.5] (s_cal = s, s_drift = d)
 */
export function systematicModes(options: MockSurveyOptions, redshift: Float64Array, sampleIndex: Int32Array): SystematicModes | null {
  const modeOfSample = new Int32Array(options.samples.length).fill(-1);
  let modeCount = 0;
  options.samples.forEach((sample, index) => {
    if (sample.calibrationOffsetMag > 0) modeOfSample[index] = modeCount++;
  });
  const drift = options.redshiftDriftMag > 0;
  const driftColumn = modeCount;
  if (drift) modeCount++;
  if (modeCount === 0) return null;
  const n = redshift.length;
  const values = new Float64Array(n * modeCount);
  for (let i = 0; i < n; i++) {
    const row = i * modeCount;
    const mode = modeOfSample[sampleIndex[i]];
    if (mode >= 0) values[row + mode] = options.samples[sampleIndex[i]].calibrationOffsetMag;
    if (drift) values[row + driftColumn] = options.redshiftDriftMag * redshift[i];
  }
  return { count: n, modeCount, values, sourceFile: 'mock systematic modes' };
}
