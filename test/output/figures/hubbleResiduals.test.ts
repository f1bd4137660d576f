import { describe, expect, it } from 'vitest';
import { interpolateModelMu, residualRangeMag } from '../../../src/output/figures/index.js';

// Low-redshift Hubble law, mu = 5 log10(c z / H0 / Mpc) + 25 (common practice; c = 299792.458 km/s exactly, SI definition).
const SPEED_OF_LIGHT_KM_PER_S = 299792.458;
const hubbleLawMu = (z: number, h0: number) => 5 * Math.log10((SPEED_OF_LIGHT_KM_PER_S * z) / h0) + 25;

describe('interpolateModelMu', () => {
  it('is exact for the Hubble law, which is linear in ln z', () => {
    const grid = Float64Array.from([0.005, 0.01, 0.02, 0.04, 0.08]);
    const median = grid.map((z) => hubbleLawMu(z, 70));
    const curve = { z: grid, median, low68: median, high68: median };
    const redshifts = Float64Array.of(0.005, 0.0123, 0.033, 0.0799);
    const mu = interpolateModelMu(redshifts, curve);
    // Tolerance 1e-12 mag: only rounding differs (ln-z interpolation of an exactly ln-linear function).
    redshifts.forEach((z, index) => expect(mu[index]).toBeCloseTo(hubbleLawMu(z, 70), 12));
    // Spot value by hand: z = 0.01, H0 = 70 gives c z / H0 = 42.827494 Mpc, mu = 33.1586 mag.
    expect(interpolateModelMu([0.01], curve)[0]).toBeCloseTo(33.1586, 4);
  });

  it('throws figure.redshift_outside_model for a redshift beyond the model grid', () => {
    const curve = { z: Float64Array.of(0.01, 1), median: Float64Array.of(33, 44), low68: Float64Array.of(33, 44), high68: Float64Array.of(33, 44) };
    expect(() => interpolateModelMu([1.5], curve)).toThrow(/outside the redshift grid/);
    expect(() => interpolateModelMu([0], curve)).toThrow(/outside/);
  });
});

describe('residualRangeMag', () => {
  it('covers 99% of |residual| plus the median error, rounded up to 0.1 mag, never below ±0.15 mag', () => {
    // 100 points at 0.15 mag and two outliers at 3 mag: the 99% point is 0.15, plus 0.1, so ±0.3 (by hand).
    const residuals = new Float64Array(102).fill(0.15);
    residuals[0] = 3;
    residuals[1] = -3;
    const errors = new Float64Array(102).fill(0.1);
    expect(residualRangeMag(residuals, errors)).toEqual([-0.3, 0.3]);
    expect(residualRangeMag(Float64Array.of(0.01, -0.02), Float64Array.of(0.01, 0.01))).toEqual([-0.15, 0.15]);
    expect(residualRangeMag(Float64Array.of(0.2, Number.NaN), Float64Array.of(0.1, Number.NaN))).toEqual([-0.3, 0.3]);
  });

  it('ignores strongly down-weighted points: errors of hundreds of mag do not widen the axis', () => {
    // 97 points at 0.2 mag with 0.1 mag errors and 3 at 2 mag with 450 mag errors (more than 5 x the median error).
    const residuals = new Float64Array(100).fill(0.2);
    const errors = new Float64Array(100).fill(0.1);
    for (const index of [3, 50, 90]) {
      residuals[index] = 2;
      errors[index] = 450;
    }
    expect(residualRangeMag(residuals, errors)).toEqual([-0.3, 0.3]);
  });
});
