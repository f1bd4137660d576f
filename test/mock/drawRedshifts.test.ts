import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { drawRedshifts } from '../../src/mock/index.js';
import { sampleDesign } from './mockDesigns.js';

const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }, { maxRedshift: 2 });
if (!outcome.ok) throw new Error(outcome.reason);
const cosmology = outcome.cosmology;

function moments(values: Float64Array): { mean: number; count: number } {
  return { mean: values.reduce((a, b) => a + b, 0) / values.length, count: values.length };
}

describe('drawRedshifts', () => {
  it('uniform: mean (min + max)/2 within 4 standard errors, sd (max - min)/sqrt(12) (uniform distribution, handbook fact)', () => {
    const draws = drawRedshifts(sampleDesign('u', 20000, 0.2, 1.0, 'uniform'), cosmology, createRandomStream('uniform'));
    const { mean, count } = moments(draws);
    expect(Math.min(...draws)).toBeGreaterThanOrEqual(0.2);
    expect(Math.max(...draws)).toBeLessThanOrEqual(1.0);
    expect(Math.abs(mean - 0.6)).toBeLessThan((4 * 0.8) / Math.sqrt(12 * count));
  });

  it('volume: at low redshift dN/dz ∝ z^2, so the mean is (3/4)(b^4 - a^4)/(b^3 - a^3) (Hogg 1999, eq. 28 from memory, in the z -> 0 limit)', () => {
    // On [0.001, 0.01] D_C = cz/H0 (1 + O(z)) and E = 1 + O(z) tilt the density by
    // ~2% across the range, moving the mean by ~0.1%: below the 4-standard-error
    // tolerance of 20000 draws (~0.6% of the mean).
    const a = 0.001;
    const b = 0.01;
    const draws = drawRedshifts(sampleDesign('v', 20000, a, b, 'volume'), cosmology, createRandomStream('volume'));
    const { mean, count } = moments(draws);
    const expectedMean = (0.75 * (b ** 4 - a ** 4)) / (b ** 3 - a ** 3);
    const secondMoment = (0.6 * (b ** 5 - a ** 5)) / (b ** 3 - a ** 3);
    const sd = Math.sqrt(secondMoment - expectedMean ** 2);
    expect(Math.abs(mean - expectedMean)).toBeLessThan((4 * sd) / Math.sqrt(count));
  });

  it('rejects a range without 0 < min < max', () => {
    expect(() => drawRedshifts(sampleDesign('bad', 3, 0.5, 0.5), cosmology, createRandomStream('x'))).toThrow(/0 < min < max/);
  });
});
