import { describe, expect, it } from 'vitest';
import { subsetCovariance, subsetSystematicModes, type CovarianceMatrix, type SystematicModes } from '../../src/data/index.js';

/** U with 4 supernovae and 2 modes: U[i][k] = 10 (i + 1) + (k + 1), so every entry names its row and column. */
const MODES: SystematicModes = {
  count: 4, modeCount: 2, values: Float64Array.of(11, 12, 21, 22, 31, 32, 41, 42), sourceFile: 'modes.csv',
};

/** U U^T, N x N, summed in the order of the modes. */
function outerProduct(modes: SystematicModes): CovarianceMatrix {
  const n = modes.count;
  const k = modes.modeCount;
  const values = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let m = 0; m < k; m++) sum += modes.values[i * k + m] * modes.values[j * k + m];
      values[i * n + j] = sum;
    }
  }
  return { target: 'magnitudes', size: n, values, sourceFile: modes.sourceFile };
}

describe('subsetSystematicModes', () => {
  it('keeps the rows of the kept supernovae, in the order of keptIndices, and every mode', () => {
    const kept = subsetSystematicModes(MODES, Int32Array.of(3, 0, 2));
    expect(kept.count).toBe(3);
    expect(kept.modeCount).toBe(2);
    expect(Array.from(kept.values)).toEqual([41, 42, 11, 12, 31, 32]); // rows 4, 1, 3 by the naming rule above
    expect(kept.sourceFile).toBe('modes.csv');
  });

  it('gives the covariance of the kept supernovae: U_kept U_kept^T = rows and columns of U U^T (exact algebra)', () => {
    const keptIndices = Int32Array.of(1, 3);
    const fromModes = outerProduct(subsetSystematicModes(MODES, keptIndices));
    const fromMatrix = subsetCovariance(outerProduct(MODES), keptIndices);
    expect(Array.from(fromModes.values)).toEqual(Array.from(fromMatrix.values)); // same products in the same order: bit-identical
  });

  it('keeps no row for an empty selection and does not modify its input', () => {
    const before = Array.from(MODES.values);
    expect(subsetSystematicModes(MODES, new Int32Array(0))).toMatchObject({ count: 0, modeCount: 2 });
    expect(Array.from(MODES.values)).toEqual(before);
  });

  it('throws a RangeError for an index outside the table', () => {
    expect(() => subsetSystematicModes(MODES, Int32Array.of(0, 4))).toThrow(RangeError);
    expect(() => subsetSystematicModes(MODES, Int32Array.of(-1))).toThrow(RangeError);
  });
});
