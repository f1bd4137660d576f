import { describe, expect, it } from 'vitest';
import { createHierarchicalModes } from '../../src/likelihood/hierarchicalModes.js';

// Reference: the 2 x 2 capacitance matrix written out, S = I + sum_i p_i U_i U_i^T, with its
// determinant ad - b^2 and inverse [[d, -b], [-b, a]] / (ad - b^2) (handbook 2 x 2 formulas).
const U = Float64Array.of(0.1, 0.02, -0.05, 0.03, 0.08, 0, 0.01, -0.04);
const p = Float64Array.of(60, 90, 40, 120);
const N = 4;
let [a, b, d] = [1, 0, 1];
for (let i = 0; i < N; i++) {
  a += p[i] * U[2 * i] ** 2;
  b += p[i] * U[2 * i] * U[2 * i + 1];
  d += p[i] * U[2 * i + 1] ** 2;
}
const det = a * d - b * b;
const quadratic = (x: number, y: number) => (d * x * x - 2 * b * x * y + a * y * y) / det;

describe('createHierarchicalModes', () => {
  const modes = createHierarchicalModes(U, N, 2);
  const logDet = modes.prepare(p);

  it('prepare returns ln det S (2 x 2 determinant; 1e-14)', () => {
    expect(logDet).toBeCloseTo(Math.log(det), 14);
  });

  it('project gives L_S^-1 U^T v, so |out|^2 = (U^T v)^T S^-1 (U^T v) (1e-14)', () => {
    const v = Float64Array.of(0.5, -1.2, 2, 0.3);
    const out = new Float64Array(2);
    modes.project(v, out);
    let [x, y] = [0, 0];
    for (let i = 0; i < N; i++) {
      x += U[2 * i] * v[i];
      y += U[2 * i + 1] * v[i];
    }
    expect(out[0] ** 2 + out[1] ** 2).toBeCloseTo(quadratic(x, y), 14);
  });

  it('modeShifts gives U S^-1 U^T q and modeVariance U_i^T S^-1 U_i (1e-14)', () => {
    const q = Float64Array.of(3, -1, 0.5, 2);
    let [x, y] = [0, 0];
    for (let i = 0; i < N; i++) {
      x += U[2 * i] * q[i];
      y += U[2 * i + 1] * q[i];
    }
    const [gx, gy] = [(d * x - b * y) / det, (a * y - b * x) / det];
    const shifts = new Float64Array(N);
    modes.modeShifts(q, shifts);
    for (let i = 0; i < N; i++) {
      expect(shifts[i]).toBeCloseTo(U[2 * i] * gx + U[2 * i + 1] * gy, 14);
      expect(modes.modeVariance(i)).toBeCloseTo(quadratic(U[2 * i], U[2 * i + 1]), 14);
    }
  });

  it('a non-finite precision makes prepare return NaN', () => {
    expect(createHierarchicalModes(U, N, 2).prepare(Float64Array.of(60, NaN, 40, 120))).toBeNaN();
  });
});
