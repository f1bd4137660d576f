import { describe, expect, it } from 'vitest';
import { DEFAULT_STRETCH_SCALE, stretchFactor } from '../../src/sampler/index.js';

describe('stretchFactor', () => {
  // Goodman & Weare (2010), eq. 9: g(z) proportional to 1/sqrt(z) on [1/a, a]. Normalizing gives the
  // distribution function G(z) = (sqrt(z) - 1/sqrt(a)) / (sqrt(a) - 1/sqrt(a)) (integrated by hand),
  // so drawing by inversion must satisfy G(stretchFactor(u)) = u.
  const distribution = (z: number, a: number) => (Math.sqrt(z) - 1 / Math.sqrt(a)) / (Math.sqrt(a) - 1 / Math.sqrt(a));

  it('inverts the distribution function of g(z) ~ 1/sqrt(z) on [1/a, a]', () => {
    for (const a of [DEFAULT_STRETCH_SCALE, 1.5, 3]) {
      expect(stretchFactor(0, a)).toBeCloseTo(1 / a, 14);
      expect(stretchFactor(1, a)).toBeCloseTo(a, 14);
      for (const u of [0.1, 0.25, 0.5, 0.9]) expect(distribution(stretchFactor(u, a), a)).toBeCloseTo(u, 13);
    }
  });

  it('gives the documented example value', () => {
    expect(stretchFactor(0.5, 2)).toBe(1.125); // ((2 - 1) x 0.5 + 1)^2 / 2, by hand
  });

  it('has the mean of ln z implied by g(z) (midpoint rule over u, 200000 points)', () => {
    // E[ln Z] = integral over [1/a, a] of ln z g(z) dz, integrated by hand with the antiderivative
    // 2 sqrt(z) ln z - 4 sqrt(z): ln a (sqrt(a) + 1/sqrt(a)) / (sqrt(a) - 1/sqrt(a)) - 2; for a = 2 it is 3 ln 2 - 2 = 0.0794415...
    // The midpoint rule over u in [0, 1] has error ~1e-11 here; 1e-8 is allowed.
    const a = 2;
    const count = 200000;
    let meanLog = 0;
    for (let i = 0; i < count; i++) meanLog += Math.log(stretchFactor((i + 0.5) / count, a)) / count;
    const expected = (Math.log(a) * (Math.sqrt(a) + 1 / Math.sqrt(a))) / (Math.sqrt(a) - 1 / Math.sqrt(a)) - 2;
    expect(expected).toBeCloseTo(3 * Math.LN2 - 2, 14);
    expect(meanLog).toBeCloseTo(expected, 8);
  });
});
