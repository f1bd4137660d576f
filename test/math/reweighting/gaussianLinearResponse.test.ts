import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { gaussianLinearResponse } from '../../../src/math/reweighting/gaussianLinearResponse.js';

const DRAWS = 10_000;

describe('gaussianLinearResponse', () => {
  it('predicts N(mu / (1 + h), 1 / (1 + h)) from N(0, 1) draws and r = mu x - h x^2 / 2 (completing the square, by hand)', () => {
    const random = createRandomStream('linear-response-1d');
    const draws = Float64Array.from({ length: DRAWS }, () => random.normal());
    const mu = 0.8;
    const h = 3;
    const result = gaussianLinearResponse(draws, 1, draws.map((x) => mu * x - (h * x * x) / 2));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // The fit of an exactly quadratic r is exact; what is left is the error of the draws' mean (1/sqrt(n))
    // and spread (1/sqrt(2n) relative), so 4 of those.
    const mean = draws.reduce((a, b) => a + b, 0) / DRAWS;
    expect(Math.abs(mean + result.shift[0] - mu / (1 + h))).toBeLessThan(4 / Math.sqrt(DRAWS));
    expect(Math.abs(result.sd[0] / Math.sqrt(1 / (1 + h)) - 1)).toBeLessThan(4 / Math.sqrt(2 * DRAWS));
  });

  it('predicts a correlated 2-D target: N(0, S) x exp(g^T t) is N(S g, S) (completing the square, by hand)', () => {
    const random = createRandomStream('linear-response-2d');
    // S = [[1, 0.6], [0.6, 1]] from its Cholesky factor [[1, 0], [0.6, 0.8]].
    const draws = new Float64Array(2 * DRAWS);
    for (let i = 0; i < DRAWS; i++) {
      const u = random.normal();
      const v = random.normal();
      draws[2 * i] = u;
      draws[2 * i + 1] = 0.6 * u + 0.8 * v;
    }
    const g = [0.5, -0.2];
    const logRatio = Float64Array.from({ length: DRAWS }, (_, i) => g[0] * draws[2 * i] + g[1] * draws[2 * i + 1]);
    const result = gaussianLinearResponse(draws, 2, logRatio);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    // S g = [0.5 - 0.12, 0.3 - 0.2] = [0.38, 0.1]; relative error of the draws' covariance 1/sqrt(n) or so.
    expect(Math.abs(result.shift[0] - 0.38)).toBeLessThan(4 * 0.38 * Math.sqrt(2 / DRAWS) + 4 / Math.sqrt(DRAWS));
    expect(Math.abs(result.shift[1] - 0.1)).toBeLessThan(4 * 0.38 * Math.sqrt(2 / DRAWS) + 4 / Math.sqrt(DRAWS));
    expect(Math.abs(result.sd[0] - 1)).toBeLessThan(4 / Math.sqrt(2 * DRAWS));
  });

  it('says why when the fitted curvature cannot give a Gaussian (r = +x^2, R^-1 + H = 1 - 2 < 0)', () => {
    const random = createRandomStream('linear-response-bad');
    const draws = Float64Array.from({ length: 2000 }, () => random.normal());
    const result = gaussianLinearResponse(draws, 1, draws.map((x) => x * x));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/not positive definite/);
  });

  it('says why when too few draws have a finite log ratio', () => {
    const result = gaussianLinearResponse(Float64Array.of(1, 2, 3), 1, [0, -Infinity, 0]);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(/fewer than 9/);
  });
});
