import { CandelaError } from '../errors.js';
import { createRandomStream, SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';
import { createCosmology } from '../cosmology/index.js';
import type { Cosmology } from '../cosmology/index.js';
import type { SupernovaTable, SystematicModes } from '../data/index.js';
import { highMassFraction } from '../standardize/index.js';
import type { HostMassStep } from '../standardize/index.js';
import { drawRedshifts } from './drawRedshifts.js';
import { lightCurveErrors } from './lightCurveErrors.js';
import type { MockSurveyOptions } from './mockSurveyOptions.js';
import { systematicCovariance } from './systematicCovariance.js';
import { systematicModes } from './systematicModes.js';

/** Headroom on the largest redshift for the true cosmology's range (peculiar velocities push z_obs above the design maximum). */
const REDSHIFT_RANGE_FACTOR = 1.1;

/** What a mock survey consists of. */
export interface MockSurvey {
  /** Observed light-curve parameters, in the tool's table type (z_helio = z; no redshift errors, bias corrections or calibrators). */
  table: SupernovaTable;
  /**
   * Systematic covariance on the magnitudes (N x N, row major, mag^2), or
   * null when no mode is on or when the options ask for the 'modes' form
   * (the dense matrix is then never formed).
   */
  systematicCovariance: Float64Array | null;
  /** The same systematics as modes U (N x K, mag; C = U U^T, columns as systematicModeNames), or null when no mode is on. Both forms. */
  systematicModes: SystematicModes | null;
  /** True (latent) values per supernova, for validation: redshift, x1, c (mag), host log mass (dex), mu at the true redshift (mag). */
  latent: { redshift: Float64Array; stretch: Float64Array; color: Float64Array; hostLogMass: Float64Array; distanceModulusMag: Float64Array };
  /** The drawn systematic offsets: per sample calibration offsets and the drift coefficient, mag (all 0 when noiseless). */
  systematicDraws: { calibrationOffsetMag: Record<string, number>; redshiftDriftMag: number };
}

/**
 * Draws a mock Type Ia supernova survey from a known cosmology and nuisance
 * parameters, the forward model of the Tripp (1998) relation:
 *
 *   m_B = mu(z) + M_B - alpha x1 + beta c - step (f_high - 1/2) + e_int + e_lens + calibration + drift z
 *
 * with true x1, c and host mass drawn from Gaussian populations and observed
 * with correlated Gaussian errors (sigma growing linearly with z); f_high is
 * the sharp host-mass step of the standardize layer at the true mass.
 * Peculiar velocities perturb the observed redshift, z_obs = (1 + z)(1 + v/c) - 1.
 * Lensing scatter is lensingPerRedshift z mag (0.055 z: Jonsson et al. 2010).
 * Systematic modes (a coherent offset per sample, a redshift-proportional
 * drift) are drawn once, added to the magnitudes, and returned as modes U
 * (see systematicModes) and, with systematicsForm 'matrix' (the default),
 * also as the dense covariance U U^T (see systematicCovariance). With `noiseless`, the same
 * supernovae are drawn and every noise, scatter and systematic deviate is
 * multiplied by zero, so that the table is the expectation of the data.
 * Deterministic for a given seed (one Alea stream, fixed draw order).
 * Cost: O(N + grid) plus O(N K) for the modes, plus O(N^2) time and memory
 * for the dense covariance with the 'matrix' form only.
 * @param options the survey design, truth and seed.
 * @throws CandelaError `mock.unphysical_truth`, `mock.empty`, `mock.redshift_range`, `mock.error_model`, `mock.error_correlation`,
 *   `mock.covariance_too_large` (the 'matrix' form with a mode on above MAX_COVARIANCE_SUPERNOVAE supernovae).
 * @example generateMockSurvey({ samples, truth, lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, redshiftDriftMag: 0, seed: '7' }).table.count
 */
export function generateMockSurvey(options: MockSurveyOptions): MockSurvey {
  const { truth } = options;
  const total = options.samples.reduce((sum, s) => sum + s.count, 0);
  if (!(total > 0)) {
    throw new CandelaError({ code: 'mock.empty', path: 'samples', message: 'the mock has no supernovae', fix: 'give every sample a count >= 1' });
  }
  const cosmology = trueCosmology(options);
  const random = createRandomStream(options.seed);
  const noise = options.noiseless ? 0 : 1;
  const step: HostMassStep = { enabled: true, splitLogMass: truth.massSplitLogMass, shape: 'sharp', widthDex: 0 };

  const calibrationOffsetMag: Record<string, number> = {};
  for (const sample of options.samples) calibrationOffsetMag[sample.label] = noise * sample.calibrationOffsetMag * random.normal();
  const redshiftDriftMag = noise * options.redshiftDriftMag * random.normal();

  const make = () => new Float64Array(total);
  const redshift = make(); const peakMag = make(); const peakMagErr = make(); const stretch = make(); const stretchErr = make();
  const color = make(); const colorErr = make(); const covPeakMagStretch = make(); const covPeakMagColor = make();
  const covStretchColor = make(); const hostLogMass = make(); const hostLogMassErr = make();
  const latent = { redshift: make(), stretch: make(), color: make(), hostLogMass: make(), distanceModulusMag: make() };
  /** Everything of m_B except the distance modulus, filled in the first pass. */
  const magnitudeWithoutDistance = make();
  const ids: string[] = [];
  const samples: string[] = [];
  const sampleIndex = new Int32Array(total);
  let row = 0;
  options.samples.forEach((design, designIndex) => {
    const redshifts = drawRedshifts(design, cosmology, random);
    for (let k = 0; k < design.count; k++, row++) {
      const zTrue = redshifts[k];
      const velocityKmPerS = noise * options.peculiarVelocityKmPerS * random.normal();
      const zObserved = (1 + zTrue) * (1 + velocityKmPerS / SPEED_OF_LIGHT_KM_PER_S) - 1;
      const x1True = design.stretch.mean + design.stretch.sd * random.normal();
      const cTrue = design.color.mean + design.color.sd * random.normal();
      const massTrue = design.hostLogMass.mean + design.hostLogMass.sd * random.normal();
      const scatter = noise * (truth.sigmaIntMag * random.normal() + options.lensingPerRedshift * zTrue * random.normal());
      redshift[row] = zObserved > 0 ? zObserved : zTrue;
      const systematic = calibrationOffsetMag[design.label] + redshiftDriftMag * redshift[row];
      magnitudeWithoutDistance[row] = truth.absMagMag - truth.alpha * x1True + truth.beta * cTrue -
        truth.massStepMag * (highMassFraction(massTrue, step) - 0.5) + scatter + systematic;
      const errors = lightCurveErrors(design, zTrue);
      const f = errors.factor;
      const n0 = noise * random.normal();
      const n1 = noise * random.normal();
      const n2 = noise * random.normal();
      peakMag[row] = f[0] * n0;
      stretch[row] = x1True + f[1] * n0 + f[2] * n1;
      color[row] = cTrue + f[3] * n0 + f[4] * n1 + f[5] * n2;
      peakMagErr[row] = errors.peakMagSigma;
      stretchErr[row] = errors.stretchSigma;
      colorErr[row] = errors.colorSigma;
      covPeakMagStretch[row] = errors.covPeakMagStretch;
      covPeakMagColor[row] = errors.covPeakMagColor;
      covStretchColor[row] = errors.covStretchColor;
      hostLogMass[row] = massTrue + noise * design.hostLogMass.errorDex * random.normal();
      hostLogMassErr[row] = design.hostLogMass.errorDex;
      latent.redshift[row] = zTrue;
      latent.stretch[row] = x1True;
      latent.color[row] = cTrue;
      latent.hostLogMass[row] = massTrue;
      ids.push(`${design.label}-${String(k + 1).padStart(4, '0')}`);
      samples.push(design.label);
      sampleIndex[row] = designIndex;
    }
  });
  cosmology.distanceModuliMag(latent.redshift, latent.redshift, latent.distanceModulusMag);
  for (let i = 0; i < total; i++) peakMag[i] += latent.distanceModulusMag[i] + magnitudeWithoutDistance[i];

  const table: SupernovaTable = {
    kind: 'light_curves', count: total, ids, samples, sampleNames: options.samples.map((s) => s.label), sampleIndex,
    redshift, redshiftHelio: Float64Array.from(redshift), redshiftErr: make(),
    peakMag, peakMagErr, stretch, stretchErr, color, colorErr, covPeakMagStretch, covPeakMagColor, covStretchColor,
    hostLogMass, hostLogMassErr, biasCorrectionMag: make(), calibratorMu: make().fill(Number.NaN),
    sourceLine: Int32Array.from({ length: total }, (_, i) => i + 2), sourceFile: 'mock',
  };
  return {
    table,
    systematicCovariance: options.systematicsForm === 'modes' ? null : systematicCovariance(options, redshift, sampleIndex),
    systematicModes: systematicModes(options, redshift, sampleIndex),
    latent,
    systematicDraws: { calibrationOffsetMag, redshiftDriftMag },
  };
}

/** The true cosmology, valid up to beyond the largest redshift of the design. */
function trueCosmology(options: MockSurveyOptions): Cosmology {
  const { truth } = options;
  const zMax = Math.max(...options.samples.map((s) => s.redshift.max));
  const outcome = createCosmology(
    {
      darkEnergy: truth.darkEnergy, flat: truth.flat, omegaMatter: truth.omegaMatter, omegaDarkEnergy: truth.omegaDarkEnergy,
      w0: truth.w0, wa: truth.wa, h0KmPerSPerMpc: truth.h0KmPerSPerMpc,
    },
    { maxRedshift: zMax * REDSHIFT_RANGE_FACTOR + 0.1 },
  );
  if (!outcome.ok) {
    throw new CandelaError({ code: 'mock.unphysical_truth', path: 'truth', message: `the true cosmology is not physical: ${outcome.reason}`, fix: 'choose true parameters with a Big Bang and positive expansion rate' });
  }
  return outcome.cosmology;
}
