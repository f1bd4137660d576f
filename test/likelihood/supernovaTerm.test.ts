import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { createPosterior, createSupernovaTerm } from '../../src/likelihood/index.js';
import { expectSamePaths, options, uniform } from './pathHelpers.js';
import { readPantheonBinned, readPantheonBinnedSystematics } from './pantheonBinned.js';
import { syntheticSample } from './syntheticSample.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);
const C_KM_PER_S = 299792.458; // exact (SI definition)

// Three supernovae with a 9 x 9 light-curve covariance on (m_B, x1, c), written out.
const redshift = [0.05, 0.2, 0.6];
const peakMag = [17.45, 20.52, 23.41];
const stretch = [0.5, -1.2, 0.3];
const color = [0.02, -0.05, 0.1];
const hostLogMass = [9.5, 10.5, NaN]; // high-mass fraction 0, 1, 0.5 (unknown mass) with a sharp step at 10
const lightCurveCovariance = [
  0.010, 0.002, -0.0005, 0.003, 0, 0, 0.001, 0, 0,
  0.002, 0.04, 0.0003, 0, 0, 0, 0, 0, 0,
  -0.0005, 0.0003, 0.0009, 0, 0, 0.0002, 0, 0, 0,
  0.003, 0, 0, 0.012, 0.001, -0.0004, 0.002, 0, 0,
  0, 0, 0, 0.001, 0.09, 0.0006, 0, 0, 0,
  0, 0, 0.0002, -0.0004, 0.0006, 0.0016, 0, 0, 0,
  0.001, 0, 0, 0.002, 0, 0, 0.020, 0.003, -0.0008,
  0, 0, 0, 0, 0, 0, 0.003, 0.16, 0.0010,
  0, 0, 0, 0, 0, 0, -0.0008, 0.0010, 0.0025,
];
const point = { omega_m: 0, omega_de: 0, h0: 70, alpha: 0.15, beta: 3.0, mass_step: 0.07, abs_mag: -19.3 };

function threeSupernovae(): { table: SupernovaTable; covariance: CovarianceMatrix } {
  const zeros = () => new Float64Array(3);
  return {
    table: {
      kind: 'light_curves', count: 3, ids: ['a', 'b', 'c'], samples: ['all', 'all', 'all'], sampleNames: ['all'], sampleIndex: new Int32Array(3),
      redshift: Float64Array.from(redshift), redshiftHelio: Float64Array.from(redshift), redshiftErr: zeros(),
      peakMag: Float64Array.from(peakMag), stretch: Float64Array.from(stretch), color: Float64Array.from(color),
      peakMagErr: zeros(), stretchErr: zeros(), colorErr: zeros(), hostLogMass: Float64Array.from(hostLogMass),
      sourceLine: Int32Array.of(1, 2, 3), sourceFile: 'three',
    },
    covariance: { target: 'light_curves', size: 9, values: Float64Array.from(lightCurveCovariance), sourceFile: 'three-cov' },
  };
}

/** By hand: C = A C_eta A^T, A rows (1, alpha, -beta); 3x3 inverse by the adjugate; mu from the empty-universe D_L. */
function handWorked(): { chiSquare: number; logDet: number; marginalChiSquare: number; marginalTerm: number; bestOffset: number } {
  const { alpha, beta, mass_step: step, abs_mag: absMag, h0 } = point;
  const a = [1, alpha, -beta];
  const c = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) c[i][j] += a[p] * a[q] * lightCurveCovariance[(3 * i + p) * 9 + 3 * j + q];
  const det = c[0][0] * (c[1][1] * c[2][2] - c[1][2] * c[2][1]) - c[0][1] * (c[1][0] * c[2][2] - c[1][2] * c[2][0]) + c[0][2] * (c[1][0] * c[2][1] - c[1][1] * c[2][0]);
  const inv = [
    [c[1][1] * c[2][2] - c[1][2] * c[2][1], c[0][2] * c[2][1] - c[0][1] * c[2][2], c[0][1] * c[1][2] - c[0][2] * c[1][1]],
    [c[1][2] * c[2][0] - c[1][0] * c[2][2], c[0][0] * c[2][2] - c[0][2] * c[2][0], c[0][2] * c[1][0] - c[0][0] * c[1][2]],
    [c[1][0] * c[2][1] - c[1][1] * c[2][0], c[0][1] * c[2][0] - c[0][0] * c[2][1], c[0][0] * c[1][1] - c[0][1] * c[1][0]],
  ].map((row) => row.map((value) => value / det));
  const quadratic = (u: number[], v: number[]) => u.reduce((sum, ui, i) => sum + ui * v.reduce((s, vj, j) => s + inv[i][j] * vj, 0), 0);
  const highFraction = [0, 1, 0.5];
  // Empty (Milne) universe: D_L = (c/H0) z (1 + z/2) (Hogg 1999, eq. for Omega = 0), mu = 5 log10(D_L/Mpc) + 25.
  const d = redshift.map((z, i) => peakMag[i] + alpha * stretch[i] - beta * color[i] + step * (highFraction[i] - 0.5) - (5 * Math.log10((C_KM_PER_S / h0) * z * (1 + z / 2)) + 25));
  const r = d.map((value) => value - absMag);
  const ones = [1, 1, 1];
  const e = quadratic(ones, ones);
  const b = quadratic(ones, d);
  return { chiSquare: quadratic(r, r), logDet: Math.log(det), marginalChiSquare: quadratic(d, d) - (b * b) / e, marginalTerm: Math.log(e / (2 * Math.PI)), bestOffset: b / e };
}

describe('createSupernovaTerm', () => {
  const noScatter = { ...options(threeSupernovae().table, []).standardization, scatter: { lensingPerRedshift: 0, peculiarVelocityKmPerS: 0, includeRedshiftErrors: false } };

  it('reproduces a hand-worked chi^2 for 3 supernovae with a 9 x 9 light-curve covariance (numpy.linalg.solve gives 0.6278262209948874; tol 1e-10)', () => {
    const { table, covariance } = threeSupernovae();
    const term = createSupernovaTerm(options(table, [covariance], { flat: false, offset: 'sample', standardization: noScatter }));
    expect(term.path).toBe('general'); // dense, and it follows alpha and beta
    const expected = handWorked();
    const extras = term.bestFitExtras!(point);
    expect(extras.chi_square).toBeCloseTo(expected.chiSquare, 10);
    expect(extras.chi_square).toBeCloseTo(0.6278262209948874, 10); // numpy 2.4.6, same inputs (computed once)
    expect(extras.log_det_covariance).toBeCloseTo(expected.logDet, 10);
    expect(term.logLikelihood(point)).toBeCloseTo(-0.5 * (expected.chiSquare + expected.logDet + 3 * LOG_TWO_PI), 10);
    expect(term.requires).toEqual(['omega_m', 'omega_de', 'h0', 'abs_mag', 'alpha', 'beta', 'mass_step']);
  });

  it('marginalizes the offset as A - B^2/E + ln(E/2 pi) for the same 3 supernovae (Conley et al. 2011, appendix C; numpy gives M* = -19.339305083370718)', () => {
    const { table, covariance } = threeSupernovae();
    const term = createSupernovaTerm(options(table, [covariance], { flat: false, standardization: noScatter }));
    const expected = handWorked();
    expect(term.requires).not.toContain('abs_mag');
    expect(term.requires).not.toContain('h0');
    const extras = term.bestFitExtras!(point);
    expect(extras.chi_square).toBeCloseTo(expected.marginalChiSquare, 10);
    expect(extras.offset_marginalization_term).toBeCloseTo(expected.marginalTerm, 10);
    expect(term.bestFitOffset(point)).toBeCloseTo(expected.bestOffset, 10);
    expect(term.bestFitOffset(point)).toBeCloseTo(-19.339305083370718, 10);
    expect(term.logLikelihood(point)).toBeCloseTo(-0.5 * (expected.marginalChiSquare + expected.marginalTerm + expected.logDet + 3 * LOG_TWO_PI), 10);
  });

  it('returns -Infinity with a reason, never NaN, for unphysical cosmologies', () => {
    const { table, covariance } = threeSupernovae();
    const term = createSupernovaTerm(options(table, [covariance], { flat: false, standardization: noScatter }));
    const noBigBang = { ...point, omega_m: 0.1, omega_de: 2.5 }; // E^2 < 0 in the past: a bounce (common practice)
    expect(term.logLikelihood(noBigBang)).toBe(-Infinity);
    expect(term.rejectionReason(noBigBang)).toMatch(/no Big Bang/);
    const negative = { ...point, omega_m: -0.2 };
    expect(term.logLikelihood(negative)).toBe(-Infinity);
    expect(term.rejectionReason(negative)).toMatch(/Omega_m = -0.2/);
    expect(term.rejectionReason(point)).toBeNull();
    const sampled = createSupernovaTerm(options(table, [covariance], { flat: false, offset: 'sample', standardization: noScatter }));
    expect(sampled.logLikelihood({ ...point, h0: -70 })).toBe(-Infinity);
    expect(sampled.rejectionReason({ ...point, h0: -70 })).toMatch(/H0 = -70/);
  });

  it('joins a posterior, which names a missing parameter and the term', () => {
    const { table, covariance } = threeSupernovae();
    const term = createSupernovaTerm({ ...options(table, [covariance], { flat: false, standardization: noScatter }), name: 'three_sn' });
    try {
      createPosterior({ free: [{ name: 'omega_m', prior: { kind: 'uniform', min: 0, max: 1 } }], fixed: { omega_de: 0 }, terms: [term] });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues.map((issue) => issue.message)).toEqual([
        'likelihood term three_sn needs parameter alpha, which is neither free nor fixed',
        'likelihood term three_sn needs parameter beta, which is neither free nor fixed',
        'likelihood term three_sn needs parameter mass_step, which is neither free nor fixed',
      ]);
    }
  });

  it('rejects options that do not fit the data', () => {
    const { table, covariance } = threeSupernovae();
    const wrongSize: CovarianceMatrix = { target: 'magnitudes', size: 2, values: new Float64Array(4), sourceFile: 'x' };
    expect(() => createSupernovaTerm(options(table, [wrongSize]))).toThrow(/does not match the 3 supernovae/);
    expect(() => createSupernovaTerm(options(table, [covariance], { fastPath: 'diagonal' }))).toThrow(/diagonal path needs a diagonal covariance/);
    expect(() => createSupernovaTerm(options(table, [covariance], { fastPath: 'compressed' }))).toThrow(/compressed path unavailable/);
    const frozenNoValues = { ...noScatter, alphaBetaCovariance: 'frozen' as const };
    expect(() => createSupernovaTerm(options(table, [covariance], { standardization: frozenNoValues }))).toThrow(/frozen alpha\/beta covariance needs/);
  });
});

describe('supernova term with calibrators (distance ladder)', () => {
  const { table } = syntheticSample(320, 'ladder', 20);
  const base = options(table, [], { offset: 'sample', fixed: { alpha: 0.14, beta: 3.1, mass_step: 0.06 } });

  it('uses calibratorMu for calibrator rows and 5 log10(D_L/10 pc) with the sampled h0 for the others (explicit sum; tol 1e-8)', () => {
    const term = createSupernovaTerm({ ...base, fastPath: 'diagonal' });
    expect(term.requires).toContain('h0');
    const p = { omega_m: 0.31, h0: 72, abs_mag: -19.25, alpha: 0.14, beta: 3.1, mass_step: 0.06 };
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.31, h0KmPerSPerMpc: 72 }, { maxRedshift: 3 });
    if (!outcome.ok) throw new Error(outcome.reason);
    const variances = new Float64Array(table.count);
    const diagram = term.hubbleDiagram(p);
    let chiSquare = 0;
    for (let i = 0; i < table.count; i++) {
      const calibrator = Number.isFinite(table.calibratorMu![i]);
      const model = calibrator ? table.calibratorMu![i] : outcome.cosmology.distanceModulusMag(table.redshift[i], table.redshiftHelio[i]);
      const fHigh = table.hostLogMass![i] > 10 ? 1 : 0;
      const y = table.peakMag![i] + 0.14 * table.stretch![i] - 3.1 * table.color![i] + 0.06 * (fHigh - 0.5);
      // Variance by hand: light-curve part (Betoule et al. 2014, A&A 568, A22) + lensing (0.055 z)^2 (Jonsson et al. 2010)
      // + peculiar velocity ((5/ln 10) (250 km/s / c) / z)^2, the last one for Hubble-flow rows only.
      const lightCurve = table.peakMagErr![i] ** 2 + (0.14 * table.stretchErr![i]) ** 2 + (3.1 * table.colorErr![i]) ** 2
        + 2 * 0.14 * table.covPeakMagStretch![i] - 2 * 3.1 * table.covPeakMagColor![i] - 2 * 0.14 * 3.1 * table.covStretchColor![i];
      const velocity = calibrator ? 0 : ((5 / Math.LN10) * (250 / C_KM_PER_S)) / table.redshift[i];
      variances[i] = lightCurve + (0.055 * table.redshift[i]) ** 2 + velocity ** 2;
      expect(diagram.distanceModulusErrorMag[i] ** 2).toBeCloseTo(variances[i], 12);
      chiSquare += (y - p.abs_mag - model) ** 2 / variances[i];
      expect(diagram.modelDistanceModulusMag[i]).toBeCloseTo(model, 9);
      expect(diagram.isCalibrator[i]).toBe(calibrator);
    }
    expect(term.bestFitExtras!(p).chi_square).toBeCloseTo(chiSquare, 8);
  });

  it('compressed equals general with h0 and abs_mag both sampled, and with abs_mag marginalized', () => {
    for (const offset of ['sample', 'marginalize'] as const) {
      const compressed = createSupernovaTerm({ ...base, offset, fastPath: 'compressed' });
      const general = createSupernovaTerm({ ...base, offset, fastPath: 'general' });
      expect(compressed.requires).toContain('h0');
      expect(compressed.describe()[0]).toMatch(/with calibrators/);
      expectSamePaths(compressed, general, (rng) => ({
        omega_m: uniform(rng, 0.1, 0.6), h0: uniform(rng, 60, 80), abs_mag: uniform(rng, -19.5, -19.1), alpha: 0.14, beta: 3.1, mass_step: 0.06,
      }), createRandomStream(`ladder-${offset}`), 8);
    }
  });
});

describe('hubbleDiagram and describe', () => {
  const table = readPantheonBinned();
  it('returns residuals whose diagonal chi^2 is the term chi^2, with model moduli from the cosmology (tol 1e-9)', () => {
    const term = createSupernovaTerm(options(table, [], { fastPath: 'diagonal' }));
    const diagram = term.hubbleDiagram({ omega_m: 0.3 });
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }, { maxRedshift: 2 });
    if (!outcome.ok) throw new Error(outcome.reason);
    let chiSquare = 0;
    for (let i = 0; i < table.count; i++) {
      expect(diagram.modelDistanceModulusMag[i]).toBeCloseTo(outcome.cosmology.distanceModulusMag(table.redshift[i], table.redshiftHelio[i]), 9);
      expect(diagram.residualMag[i]).toBeCloseTo(diagram.distanceModulusMag[i] - diagram.modelDistanceModulusMag[i], 12);
      chiSquare += (diagram.residualMag[i] / diagram.distanceModulusErrorMag[i]) ** 2;
    }
    expect(term.bestFitExtras!({ omega_m: 0.3 }).chi_square).toBeCloseTo(chiSquare, 9);
    expect(diagram.h0KmPerSPerMpc).toBe(70);
    // mb - MU = -19.350 +- 0.015 for the unbinned release at H0 = 70 (../shared/data-real/pantheon2018/SOURCE.md); the binned best fit lies within 0.02.
    expect(Math.abs(diagram.absoluteMagnitudeMag + 19.35)).toBeLessThan(0.02);
  });
  it('describes the compressed path with its node count and error bound', () => {
    const term = createSupernovaTerm(options(table, [readPantheonBinnedSystematics()], { fastPath: 'compressed' }));
    const text = term.describe().join('\n');
    expect(text).toMatch(/\d+ Chebyshev nodes in ln\(1\+z\)/);
    expect(text).toMatch(/compression error bound \|delta chi\^2\| <= \S+ \(target 1e-7\)/);
    expect(text).toMatch(/ln det C is a constant/);
  });
});
