/**
 * Seeded synthetic light-curve samples for the benchmarks, drawn around flat
 * w0waCDM (Omega_m = 0.3, w0 = -0.9, wa = 0.3, H0 = 70 km/s/Mpc), with K
 * systematic modes U (N x K, mag) so that the magnitude covariance is
 * diagonal (light-curve errors, lensing, peculiar velocities) plus U U^T.
 * Synthetic data time the code; they are never a correctness reference.
 */
import { createCosmology } from '../../src/cosmology/index.js';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import { createRandomStream } from '../../src/math/index.js';

/** The truth the samples are drawn from. */
export const BENCH_TRUTH = { omegaMatter: 0.3, w0: -0.9, wa: 0.3, h0KmPerSPerMpc: 70, absMag: -19.3, alpha: 0.14, beta: 3.1, massStep: 0.06 };
/** Largest number of modes (the 100,000-supernova case of the task). */
export const MAX_MODE_COUNT = 50;
/** Smallest and largest redshift of the samples. */
const REDSHIFT_MIN = 0.01;
const REDSHIFT_MAX = 2.3;
/** Number of survey programmes, each with its own calibration-offset mode. */
const PROGRAMME_COUNT = 8;

/** A synthetic sample and its systematic modes. */
export interface BenchSurvey {
  table: SupernovaTable;
  /** U, N x K row major, mag. */
  modes: Float64Array;
  modeCount: number;
}

/** Modes for N supernovae: K = min(50, floor(N / 4)), so that small samples keep more data than modes. */
export function modeCountFor(count: number): number {
  return Math.min(MAX_MODE_COUNT, Math.floor(count / 4));
}

/**
 * `count` supernovae with z log-uniform in [0.01, 2.3] and `modeCount` modes:
 * the first min(K, 8) are calibration offsets of 8 programmes (0.01 mag,
 * supernova i belongs to programme i mod 8), the rest smooth drifts
 * 0.01 cos(j pi ln(z/0.01)/ln 230) mag. Deterministic for a seed.
 * Cost O(N K).
 */
export function benchSurvey(count: number, modeCount: number, seed: string): BenchSurvey {
  const rng = createRandomStream(seed);
  const outcome = createCosmology({ darkEnergy: 'cpl', flat: true, omegaMatter: BENCH_TRUTH.omegaMatter, w0: BENCH_TRUTH.w0, wa: BENCH_TRUTH.wa, h0KmPerSPerMpc: BENCH_TRUTH.h0KmPerSPerMpc }, { maxRedshift: 3 });
  if (!outcome.ok) throw new Error(outcome.reason);
  const cosmology = outcome.cosmology;
  const column = () => new Float64Array(count);
  const [redshift, peakMag, stretch, color, hostLogMass] = [column(), column(), column(), column(), column()];
  const [peakMagErr, stretchErr, colorErr, covPeakMagStretch, covPeakMagColor, covStretchColor] = [column(), column(), column(), column(), column(), column()];
  const logSpan = Math.log(REDSHIFT_MAX / REDSHIFT_MIN);
  for (let i = 0; i < count; i++) {
    const z = REDSHIFT_MIN * Math.exp(logSpan * rng.uniform());
    redshift[i] = z;
    stretch[i] = rng.normal();
    color[i] = 0.1 * rng.normal();
    hostLogMass[i] = 10 + 0.7 * rng.normal();
    peakMagErr[i] = 0.08 + 0.05 * z + 0.02 * rng.uniform();
    stretchErr[i] = 0.2 + 0.3 * rng.uniform();
    colorErr[i] = 0.02 + 0.02 * rng.uniform();
    covPeakMagStretch[i] = 0.2 * peakMagErr[i] * stretchErr[i] * (rng.uniform() - 0.5);
    covPeakMagColor[i] = 0.4 * peakMagErr[i] * colorErr[i] * (rng.uniform() - 0.5);
    covStretchColor[i] = 0.2 * stretchErr[i] * colorErr[i] * (rng.uniform() - 0.5);
    const step = BENCH_TRUTH.massStep * ((hostLogMass[i] > 10 ? 1 : 0) - 0.5);
    const mu = cosmology.distanceModulusMag(z, z);
    peakMag[i] = mu + BENCH_TRUTH.absMag - BENCH_TRUTH.alpha * stretch[i] + BENCH_TRUTH.beta * color[i] - step + 0.1 * rng.normal();
  }
  const modes = new Float64Array(count * modeCount);
  for (let i = 0; i < count; i++) {
    for (let k = 0; k < modeCount; k++) {
      const value = k < PROGRAMME_COUNT
        ? (i % PROGRAMME_COUNT === k ? 0.01 : 0)
        : 0.01 * Math.cos(((k - PROGRAMME_COUNT + 1) * Math.PI * Math.log(redshift[i] / REDSHIFT_MIN)) / logSpan);
      modes[i * modeCount + k] = value;
    }
  }
  const programmes = Array.from({ length: PROGRAMME_COUNT }, (_, k) => `programme${k + 1}`);
  const sampleIndex = Int32Array.from({ length: count }, (_, i) => i % PROGRAMME_COUNT);
  const table: SupernovaTable = {
    kind: 'light_curves', count, ids: Array.from({ length: count }, (_, i) => `bench${i}`),
    samples: Array.from(sampleIndex, (s) => programmes[s]), sampleNames: programmes, sampleIndex,
    redshift, redshiftHelio: Float64Array.from(redshift), redshiftErr: column(),
    peakMag, peakMagErr, stretch, stretchErr, color, colorErr, covPeakMagStretch, covPeakMagColor, covStretchColor, hostLogMass,
    biasCorrectionMag: column(), sourceLine: Int32Array.from({ length: count }, (_, i) => i + 1), sourceFile: `synthetic:${seed}`,
  };
  return { table, modes, modeCount };
}

/** The dense N x N magnitude covariance U U^T of a survey's modes (for the general and compressed paths). Cost N^2 K / 2. */
export function denseModeCovariance(survey: BenchSurvey): CovarianceMatrix {
  const { modes, modeCount } = survey;
  const n = survey.table.count;
  const values = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] * modes[j * modeCount + k];
      values[i * n + j] = sum;
      values[j * n + i] = sum;
    }
  }
  return { target: 'magnitudes', size: n, values, sourceFile: `${survey.table.sourceFile}:modes` };
}
