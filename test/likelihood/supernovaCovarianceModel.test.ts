import { describe, expect, it } from 'vitest';
import type { CovarianceMatrix } from '../../src/data/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { createSupernovaCovarianceModel } from '../../src/likelihood/supernovaCovarianceModel.js';
import { syntheticSample } from './syntheticSample.js';

// C(alpha, beta) = A C_eta A^T + C_mag + U U^T + diag(variances), rows of A = (1, alpha, -beta)
// (Betoule et al. 2014, eq. 13), written out here element by element and compared with the model's
// fillDense, which builds the quadratic form in (alpha, beta) once and only combines it per call.
describe('createSupernovaCovarianceModel fillDense', () => {
  it('equals A C_eta A^T + C_mag + U U^T + diag(variances) written out by hand, on the lower triangle, at several alpha and beta', () => {
    const n = 12;
    const { table, systematic } = syntheticSample(n, 'covariance-model');
    const rng = createRandomStream('covariance-model/eta');
    // A dense, symmetric 3N x 3N light-curve covariance (not block diagonal): B B^T with a random B.
    const size = 3 * n;
    const b = Float64Array.from({ length: size * 4 }, () => 0.05 * rng.normal());
    const eta = new Float64Array(size * size);
    for (let i = 0; i < size; i++) for (let j = 0; j < size; j++) for (let k = 0; k < 4; k++) eta[i * size + j] += b[i * 4 + k] * b[j * 4 + k];
    const lightCurves: CovarianceMatrix = { target: 'light_curves', size, values: eta, sourceFile: 'eta' };
    const modeCount = 3;
    const modes = Float64Array.from({ length: n * modeCount }, () => 0.02 * rng.normal());
    const scatter = { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, includeRedshiftErrors: false };
    const model = createSupernovaCovarianceModel(table, [lightCurves, systematic], scatter, table.sampleIndex, 1, new Uint8Array(n),
      { count: n, modeCount, values: modes, sourceFile: 'modes' });
    const variancesOnly = createSupernovaCovarianceModel(table, [], scatter, table.sampleIndex, 1, new Uint8Array(n));
    for (const [alpha, beta, sigma] of [[0.14, 3.1, 0.1], [0.0, 0.0, 0.05], [0.3, 4.2, 0.2]]) {
      const inputs = Float64Array.of(alpha, beta, sigma);
      const out = new Float64Array(n * n).fill(Number.NaN);
      model.fillDense(inputs, out);
      const diagonal = new Float64Array(n);
      variancesOnly.fillVariances(inputs, diagonal);
      const w = [1, alpha, -beta];
      for (let i = 0; i < n; i++) {
        for (let j = 0; j <= i; j++) {
          let expected = systematic.values[i * n + j];
          for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) expected += w[p] * w[q] * eta[(3 * i + p) * size + 3 * j + q];
          for (let k = 0; k < modeCount; k++) expected += modes[i * modeCount + k] * modes[j * modeCount + k];
          if (i === j) expected += diagonal[i];
          expect(Math.abs(out[i * n + j] - expected), `(${i}, ${j}) at alpha ${alpha}, beta ${beta}`).toBeLessThan(1e-13 * Math.max(1, Math.abs(expected)));
        }
      }
    }
  });
});
