// Test helper (not a test): seeded synthetic light-curve samples with a dense covariance, for
// checking the evaluation paths against each other. Synthetic data are never a correctness
// reference on their own: every check that uses them compares two code paths, or a path with
// a formula written out in the test.
import { createCosmology } from '../../src/cosmology/index.js';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import { createRandomStream } from '../../src/math/index.js';

export interface SyntheticSample {
  table: SupernovaTable;
  /** Dense N x N magnitude covariance: a few smooth redshift modes plus random low-rank modes (SPD once the diagonal is added). */
  systematic: CovarianceMatrix;
}

/**
 * `count` supernovae with z log-uniform in [0.01, 2.3], drawn around flat LambdaCDM (Omega_m = 0.3, H0 = 70),
 * M = -19.3, alpha = 0.14, beta = 3.1, mass step 0.06; the first `calibrators` rows get an external
 * distance modulus (calibratorMu) at low redshift.
 */
export function syntheticSample(count: number, seed: string, calibrators = 0): SyntheticSample {
  const rng = createRandomStream(seed);
  const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }, { maxRedshift: 3 });
  if (!outcome.ok) throw new Error(outcome.reason);
  const cosmology = outcome.cosmology;
  const column = () => new Float64Array(count);
  const [redshift, redshiftHelio, peakMag, stretch, color, hostLogMass, calibratorMu] = [column(), column(), column(), column(), column(), column(), column()];
  const [peakMagErr, stretchErr, colorErr, covPeakMagStretch, covPeakMagColor, covStretchColor] = [column(), column(), column(), column(), column(), column()];
  for (let i = 0; i < count; i++) {
    const z = i < calibrators ? 0.002 + 0.008 * rng.uniform() : Math.exp(Math.log(0.01) + rng.uniform() * Math.log(230));
    redshift[i] = z;
    redshiftHelio[i] = z + 0.001 * (rng.uniform() - 0.5);
    stretch[i] = rng.normal();
    color[i] = 0.1 * rng.normal();
    hostLogMass[i] = 10 + 0.7 * rng.normal();
    peakMagErr[i] = 0.08 + 0.07 * rng.uniform();
    stretchErr[i] = 0.2 + 0.3 * rng.uniform();
    colorErr[i] = 0.02 + 0.03 * rng.uniform();
    covPeakMagStretch[i] = 0.3 * peakMagErr[i] * stretchErr[i] * (rng.uniform() - 0.5);
    covPeakMagColor[i] = 0.5 * peakMagErr[i] * colorErr[i] * (rng.uniform() - 0.5);
    covStretchColor[i] = 0.3 * stretchErr[i] * colorErr[i] * (rng.uniform() - 0.5);
    const mu = cosmology.distanceModulusMag(z, redshiftHelio[i]);
    calibratorMu[i] = i < calibrators ? mu + 0.05 * rng.normal() : NaN;
    const step = 0.06 * ((hostLogMass[i] > 10 ? 1 : 0) - 0.5);
    peakMag[i] = mu - 19.3 - 0.14 * stretch[i] + 3.1 * color[i] - step + 0.12 * rng.normal();
  }
  const values = new Float64Array(count * count);
  const mode = new Float64Array(count);
  for (let k = 0; k < 6; k++) {
    for (let i = 0; i < count; i++) {
      mode[i] = k < 3 ? 0.02 * Math.cos((k + 1) * Math.log(redshift[i] / 0.01)) : 0.01 * rng.normal();
    }
    for (let i = 0; i < count; i++) for (let j = 0; j < count; j++) values[i * count + j] += mode[i] * mode[j];
  }
  const sampleNames = ['north', 'south'];
  const sampleIndex = Int32Array.from({ length: count }, (_, i) => i % 2);
  return {
    table: {
      kind: 'light_curves', count, ids: Array.from({ length: count }, (_, i) => `syn${i}`), samples: Array.from(sampleIndex, (s) => sampleNames[s]),
      sampleNames, sampleIndex, redshift, redshiftHelio, redshiftErr: column(),
      peakMag, peakMagErr, stretch, stretchErr, color, colorErr, covPeakMagStretch, covPeakMagColor, covStretchColor, hostLogMass,
      biasCorrectionMag: column(), calibratorMu: calibrators > 0 ? calibratorMu : undefined,
      sourceLine: Int32Array.from({ length: count }, (_, i) => i + 1), sourceFile: `synthetic:${seed}`,
    },
    systematic: { target: 'magnitudes', size: count, values, sourceFile: `synthetic:${seed}:systematic` },
  };
}
