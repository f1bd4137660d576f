import { CandelaError } from '../errors.js';
import type { MockSurveyOptions } from './mockSurveyOptions.js';

/** Largest survey with a dense systematic covariance: 10^4 supernovae take 800 MB of doubles. */
export const MAX_COVARIANCE_SUPERNOVAE = 10_000;

/**
 * The covariance of the mock's systematic modes on the magnitudes:
 *
 *   C_ij = s_cal(sample_i)^2 [sample_i = sample_j] + s_drift^2 z_i z_j,
 *
 * a coherent calibration offset per sample (standard deviation s_cal) and a
 * magnitude drift eps z with eps ~ N(0, s_drift^2). Symmetric bit for bit
 * (the drift term is computed as s_drift^2 (z_i z_j), and z_i z_j = z_j z_i exactly). Cost O(N^2) time and memory.
 * @param options the survey design (calibration offsets per sample, drift; mag).
 * @param redshift the Hubble-diagram redshift per supernova.
 * @param sampleIndex index into options.samples per supernova.
 * @returns N x N row major, mag^2, or null when no mode is on.
 * @throws CandelaError `mock.covariance_too_large` above {@link MAX_COVARIANCE_SUPERNOVAE} supernovae with a mode on.
 * @example systematicCovariance(options, Float64Array.of(0.1, 0.5), Int32Array.of(0, 0)) // [s^2 + d^2 0.01, s^2 + d^2 0.05, ...]
 */
export function systematicCovariance(options: MockSurveyOptions, redshift: Float64Array, sampleIndex: Int32Array): Float64Array | null {
  const anyCalibration = options.samples.some((s) => s.calibrationOffsetMag > 0);
  if (!anyCalibration && !(options.redshiftDriftMag > 0)) return null;
  const n = redshift.length;
  if (n > MAX_COVARIANCE_SUPERNOVAE) {
    throw new CandelaError({
      code: 'mock.covariance_too_large', path: 'samples', message: `a dense systematic covariance of ${n} supernovae would need ${((8 * n * n) / 1e9).toFixed(1)} GB`,
      expected: `at most ${MAX_COVARIANCE_SUPERNOVAE} supernovae with calibration offsets or a redshift drift`, found: String(n),
      fix: 'set calibration_offset_mag and redshift_drift_mag to 0, or draw fewer supernovae',
    });
  }
  const covariance = new Float64Array(n * n);
  const calibrationVariance = options.samples.map((s) => s.calibrationOffsetMag * s.calibrationOffsetMag);
  const driftVariance = options.redshiftDriftMag * options.redshiftDriftMag;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < n; j++) {
      let value = driftVariance * (redshift[i] * redshift[j]);
      if (sampleIndex[i] === sampleIndex[j]) value += calibrationVariance[sampleIndex[i]];
      covariance[row + j] = value;
    }
  }
  return covariance;
}
