import { describe, expect, it } from 'vitest';
import { withoutModeColumns } from '../../src/data/index.js';

/** C = U U^T of N x K row-major modes (the definition of the modes' covariance, common practice). */
function covarianceOf(values: Float64Array, count: number, modeCount: number): number[] {
  const c: number[] = [];
  for (let i = 0; i < count; i++) for (let j = 0; j < count; j++) {
    let sum = 0;
    for (let k = 0; k < modeCount; k++) sum += values[i * modeCount + k] * values[j * modeCount + k];
    c.push(sum);
  }
  return c;
}

// Three supernovae, three modes (mag): a calibration offset, a redshift drift and a host-mass split.
const modes = { count: 3, modeCount: 3, values: Float64Array.of(0.01, 0.00, 0.02, 0.01, 0.01, -0.02, 0.01, 0.02, 0.02), sourceFile: 'modes.csv', columnNames: ['calibration', 'drift', 'host'] };

describe('withoutModeColumns', () => {
  it('leaves the covariance of the kept columns only: U U^T minus u_k u_k^T of each removed column k', () => {
    const kept = withoutModeColumns(modes, new Set([1]))!;
    const u0 = [0.01, 0.01, 0.01];
    const u2 = [0.02, -0.02, 0.02];
    const expected = u0.flatMap((_, i) => u0.map((__, j) => u0[i] * u0[j] + u2[i] * u2[j]));
    covarianceOf(kept.values, 3, 3).forEach((value, n) => expect(value).toBeCloseTo(expected[n], 15));
  });

  it('keeps the width, the other columns in place and the names, and does not change its input', () => {
    const kept = withoutModeColumns(modes, new Set([0, 2]))!;
    expect(kept).toMatchObject({ count: 3, modeCount: 3, sourceFile: 'modes.csv', columnNames: ['calibration', 'drift', 'host'] });
    expect(Array.from(kept.values)).toEqual([0, 0, 0, 0, 0.01, 0, 0, 0.02, 0]);
    expect(Array.from(modes.values)).toEqual([0.01, 0.00, 0.02, 0.01, 0.01, -0.02, 0.01, 0.02, 0.02]);
  });

  it('gives null when every column is removed, and an equal copy when none is', () => {
    expect(withoutModeColumns(modes, new Set([0, 1, 2]))).toBeNull();
    const copy = withoutModeColumns(modes, new Set())!;
    expect(copy.values).not.toBe(modes.values);
    expect(Array.from(copy.values)).toEqual(Array.from(modes.values));
  });
});
