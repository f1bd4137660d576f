import { CandelaError } from '../errors.js';
import type { SupernovaTable } from '../data/index.js';
import { highMassFraction, type HostMassStep } from './highMassFraction.js';

/** The Tripp (1998, A&A 331, 815) standardization coefficients. */
export interface TrippCoefficients {
  /** Stretch coefficient alpha, mag per unit x1. */
  alpha: number;
  /** Colour coefficient beta, mag per mag of c. */
  beta: number;
  /** Host-mass step, mag: added as +step/2 on the high-mass side and -step/2 on the low-mass side. */
  massStepMag: number;
}

/**
 * Standardized peak magnitudes by the Tripp relation with a host-mass step:
 *
 *   m_corr = m_B + alpha x1 - beta c + massStep (f_high - 1/2) - biasCorrection
 *
 * so that mu_obs = m_corr - M_B (the absolute magnitude is subtracted by the
 * likelihood). f_high is {@link highMassFraction}. Sign convention: the step
 * raises the distance modulus of high-mass hosts by massStep/2 and lowers
 * that of low-mass hosts by massStep/2. This is the gamma of DES-SN5YR
 * (Vincenzi et al. 2024) with the same sign; the JLA Delta_M of Betoule et al.
 * (2014: M_B -> M_B + Delta_M for M > 10^10 M_sun) maps to
 * massStep = -Delta_M, the remaining constant -Delta_M/2 being absorbed by
 * M_B. Cost O(N), no allocation.
 * @param table a light-curve table (needs m_B, x1, c; host masses and bias corrections optional).
 * @param coefficients alpha, beta and the step (mag).
 * @param step the step's shape; disabled, or a table without host masses -> no step term.
 * @param out length-N output, mag; returned.
 * @throws CandelaError `standardize.not_light_curves` when m_B, x1 or c is missing.
 * @example trippCorrectedMagnitudes(table, { alpha: 0.14, beta: 3.1, massStepMag: 0.06 }, step, new Float64Array(table.count))
 */
export function trippCorrectedMagnitudes(table: SupernovaTable, coefficients: TrippCoefficients, step: HostMassStep, out: Float64Array): Float64Array {
  const { peakMag, stretch, color } = requireLightCurves(table);
  const { alpha, beta, massStepMag } = coefficients;
  const mass = table.hostLogMass;
  const bias = table.biasCorrectionMag;
  const withStep = step.enabled && mass !== undefined && massStepMag !== 0;
  for (let i = 0; i < table.count; i++) {
    let value = peakMag[i] + alpha * stretch[i] - beta * color[i];
    if (withStep) value += massStepMag * (highMassFraction(mass[i], step) - 0.5);
    if (bias) value -= bias[i];
    out[i] = value;
  }
  return out;
}

/**
 * The light-curve columns, or a CandelaError naming what is missing.
 * @param table any supernova table.
 * @throws CandelaError `standardize.not_light_curves`.
 * @example requireLightCurves(table).peakMag.length === table.count
 */
export function requireLightCurves(table: SupernovaTable): { peakMag: Float64Array; stretch: Float64Array; color: Float64Array } {
  const { peakMag, stretch, color } = table;
  if (peakMag && stretch && color) return { peakMag, stretch, color };
  throw new CandelaError({
    code: 'standardize.not_light_curves', file: table.sourceFile,
    message: 'the Tripp standardization needs peak magnitude, stretch and colour columns',
    fix: "read the table with kind 'light_curves' and map m_b, x1 and color",
  });
}
