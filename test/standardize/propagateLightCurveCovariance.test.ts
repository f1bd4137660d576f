import { describe, expect, it } from 'vitest';
import type { SupernovaTable } from '../../src/data/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { lightCurveVariance, propagateLightCurveCovariance } from '../../src/standardize/index.js';

/** Explicit dense products: A (N x 3N) with rows (1, alpha, -beta) on the block diagonal, then A C A^T. */
function explicitProduct(cov: number[][], count: number, alpha: number, beta: number): number[][] {
  const a = Array.from({ length: count }, (_, i) => {
    const row = new Array<number>(3 * count).fill(0);
    row[3 * i] = 1;
    row[3 * i + 1] = alpha;
    row[3 * i + 2] = -beta;
    return row;
  });
  const multiply = (x: number[][], y: number[][]) => x.map((row) => y[0].map((_, j) => row.reduce((sum, value, k) => sum + value * y[k][j], 0)));
  const transpose = (x: number[][]) => x[0].map((_, j) => x.map((row) => row[j]));
  return multiply(multiply(a, cov), transpose(a));
}

describe('propagateLightCurveCovariance (Betoule et al. 2014)', () => {
  it('equals the explicit A C A^T on a random symmetric 3N x 3N matrix', () => {
    const count = 4;
    const size = 3 * count;
    const random = createRandomStream('propagate-test');
    // C = B B^T for a random B: symmetric positive semi-definite, all entries non-zero
    const b = Array.from({ length: size }, () => Array.from({ length: size }, () => random.normal()));
    const cov = b.map((row) => b.map((other) => row.reduce((sum, value, k) => sum + value * other[k], 0)));
    const flat = Float64Array.from(cov.flat());
    const out = propagateLightCurveCovariance(flat, count, 0.14, 3.1, new Float64Array(count * count));
    const expected = explicitProduct(cov, count, 0.14, 3.1);
    for (let i = 0; i < count; i++) {
      for (let j = 0; j < count; j++) {
        // same sums in another order: agreement to ~1e-12 relative (common practice for double precision)
        expect(out[i * count + j]).toBeCloseTo(expected[i][j], 10);
      }
    }
  });

  it('worked by hand for one supernova with unit variances: 1 + alpha^2 + beta^2', () => {
    const out = propagateLightCurveCovariance(Float64Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1), 1, 0.1, 3, new Float64Array(1));
    expect(out[0]).toBeCloseTo(1 + 0.01 + 9, 14);
  });

  it('gives lightCurveVariance on its diagonal when C is built from the per-supernova 3x3 blocks (identity test)', () => {
    const table = {
      count: 2, kind: 'light_curves', redshift: Float64Array.of(0.1, 0.2),
      peakMag: Float64Array.of(20, 21), stretch: Float64Array.of(0, 0), color: Float64Array.of(0, 0),
      peakMagErr: Float64Array.of(0.1, 0.12), stretchErr: Float64Array.of(0.5, 0.7), colorErr: Float64Array.of(0.04, 0.03),
      covPeakMagStretch: Float64Array.of(0.01, -0.02), covPeakMagColor: Float64Array.of(0.002, 0.001), covStretchColor: Float64Array.of(-0.005, 0.004),
    } as unknown as SupernovaTable;
    const cov = new Float64Array(36);
    for (let s = 0; s < 2; s++) {
      const block = [
        [table.peakMagErr![s] ** 2, table.covPeakMagStretch![s], table.covPeakMagColor![s]],
        [table.covPeakMagStretch![s], table.stretchErr![s] ** 2, table.covStretchColor![s]],
        [table.covPeakMagColor![s], table.covStretchColor![s], table.colorErr![s] ** 2],
      ];
      for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) cov[(3 * s + p) * 6 + 3 * s + q] = block[p][q];
    }
    const dense = propagateLightCurveCovariance(cov, 2, 0.15, 3.0, new Float64Array(4));
    const diagonal = lightCurveVariance(table, 0.15, 3.0, new Float64Array(2));
    expect(dense[0]).toBeCloseTo(diagonal[0], 14);
    expect(dense[3]).toBeCloseTo(diagonal[1], 14);
    expect(dense[1]).toBe(0);
    expect(dense[0]).toBeCloseTo(0.025525, 14); // same numbers as the hand-worked example in trippCorrectedMagnitudes.test.ts
  });
});
