import { csvField } from '../density/csvField.js';

/** Posterior mean and standard deviation of each supernova's true x1 and c (mag), in table order (the likelihood's LatentEstimates have this shape). */
export interface LatentColumns {
  stretchMean: ArrayLike<number>;
  stretchSd: ArrayLike<number>;
  colorMeanMag: ArrayLike<number>;
  colorSdMag: ArrayLike<number>;
}

/**
 * A CSV table with one row per supernova (a header line, then rows in the
 * order of the estimates), with four columns added at the right:
 * x1_latent, x1_latent_sd, color_latent, color_latent_sd, at full double
 * precision. Cost O(N).
 * @param csv the table (RFC 4180, a header line, one line per supernova, ending in a line break).
 * @param latent the estimates.
 * @returns the wider table, ending in a line break.
 * @throws nothing.
 * @example appendLatentColumns('id\na\n', { stretchMean: [0.1], stretchSd: [0.2], colorMeanMag: [0], colorSdMag: [0.05] }) // 'id,x1_latent,x1_latent_sd,color_latent,color_latent_sd\na,0.1,0.2,0,0.05\n'
 */
export function appendLatentColumns(csv: string, latent: LatentColumns): string {
  const lines = csv.trimEnd().split('\n');
  lines[0] += ',x1_latent,x1_latent_sd,color_latent,color_latent_sd';
  for (let i = 1; i < lines.length; i++) {
    const k = i - 1;
    lines[i] += `,${[latent.stretchMean[k], latent.stretchSd[k], latent.colorMeanMag[k], latent.colorSdMag[k]].map(csvField).join(',')}`;
  }
  return `${lines.join('\n')}\n`;
}
