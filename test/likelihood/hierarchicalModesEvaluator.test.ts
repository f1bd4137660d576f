import { describe, expect, it } from 'vitest';
import type { CovarianceMatrix, SystematicModes } from '../../src/data/index.js';
import { createHierarchicalSupernovaTerm, type HierarchicalTermOptions, type ParameterValues } from '../../src/likelihood/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { hierarchicalOptions, lightCurveTable, milneModulusMag, type LightCurveRow } from './hierarchicalFixtures.js';

// Reference: the existing 'dense' path, handed the same U U^T written out as an N x N magnitude
// matrix, factorizes the full 3N x 3N covariance by Cholesky (independent of the Woodbury algebra);
// the Woodbury identity (Woodbury 1950) and the determinant lemma are exact, so the two agree to rounding.
const N = 30;
const K = 3;
const rng = createRandomStream('hierarchical-modes');
const rows: LightCurveRow[] = Array.from({ length: N }, (_, i) => {
  const z = 0.02 + (1.2 * i) / (N - 1);
  const [sm, sx, sc] = [0.08 + 0.05 * z, 0.3 + 0.3 * rng.uniform(), 0.03 + 0.02 * rng.uniform()];
  const x1 = rng.normal();
  const c = 0.1 * rng.normal();
  return {
    z, x1, c, mass: 9.2 + 1.6 * rng.uniform(), sample: i % 2 ? 'north' : 'south',
    mB: milneModulusMag(z, 70) - 19.3 - 0.14 * x1 + 3.1 * c + 0.12 * rng.normal(),
    errors: [sm, sx, sc], covariances: [0.2 * sm * sx * (rng.uniform() - 0.5), 0.4 * sm * sc * (rng.uniform() - 0.5), 0.2 * sx * sc * (rng.uniform() - 0.5)],
  };
});
const table = lightCurveTable(rows);
// Three modes (mag): a zero-point offset of the north sample, a drift linear in z, and a random shift per supernova.
const modeValues = new Float64Array(N * K);
rows.forEach((row, i) => {
  modeValues[i * K] = row.sample === 'north' ? 0.03 : 0;
  modeValues[i * K + 1] = 0.04 * row.z;
  modeValues[i * K + 2] = 0.02 * rng.normal();
});
const systematicModes: SystematicModes = { count: N, modeCount: K, values: modeValues, sourceFile: 'modes.csv' };

/** U U^T as an N x N magnitude covariance (the reference's input). */
function modesAsMatrix(modes: Float64Array, modeCount: number): CovarianceMatrix {
  const values = new Float64Array(N * N);
  for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) for (let k = 0; k < modeCount; k++) values[i * N + j] += modes[i * modeCount + k] * modes[j * modeCount + k];
  return { target: 'magnitudes', size: N, values, sourceFile: 'modes as a matrix' };
}

const populations = { x1_mean: 0.1, x1_width: 0.9, color_mean: -0.01, color_width: 0.11 };
const POINTS: ParameterValues[] = [
  { omega_m: 0, omega_de: 0, h0: 70, abs_mag: -19.3, alpha: 0.14, beta: 3.1, mass_step: 0.06, sigma_int: 0.1, ...populations },
  { omega_m: 0.3, omega_de: 0.7, h0: 70, abs_mag: -19.25, alpha: 0.2, beta: 2.5, mass_step: -0.04, sigma_int: 0.02, x1_mean: -0.4, x1_width: 0.3, color_mean: 0.02, color_width: 0.03 },
  { omega_m: 0.5, omega_de: 0.2, h0: 70, abs_mag: -19.4, alpha: 0.1, beta: 3.6, mass_step: 0.1, sigma_int: 0.15, x1_mean: 1, x1_width: 2, color_mean: -0.1, color_width: 0.2 },
];
const perSamplePoint = (p: ParameterValues): ParameterValues => {
  const q: ParameterValues = { ...p, x1_mean_slope: -0.3, color_mean_slope: 0.02 };
  for (const [sample, shift] of [['north', 0.2], ['south', -0.1]] as const) {
    Object.assign(q, { [`x1_mean_${sample}`]: p.x1_mean + shift, [`x1_width_${sample}`]: p.x1_width * (1 + shift), [`color_mean_${sample}`]: p.color_mean + shift / 10, [`color_width_${sample}`]: p.color_width * (1 + shift) });
  }
  return q;
};

const VARIANTS = [
  { label: 'offset sampled, one population', extra: { flat: false }, point: (p: ParameterValues) => p },
  { label: 'offset marginalized, per-sample populations with z-dependent means', point: perSamplePoint,
    extra: { flat: false, offset: 'marginalize' as const, population: { perSample: true, redshiftDependentMeans: true } } },
];
/** |a - b| <= tolerance |b|. */
const closeRelative = (a: number, b: number, tolerance: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tolerance * Math.abs(b));

describe('createHierarchicalSupernovaTerm with systematic modes: Woodbury block path against the dense 3N x 3N path', () => {
  for (const variant of VARIANTS) {
    const options = (extra: Partial<HierarchicalTermOptions>) => hierarchicalOptions(table, [], { ...variant.extra, ...extra });
    const woodbury = createHierarchicalSupernovaTerm(options({ systematicModes }));
    const dense = createHierarchicalSupernovaTerm(options({ covariances: [modesAsMatrix(modeValues, K)] }));

    it(`same ln L, chi^2, ln det and best-fit offset at 3 points to 1e-9 relative (${variant.label})`, () => {
      expect(woodbury.path).toBe('blocks');
      expect(dense.path).toBe('dense');
      for (const base of POINTS) {
        const p = variant.point(base);
        const [a, b] = [woodbury.bestFitExtras!(p), dense.bestFitExtras!(p)];
        closeRelative(woodbury.logLikelihood(p), dense.logLikelihood(p), 1e-9);
        closeRelative(a.chi_square, b.chi_square, 1e-9);
        closeRelative(a.log_det_covariance, b.log_det_covariance, 1e-9);
        closeRelative(a.abs_mag_best_fit, b.abs_mag_best_fit, 1e-9);
        expect(a.offset_marginalization_term).toBeCloseTo(b.offset_marginalization_term, 9);
      }
    });

    it(`same latent posterior and Hubble-diagram errors as the dense path (${variant.label}; 1e-9)`, () => {
      const p = variant.point(POINTS[0]);
      const [a, b] = [woodbury.latentEstimates(p), dense.latentEstimates(p)];
      const [ha, hb] = [woodbury.hubbleDiagram(p), dense.hubbleDiagram(p)];
      for (let i = 0; i < N; i++) {
        expect(a.stretchMean[i]).toBeCloseTo(b.stretchMean[i], 9);
        expect(a.colorMeanMag[i]).toBeCloseTo(b.colorMeanMag[i], 9);
        expect(a.stretchSd[i]).toBeCloseTo(b.stretchSd[i], 9);
        expect(a.colorSdMag[i]).toBeCloseTo(b.colorSdMag[i], 9);
        expect(a.stretchColorCorrelation[i]).toBeCloseTo(b.stretchColorCorrelation[i], 9);
        expect(ha.distanceModulusMag[i]).toBeCloseTo(hb.distanceModulusMag[i], 9);
        expect(ha.distanceModulusErrorMag[i]).toBeCloseTo(hb.distanceModulusErrorMag[i], 9);
      }
    });
  }

  it('modes beside a matrix that couples supernovae are added to the dense 3N x 3N matrix (same ln L as the matrix U U^T; 1e-12)', () => {
    const coupling = modesAsMatrix(Float64Array.from({ length: N }, (_, i) => 0.01 * Math.cos(i)), 1);
    const withModes = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [coupling], { flat: false, systematicModes }));
    const written = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [coupling, modesAsMatrix(modeValues, K)], { flat: false }));
    expect(withModes.path).toBe('dense');
    for (const p of POINTS) closeRelative(withModes.logLikelihood(p), written.logLikelihood(p), 1e-12);
  });

  it('K = 0 modes give the path without modes exactly', () => {
    const none = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { flat: false }));
    const empty = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { flat: false, systematicModes: { count: N, modeCount: 0, values: new Float64Array(0), sourceFile: 'empty' } }));
    for (const p of POINTS) expect(empty.logLikelihood(p)).toBe(none.logLikelihood(p));
    expect(empty.describe()).toEqual(none.describe());
  });

  it('a common magnitude offset as a mode is absorbed by the marginalized abs_mag (flat prior; exact identity, 1e-10)', () => {
    // int dM N(d - M u; 0, Sigma + s^2 u u^T) = int dM N(d - M u; 0, Sigma): the offset only shifts M (translation invariance).
    const offset: SystematicModes = { count: N, modeCount: 1, values: new Float64Array(N).fill(0.05), sourceFile: 'offset' };
    const plain = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { flat: false, offset: 'marginalize' }));
    const shifted = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { flat: false, offset: 'marginalize', systematicModes: offset }));
    for (const p of POINTS) {
      expect(shifted.logLikelihood(p)).toBeCloseTo(plain.logLikelihood(p), 10);
      expect(shifted.bestFitOffset(p)).toBeCloseTo(plain.bestFitOffset(p), 10);
    }
  });

  it('modes of the wrong shape or with a non-finite value are refused, naming the file', () => {
    const short = { ...systematicModes, count: N - 1, values: modeValues.subarray(0, (N - 1) * K) };
    expect(() => createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { systematicModes: short }))).toThrow(/do not match the 30 supernovae/);
    const broken = Float64Array.from(modeValues);
    broken[4 * K + 1] = NaN;
    expect(() => createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { systematicModes: { ...systematicModes, values: broken } }))).toThrow(/mode 2 of supernova 5/);
  });

  it('describes the path and the modes', () => {
    const term = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { systematicModes }));
    expect(term.describe().join('\n')).toMatch(/3 systematic modes on m_B through the Woodbury identity/);
    expect(term.describe().join('\n')).toMatch(/3 systematic modes U U\^T on m_B \(Woodbury identity, no 3N x 3N matrix\)/);
  });
});
