// The mock's systematics as modes U (C_sys = U U^T) against the dense covariance.
import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { generateMockSurvey, MAX_COVARIANCE_SUPERNOVAE, systematicCovariance, systematicModeNames, systematicModes } from '../../src/mock/index.js';
import type { MockSurveyOptions } from '../../src/mock/index.js';
import { sampleDesign, surveyOptions } from './mockDesigns.js';

/**
 * Largest relative difference of U U^T from the dense matrix, element by
 * element: both are the same sums of positive terms (s_cal^2 and s_drift^2
 * z_i z_j, no cancellation), the drift product rounded as (s z_i)(s z_j)
 * instead of s^2 (z_i z_j): a few units in the last place, < 1e-15 relative
 * (source: definition of C_sys = U U^T; IEEE 754 rounding, common practice).
 */
const PRODUCT_RELATIVE_TOLERANCE = 1e-15;

/** Three samples, the middle one without a calibration offset, and a drift. */
function designWithModes(extra: Partial<MockSurveyOptions> = {}): MockSurveyOptions {
  const near = { ...sampleDesign('near', 30, 0.02, 0.1), calibrationOffsetMag: 0.012 };
  const mid = sampleDesign('mid', 20, 0.1, 0.4);
  const far = { ...sampleDesign('far', 25, 0.3, 1.2), calibrationOffsetMag: 0.02 };
  return surveyOptions([near, mid, far], { redshiftDriftMag: 0.03, ...extra });
}

/** U U^T, N x N, by the definition C_ij = sum_k U_ik U_jk. */
function outerProduct(values: Float64Array, n: number, k: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let m = 0; m < k; m++) sum += values[i * k + m] * values[j * k + m];
      out[i * n + j] = sum;
    }
  }
  return out;
}

function worstRelativeDifference(a: Float64Array, b: Float64Array): number {
  let worst = 0;
  for (let i = 0; i < a.length; i++) {
    if (a[i] === b[i]) continue;
    worst = Math.max(worst, Math.abs(a[i] - b[i]) / Math.max(Math.abs(a[i]), Math.abs(b[i])));
  }
  return worst;
}

describe('systematicModes', () => {
  it('gives U with U U^T equal to systematicCovariance (calibration per sample and drift)', () => {
    const options = designWithModes();
    const mock = generateMockSurvey(options);
    const { redshift, sampleIndex, count } = mock.table;
    const modes = systematicModes(options, redshift, sampleIndex)!;
    expect(modes.count).toBe(count);
    expect(modes.modeCount).toBe(3); // near, far, drift (mid has no offset)
    const dense = systematicCovariance(options, redshift, sampleIndex)!;
    // source: definition of C_sys = U U^T; tolerance PRODUCT_RELATIVE_TOLERANCE
    expect(worstRelativeDifference(outerProduct(modes.values, count, modes.modeCount), dense)).toBeLessThanOrEqual(PRODUCT_RELATIVE_TOLERANCE);
  });

  it('puts s_cal of a sample on its own rows only, and s_drift z_i in the last column', () => {
    const options = designWithModes();
    const redshift = Float64Array.of(0.05, 0.2, 0.8, 0.07);
    const sampleIndex = Int32Array.of(0, 1, 2, 0);
    const modes = systematicModes(options, redshift, sampleIndex)!;
    // Columns: calibration_near, calibration_far, redshift_drift (definition of the modes, docs/simulate.md).
    expect(Array.from(modes.values)).toEqual([
      0.012, 0, 0.03 * 0.05,
      0, 0, 0.03 * 0.2,
      0, 0.02, 0.03 * 0.8,
      0.012, 0, 0.03 * 0.07,
    ]);
    expect(systematicModeNames(options)).toEqual(['calibration_near', 'calibration_far', 'redshift_drift']);
  });

  it('equals the dense matrix exactly with calibration offsets only (products s_cal s_cal in both)', () => {
    const options = designWithModes({ redshiftDriftMag: 0 });
    const mock = generateMockSurvey(options);
    const { redshift, sampleIndex, count } = mock.table;
    const modes = systematicModes(options, redshift, sampleIndex)!;
    expect(systematicModeNames(options)).toEqual(['calibration_near', 'calibration_far']);
    // source: definition of C_sys = U U^T; the same single product per element, so bit for bit.
    expect(outerProduct(modes.values, count, modes.modeCount)).toEqual(systematicCovariance(options, redshift, sampleIndex));
  });

  it('is a single drift column when no sample has a calibration offset', () => {
    const options = surveyOptions([sampleDesign('a', 10, 0.02, 0.5)], { redshiftDriftMag: 0.05 });
    const mock = generateMockSurvey(options);
    const modes = systematicModes(options, mock.table.redshift, mock.table.sampleIndex)!;
    expect(modes.modeCount).toBe(1);
    expect(systematicModeNames(options)).toEqual(['redshift_drift']);
    expect(Array.from(modes.values)).toEqual(Array.from(mock.table.redshift, (z) => 0.05 * z));
  });

  it('is null when no mode is on', () => {
    const options = surveyOptions([sampleDesign('a', 5, 0.02, 0.1)]);
    expect(systematicModes(options, Float64Array.of(0.03), Int32Array.of(0))).toBeNull();
    expect(systematicModeNames(options)).toEqual([]);
    expect(generateMockSurvey(options).systematicModes).toBeNull();
  });
});

describe('generateMockSurvey with systematicsForm', () => {
  it("'matrix' (the default) returns both forms, 'modes' the modes only, with the same draws", () => {
    const matrix = generateMockSurvey(designWithModes());
    const modes = generateMockSurvey(designWithModes({ systematicsForm: 'modes' }));
    expect(matrix.systematicCovariance).not.toBeNull();
    expect(modes.systematicCovariance).toBeNull();
    expect(modes.systematicModes!.values).toEqual(matrix.systematicModes!.values);
    expect(modes.table.peakMag).toEqual(matrix.table.peakMag);
    expect(modes.systematicDraws).toEqual(matrix.systematicDraws);
  });

  it(`draws ${2 * MAX_COVARIANCE_SUPERNOVAE} supernovae with modes, where the matrix form refuses`, () => {
    const big = (form: 'matrix' | 'modes') => designWithModes({
      systematicsForm: form,
      samples: [{ ...sampleDesign('wide', 2 * MAX_COVARIANCE_SUPERNOVAE, 0.05, 1), calibrationOffsetMag: 0.01 }],
    });
    const mock = generateMockSurvey(big('modes'));
    expect(mock.table.count).toBe(2 * MAX_COVARIANCE_SUPERNOVAE);
    expect(mock.systematicModes!.values.length).toBe(2 * MAX_COVARIANCE_SUPERNOVAE * 2);
    let code = '';
    try {
      generateMockSurvey(big('matrix'));
    } catch (error) {
      if (isCandelaError(error)) code = error.issues[0].code;
    }
    expect(code).toBe('mock.covariance_too_large');
  });
});
