import { describe, expect, it } from 'vitest';
import { appendLatentColumns } from '../../../src/output/index.js';

describe('appendLatentColumns', () => {
  it('adds the four latent columns to the header and to each row, in order, at full double precision', () => {
    const csv = appendLatentColumns('id,mu_obs\na,40.1\nb,41.2\n', {
      stretchMean: Float64Array.of(0.1, -1 / 3), stretchSd: Float64Array.of(0.2, 0.25), colorMeanMag: Float64Array.of(0, 0.01), colorSdMag: Float64Array.of(0.05, 0.04),
    });
    expect(csv).toBe(`id,mu_obs,x1_latent,x1_latent_sd,color_latent,color_latent_sd\na,40.1,0.1,0.2,0,0.05\nb,41.2,${-1 / 3},0.25,0.01,0.04\n`);
    expect(Number(csv.split('\n')[2].split(',')[2])).toBe(-1 / 3);
  });
});
