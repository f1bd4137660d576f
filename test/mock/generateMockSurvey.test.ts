import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import { createSupernovaTerm } from '../../src/likelihood/index.js';
import { expectedResidualVariance, generateMockSurvey } from '../../src/mock/index.js';
import type { MockSurvey, MockSurveyOptions } from '../../src/mock/index.js';
import { sampleDesign, surveyOptions } from './mockDesigns.js';

/**
 * Hubble residual of every supernova at the truth: the Tripp (1998) relation
 * with the true alpha, beta, M and step (class of the true host mass), minus
 * the true distance modulus at the observed redshift, minus the drawn
 * systematic offsets.
 */
function residualsAtTruth(options: MockSurveyOptions, mock: MockSurvey): Float64Array {
  const { truth } = options;
  const t = mock.table;
  const outcome = createCosmology({ darkEnergy: truth.darkEnergy, flat: truth.flat, omegaMatter: truth.omegaMatter, w0: truth.w0, wa: truth.wa, h0KmPerSPerMpc: truth.h0KmPerSPerMpc }, { maxRedshift: 3 });
  if (!outcome.ok) throw new Error(outcome.reason);
  const mu = outcome.cosmology.distanceModuliMag(t.redshift, t.redshiftHelio);
  const out = new Float64Array(t.count);
  for (let i = 0; i < t.count; i++) {
    const high = mock.latent.hostLogMass[i] > truth.massSplitLogMass ? 1 : 0;
    const standardized = t.peakMag![i] + truth.alpha * t.stretch![i] - truth.beta * t.color![i] + truth.massStepMag * (high - 0.5);
    const systematic = mock.systematicDraws.calibrationOffsetMag[t.samples[i]] + mock.systematicDraws.redshiftDriftMag * t.redshift[i];
    out[i] = standardized - truth.absMagMag - mu[i] - systematic;
  }
  return out;
}

/** sum of r_i^2 / expectedResidualVariance_i over the survey. */
function normalizedChiSquare(options: MockSurveyOptions, mock: MockSurvey): number {
  const residual = residualsAtTruth(options, mock);
  let chiSquare = 0;
  for (let i = 0; i < residual.length; i++) {
    chiSquare += residual[i] ** 2 / expectedResidualVariance(options, options.samples[mock.table.sampleIndex[i]], mock.latent.redshift[i]);
  }
  return chiSquare;
}

describe('generateMockSurvey', () => {
  const options = surveyOptions([sampleDesign('low', 400, 0.01, 0.1, 'volume'), sampleDesign('high', 600, 0.1, 1.2)]);

  it('is deterministic for a seed and changes with the seed', () => {
    const first = generateMockSurvey(options);
    const again = generateMockSurvey(options);
    const other = generateMockSurvey({ ...options, seed: 'another seed' });
    expect(Array.from(again.table.peakMag!)).toEqual(Array.from(first.table.peakMag!));
    expect(Array.from(again.table.redshift)).toEqual(Array.from(first.table.redshift));
    expect(Array.from(other.table.peakMag!)).not.toEqual(Array.from(first.table.peakMag!));
  });

  it('gives Hubble residuals at the truth with the expected variance (chi-square test)', () => {
    // sum r_i^2 / V_i ~ chi^2 with N degrees of freedom: mean N, sd sqrt(2N)
    // (Abramowitz & Stegun 1964, 26.4). Tolerance: 4 sd (2.8% of N here).
    const large = surveyOptions([sampleDesign('low', 6000, 0.015, 0.1, 'volume'), sampleDesign('high', 14000, 0.1, 1.2)], { seed: 'variance-test' });
    const mock = generateMockSurvey(large);
    const chiSquare = normalizedChiSquare(large, mock);
    const n = mock.table.count;
    expect(Math.abs(chiSquare - n)).toBeLessThan(4 * Math.sqrt(2 * n));
  });

  it('adds the drawn systematic offsets: removing them leaves the expected variance', () => {
    // Offsets of order 1 mag would add ~50 per supernova to chi^2 if they were
    // not the ones returned; the chi-square tolerance (4 sd) is ~0.15 per supernova.
    const modes = surveyOptions([sampleDesign('low', 600, 0.015, 0.1, 'volume'), sampleDesign('high', 900, 0.1, 1.2)], {
      redshiftDriftMag: 1, seed: 'modes-test',
    });
    modes.samples[0].calibrationOffsetMag = 1;
    modes.samples[1].calibrationOffsetMag = 2;
    const mock = generateMockSurvey(modes);
    expect(Math.abs(mock.systematicDraws.calibrationOffsetMag.high)).toBeGreaterThan(0);
    const n = mock.table.count;
    expect(Math.abs(normalizedChiSquare(modes, mock) - n)).toBeLessThan(4 * Math.sqrt(2 * n));
  });

  it('draws stretch and colour whose sample means match the populations within 4 standard errors', () => {
    // Standard error of a mean: sqrt(population variance + mean measurement variance) / sqrt(N) (common practice).
    const mock = generateMockSurvey(surveyOptions([sampleDesign('only', 5000, 0.05, 0.8)]));
    const design = sampleDesign('only', 5000, 0.05, 0.8);
    const mean = (values: Float64Array) => values.reduce((a, b) => a + b, 0) / values.length;
    const meanSquare = (values: Float64Array) => values.reduce((a, b) => a + b * b, 0) / values.length;
    const n = mock.table.count;
    const stretchError = Math.sqrt((design.stretch.sd ** 2 + meanSquare(mock.table.stretchErr!)) / n);
    const colorError = Math.sqrt((design.color.sd ** 2 + meanSquare(mock.table.colorErr!)) / n);
    expect(Math.abs(mean(mock.table.stretch!) - design.stretch.mean)).toBeLessThan(4 * stretchError);
    expect(Math.abs(mean(mock.table.color!) - design.color.mean)).toBeLessThan(4 * colorError);
  });

  it('noiseless: the same supernovae with zero residual at the truth (identity test)', () => {
    const noisy = generateMockSurvey({ ...options, redshiftDriftMag: 0.01 });
    const clean = generateMockSurvey({ ...options, redshiftDriftMag: 0.01, noiseless: true });
    expect(Array.from(clean.latent.redshift)).toEqual(Array.from(noisy.latent.redshift));
    expect(Array.from(clean.latent.stretch)).toEqual(Array.from(clean.table.stretch!));
    expect(Array.from(clean.table.peakMagErr!)).toEqual(Array.from(noisy.table.peakMagErr!));
    expect(clean.systematicDraws.redshiftDriftMag).toBe(0);
    const residual = residualsAtTruth(options, clean);
    // Rounding only: magnitudes near 20 carry ~4e-15 of absolute rounding per operation.
    expect(Math.max(...residual.map(Math.abs))).toBeLessThan(1e-12);
  });

  it('noiseless: the supernova likelihood has chi^2 = 0 at the truth (identity test, common practice)', () => {
    const clean = generateMockSurvey({ ...options, noiseless: true });
    const { truth } = options;
    const term = createSupernovaTerm({
      name: 'mock', table: clean.table, covariances: [],
      cosmologyModel: { darkEnergy: 'cpl', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
      standardization: {
        massStep: { enabled: true, splitLogMass: truth.massSplitLogMass, shape: 'sharp', widthDex: 0.1 },
        scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 300, includeRedshiftErrors: false },
        intrinsicScatter: 'global', alphaBetaCovariance: 'exact',
      },
      offset: 'sample', fastPath: 'diagonal',
    });
    const p = { omega_m: truth.omegaMatter, w0: truth.w0!, wa: truth.wa!, h0: 70, abs_mag: truth.absMagMag, alpha: truth.alpha, beta: truth.beta, mass_step: truth.massStepMag, sigma_int: truth.sigmaIntMag };
    expect(term.bestFitExtras!(p).chi_square).toBeLessThan(1e-18);
  });

  it('returns the systematic covariance s_cal^2 [same sample] + s_drift^2 z_i z_j, symmetric bit for bit', () => {
    const withModes = surveyOptions([sampleDesign('a', 30, 0.02, 0.1), sampleDesign('b', 40, 0.2, 0.9)], { redshiftDriftMag: 0.03 });
    withModes.samples[0].calibrationOffsetMag = 0.01;
    withModes.samples[1].calibrationOffsetMag = 0.02;
    const mock = generateMockSurvey(withModes);
    const c = mock.systematicCovariance!;
    const n = mock.table.count;
    const z = mock.table.redshift;
    const s = mock.table.sampleIndex;
    let worst = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        expect(c[i * n + j]).toBe(c[j * n + i]);
        const expected = 0.03 ** 2 * z[i] * z[j] + (s[i] === s[j] ? [0.01, 0.02][s[i]] ** 2 : 0);
        worst = Math.max(worst, Math.abs(c[i * n + j] - expected) / expected);
      }
    }
    expect(worst).toBeLessThan(1e-14);
    expect(generateMockSurvey(surveyOptions([sampleDesign('a', 5, 0.02, 0.1)])).systematicCovariance).toBeNull();
  });

  it('rejects an unphysical truth and an empty design', () => {
    const bad = surveyOptions([sampleDesign('a', 5, 0.02, 0.1)]);
    bad.truth = { ...bad.truth, omegaMatter: -0.2 };
    expect(() => generateMockSurvey(bad)).toThrow(/true cosmology is not physical/);
    expect(() => generateMockSurvey(surveyOptions([]))).toThrow(/no supernovae/);
  });
});
