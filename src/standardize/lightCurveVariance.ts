import { CandelaError } from '../errors.js';
import type { SupernovaTable } from '../data/index.js';
import { requireLightCurves } from './trippCorrectedMagnitudes.js';

/**
 * Per-supernova variance of the Tripp-standardized magnitude from the
 * light-curve fit alone (the JLA covariance model, Betoule et al. 2014, A&A 568, A22, with the
 * diagonal 3x3 block, i.e. A C_eta A^T for one supernova with A = (1, alpha, -beta)):
 *
 *   sigma_mB^2 + alpha^2 sigma_x1^2 + beta^2 sigma_c^2
 *   + 2 alpha C(mB,x1) - 2 beta C(mB,c) - 2 alpha beta C(x1,c)
 *
 * Absent covariance columns count as zero. Cost O(N), no allocation.
 * @param table a light-curve table.
 * @param alpha stretch coefficient, mag.
 * @param beta colour coefficient, mag/mag.
 * @param out length-N output, mag^2; returned.
 * @throws CandelaError `standardize.not_light_curves` when m_B, x1 or c is missing, `standardize.errors_missing` when one of their errors is.
 * @example lightCurveVariance(table, 0.14, 3.1, new Float64Array(table.count))
 */
export function lightCurveVariance(table: SupernovaTable, alpha: number, beta: number, out: Float64Array): Float64Array {
  requireLightCurves(table);
  const { peakMagErr: sigmaMag, stretchErr: sigmaStretch, colorErr: sigmaColor, covPeakMagStretch, covPeakMagColor, covStretchColor } = table;
  if (!sigmaMag || !sigmaStretch || !sigmaColor) {
    throw new CandelaError({
      code: 'standardize.errors_missing', file: table.sourceFile,
      message: 'the light-curve variance needs the errors of peak magnitude, stretch and colour',
      fix: 'map m_b_err, x1_err and color_err when reading the table',
    });
  }
  for (let i = 0; i < table.count; i++) {
    let variance = sigmaMag[i] * sigmaMag[i] + alpha * alpha * sigmaStretch[i] * sigmaStretch[i] + beta * beta * sigmaColor[i] * sigmaColor[i];
    if (covPeakMagStretch) variance += 2 * alpha * covPeakMagStretch[i];
    if (covPeakMagColor) variance -= 2 * beta * covPeakMagColor[i];
    if (covStretchColor) variance -= 2 * alpha * beta * covStretchColor[i];
    out[i] = variance;
  }
  return out;
}
