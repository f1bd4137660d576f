import { FIVE_OVER_LN10, SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';

/** Column name of the host-mass split mode. */
export const HOST_MASS_SPLIT_MODE = 'host_mass_split';
/** Column name of the coherent-velocity mode. */
export const COHERENT_VELOCITY_MODE = 'coherent_velocity';

/** Systematics of the analysis (not of the sky): uncertainties of corrections whose true value in a mock is zero. */
export interface AnalysisSystematics {
  /** Standard deviation of the host-mass split, dex (0 = none). */
  hostMassSplitDex: number;
  /** Standard deviation of a coherent line-of-sight velocity of the local volume, km/s (0 = none). */
  coherentVelocityKmPerS: number;
  /** The coherent velocity moves supernovae below this redshift only. */
  coherentVelocityMaxRedshift: number;
}

/** What the analysis modes need of the survey: per supernova, redshift and host mass; the mass step and its split. */
export interface AnalysisModeInput {
  /** Hubble-diagram redshift per supernova. */
  redshift: Float64Array;
  /** Observed log10 host stellar mass per supernova (dex). */
  hostLogMass: Float64Array;
  /** Host-mass step (mag) and split (log10 M_sun) of the standardization. */
  massStepMag: number;
  splitLogMass: number;
}

/**
 * Modes U (N x K, mag; C = U U^T) of two systematics of the analysis that
 * the data do not carry (in a mock their true value is zero, so the data
 * stay as drawn), in this column order when on:
 *
 *   host_mass_split:   U_i = -step  for split <= m_i < split + s_split, else 0:
 *                      moving the split up by one standard deviation moves
 *                      these hosts from the high-mass class (+step/2) to the
 *                      low-mass one (-step/2);
 *   coherent_velocity: U_i = (5 / ln 10) (v / c) / z_i  for z_i < z_max, else 0:
 *                      one line-of-sight velocity v shared by the local volume
 *                      (a residual of the velocity-field correction), in the
 *                      low-redshift form d mu = (5 / ln 10) dz / z that
 *                      fixedScatterVariance uses for the random velocities.
 *
 * Cost O(N K) time and memory.
 * @param input redshifts, host masses (dex), step (mag) and split (dex).
 * @param settings standard deviations (dex, km/s) and the velocity's redshift limit.
 * @returns the names and the N x K values, row major (K = 0: empty arrays).
 * @example analysisSystematicModes({ redshift: [0.02, 0.5], hostLogMass: [10.1, 9], massStepMag: 0.06, splitLogMass: 10 }, { hostMassSplitDex: 0.2, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 }).values // [-0.06, 0]
 */
export function analysisSystematicModes(input: AnalysisModeInput, settings: AnalysisSystematics): { names: string[]; values: Float64Array } {
  const names: string[] = [];
  if (settings.hostMassSplitDex > 0) names.push(HOST_MASS_SPLIT_MODE);
  if (settings.coherentVelocityKmPerS > 0) names.push(COHERENT_VELOCITY_MODE);
  const n = input.redshift.length;
  const k = names.length;
  const values = new Float64Array(n * k);
  const velocityFraction = settings.coherentVelocityKmPerS / SPEED_OF_LIGHT_KM_PER_S;
  for (let i = 0; i < n; i++) {
    let column = 0;
    if (settings.hostMassSplitDex > 0) {
      const mass = input.hostLogMass[i];
      if (mass >= input.splitLogMass && mass < input.splitLogMass + settings.hostMassSplitDex) values[i * k + column] = -input.massStepMag;
      column++;
    }
    if (settings.coherentVelocityKmPerS > 0) {
      const z = input.redshift[i];
      if (z < settings.coherentVelocityMaxRedshift) values[i * k + column] = (FIVE_OVER_LN10 * velocityFraction) / z;
    }
  }
  return { names, values };
}
