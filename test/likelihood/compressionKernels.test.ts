import { describe, expect, it } from 'vitest';
import { barycentricRow, chebyshevNodes, chebyshevTailSize } from '../../src/likelihood/chebyshevInterpolation.js';
import { householderReduce } from '../../src/likelihood/householderLeastSquares.js';
import { createRandomStream } from '../../src/math/index.js';

// Private kernels of the compressed path, tested directly.
describe('chebyshevNodes and barycentricRow', () => {
  it('place the nodes at the mapped cos(j pi / n) points, endpoints included (Berrut & Trefethen 2004, eq. 5.4)', () => {
    const { nodes, weights } = chebyshevNodes(5, 1, 3);
    const expected = [1, 2 - Math.SQRT1_2, 2, 2 + Math.SQRT1_2, 3]; // 2 + cos(j pi/4), j = 4..0
    nodes.forEach((node, k) => expect(node).toBeCloseTo(expected[k], 15));
    expect(Array.from(weights)).toEqual([0.5, -1, 1, -1, 0.5]);
  });
  it('interpolate a polynomial of degree < K exactly (interpolation is exact on polynomials; tol 1e-13)', () => {
    const { nodes, weights } = chebyshevNodes(6, -0.3, 1.7);
    const poly = (x: number) => 2 - x + 0.5 * x ** 3 - 0.25 * x ** 5;
    const values = nodes.map(poly);
    const row = new Float64Array(6);
    for (const x of [-0.3, 0.1, 0.77, 1.2, 1.7]) {
      barycentricRow(x, nodes, weights, row);
      expect(row.reduce((sum, w, k) => sum + w * values[k], 0)).toBeCloseTo(poly(x), 13);
    }
    barycentricRow(nodes[2], nodes, weights, row);
    expect(Array.from(row)).toEqual([0, 0, 1, 0, 0, 0]);
  });
  it('measure the top Chebyshev coefficients (x^2 = (T_0 + T_2)/2: a_2 = 1/2; T_4 through 5 nodes: a_4 = 1)', () => {
    expect(chebyshevTailSize(Float64Array.of(1, 0, 1))).toBeCloseTo(0.5, 15);
    const { nodes } = chebyshevNodes(5, -1, 1);
    expect(chebyshevTailSize(nodes.map((x) => 8 * x ** 4 - 8 * x ** 2 + 1))).toBeCloseTo(1, 14); // T_4 (common practice)
    expect(chebyshevTailSize(nodes.map((x) => 3 * x ** 2 - x))).toBeCloseTo(0, 14); // degree 2 < 3: a_3 = a_4 = 0
  });
});

describe('householderReduce', () => {
  it('splits |e - Z q|^2 into rho^2 + |f - R q|^2 for any q (orthogonal invariance; direct sum for comparison, tol 1e-10 relative)', () => {
    const rng = createRandomStream('householder');
    const rows = 30;
    const columns = 4;
    const design = Float64Array.from({ length: rows * columns }, () => rng.normal());
    for (let i = 0; i < rows; i++) design[i * columns + 3] = design[i * columns]; // a duplicated column: rank 3
    const target = Float64Array.from({ length: rows }, () => 3 + rng.normal());
    const reduced = householderReduce(Float64Array.from(design), rows, columns, Float64Array.from(target));
    for (let trial = 0; trial < 5; trial++) {
      const q = Float64Array.from({ length: columns }, () => rng.normal());
      let direct = 0;
      for (let i = 0; i < rows; i++) {
        let fitted = 0;
        for (let c = 0; c < columns; c++) fitted += design[i * columns + c] * q[c];
        direct += (target[i] - fitted) ** 2;
      }
      let reducedValue = reduced.residualSquare;
      for (let j = 0; j < columns; j++) {
        let u = reduced.projected[j];
        for (let k = j; k < columns; k++) u -= reduced.upper[j * columns + k] * q[k];
        reducedValue += u * u;
      }
      expect(reducedValue / direct).toBeCloseTo(1, 10);
    }
  });
});
