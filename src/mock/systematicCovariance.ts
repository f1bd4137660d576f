import type { MockSurveyOptions } from './mockSurveyOptions.js';

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
 * @example systematicCovariance(options, Float64Array.of(0.1, 0.5), Int32Array.of(0, 0)) // [s^2 + d^2 0.01, s^2 + d^2 0.05, ...]
 */
export function systematicCovariance(options: MockSurveyOptions, redshift: Float64Array, sampleIndex: Int32Array): Float64Array | null {
  const anyCalibration = options.samples.some((s) => s.calibrationOffsetMag > 0);
  if (!anyCalibration && !(options.redshiftDriftMag > 0)) return null;
  const n = redshift.length;
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
