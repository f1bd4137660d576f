import { describe, expect, it } from 'vitest';
import { hubbleModelCsv } from '../../../src/output/index.js';

describe('hubbleModelCsv', () => {
  it('writes z, mu_best, mu_median, mu_low68, mu_high68 per grid point at full double precision', () => {
    const csv = hubbleModelCsv({
      redshift: Float64Array.of(0.01, 1 / 3), bestMag: Float64Array.of(33.2, 41.5), medianMag: Float64Array.of(33.21, 41.52),
      low68Mag: Float64Array.of(33.19, 41.47), high68Mag: Float64Array.of(33.23, 41.56),
    });
    expect(csv).toBe(`z,mu_best,mu_median,mu_low68,mu_high68\n0.01,33.2,33.21,33.19,33.23\n${1 / 3},41.5,41.52,41.47,41.56\n`);
  });

  it('leaves a band with no usable draw empty', () => {
    const csv = hubbleModelCsv({ redshift: [0.1], bestMag: [38.3], medianMag: [Number.NaN], low68Mag: [Number.NaN], high68Mag: [Number.NaN] });
    expect(csv.split('\n')[1]).toBe('0.1,38.3,,,');
  });
});
