import { describe, expect, it } from 'vitest';
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import { createHierarchicalSupernovaTerm, createSupernovaTerm, type ParameterValues } from '../../src/likelihood/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { gaussianLogDensity, hierarchicalOptions, LOG_TWO_PI, lightCurveTable, milneModulusMag, solveDense } from './hierarchicalFixtures.js';
import { options as conventionalOptions } from './pathHelpers.js';
import { syntheticSample } from './syntheticSample.js';

const populations = { x1_mean: 0.1, x1_width: 0.9, color_mean: -0.01, color_width: 0.11 };
const point: ParameterValues = { omega_m: 0.3, h0: 70, alpha: 0.14, beta: 3.1, mass_step: 0.06, sigma_int: 0.1, abs_mag: -19.3, ...populations };

/** The synthetic sample with x1 and c measured exactly (zero errors and zero correlations with them). */
function exactStretchAndColor(calibrators: number): { table: SupernovaTable; systematic: CovarianceMatrix } {
  const { table, systematic } = syntheticSample(40, 'hierarchical-identity', calibrators);
  const zeros = new Float64Array(table.count);
  return { table: { ...table, stretchErr: zeros, colorErr: zeros, covPeakMagStretch: zeros, covPeakMagColor: zeros, covStretchColor: zeros }, systematic };
}

/** sum_i ln N(x1_i; x*, R_x^2) + ln N(c_i; c*, R_c^2), the populations' density of exactly measured x1 and c. */
function populationLogDensity(table: SupernovaTable, p: ParameterValues, suffix: (i: number) => string): number {
  let sum = 0;
  for (let i = 0; i < table.count; i++) {
    const s = suffix(i);
    const gauss = (value: number, mean: number, sd: number) => -0.5 * (((value - mean) / sd) ** 2 + 2 * Math.log(sd) + LOG_TWO_PI);
    sum += gauss((table.stretch as Float64Array)[i], p[`x1_mean${s}`], p[`x1_width${s}`]) + gauss((table.color as Float64Array)[i], p[`color_mean${s}`], p[`color_width${s}`]);
  }
  return sum;
}

describe('createHierarchicalSupernovaTerm: limit of exactly measured x1 and c', () => {
  // Identity: with zero x1 and c errors the latent variables equal the observations, so
  // L_hier = L_Tripp(m_B | x1, c) x prod_i N(x1_i | pop) N(c_i | pop) (conditioning a Gaussian; common practice).
  const variants = [
    { label: 'blocks, offset sampled, 3 calibrators', dense: false, offset: 'sample' as const, calibrators: 3, perSample: false },
    { label: 'blocks, offset marginalized, per-sample populations', dense: false, offset: 'marginalize' as const, calibrators: 0, perSample: true },
    { label: 'dense systematic matrix, offset marginalized', dense: true, offset: 'marginalize' as const, calibrators: 0, perSample: false },
    { label: 'dense systematic matrix, offset sampled, 3 calibrators', dense: true, offset: 'sample' as const, calibrators: 3, perSample: true },
  ];
  for (const variant of variants) {
    it(`equals the conventional term times the population densities (${variant.label}; |delta ln L| < 1e-8)`, () => {
      const { table, systematic } = exactStretchAndColor(variant.calibrators);
      const covariances = variant.dense ? [systematic] : [];
      const conventional = createSupernovaTerm(conventionalOptions(table, covariances, {
        offset: variant.offset, fastPath: variant.dense ? 'general' : 'diagonal',
        standardization: { ...conventionalOptions(table, []).standardization, intrinsicScatter: 'global' },
      }));
      const term = createHierarchicalSupernovaTerm(hierarchicalOptions(table, covariances, { offset: variant.offset, population: { perSample: variant.perSample, redshiftDependentMeans: false } }));
      expect(term.path).toBe(variant.dense ? 'dense' : 'blocks');
      const suffix = (i: number) => (variant.perSample ? `_${table.samples[i]}` : '');
      const p: ParameterValues = { ...point };
      if (variant.perSample) {
        for (const [sample, shift] of [['north', 0.2], ['south', -0.3]] as const) {
          Object.assign(p, { [`x1_mean_${sample}`]: shift, [`x1_width_${sample}`]: 1 + shift, [`color_mean_${sample}`]: shift / 10, [`color_width_${sample}`]: 0.1 + shift / 5 });
        }
      }
      for (const alpha of [0.1, 0.16]) {
        const q = { ...p, alpha };
        const expected = conventional.logLikelihood(q) + populationLogDensity(table, q, suffix);
        expect(Math.abs(term.logLikelihood(q) - expected)).toBeLessThan(1e-8);
        expect(term.bestFitOffset(q)).toBeCloseTo(conventional.bestFitOffset(q), 10);
      }
      const mine = term.hubbleDiagram(p);
      const theirs = conventional.hubbleDiagram(p);
      for (let i = 0; i < table.count; i++) {
        expect(mine.distanceModulusMag[i]).toBeCloseTo(theirs.distanceModulusMag[i], 10);
        // Both terms quote sqrt(diag C), the dense matrix's diagonal included.
        expect(mine.distanceModulusErrorMag[i] ** 2).toBeCloseTo(theirs.distanceModulusErrorMag[i] ** 2, 10);
        expect(mine.residualMag[i]).toBeCloseTo(theirs.residualMag[i], 10);
      }
      const latent = term.latentEstimates(p);
      expect(Array.from(latent.stretchMean).map((v, i) => v - (table.stretch as Float64Array)[i]).every((d) => Math.abs(d) < 1e-10)).toBe(true);
      expect(Math.max(...latent.colorSdMag, ...latent.stretchSd)).toBeLessThan(1e-6); // sqrt of a cancellation at 1e-16 relative
    });
  }
});

describe('createHierarchicalSupernovaTerm: dense and block paths against the full 3N x 3N Gaussian', () => {
  const N = 4;
  const rng = createRandomStream('hierarchical-dense');
  const rows = Array.from({ length: N }, (_, i) => {
    const zi = 0.05 + 0.25 * i;
    return { z: zi, mB: milneModulusMag(zi, 70) - 19.3 + 0.1 * rng.normal(), x1: rng.normal(), c: 0.1 * rng.normal(), mass: 9.5 + i * 0.5, errors: [0.1, 0.5, 0.04] as [number, number, number], covariances: [0.004, 0.0008, -0.004] as [number, number, number] };
  });
  const table = lightCurveTable(rows);
  const size = 3 * N;
  const perSupernova = new Float64Array(size * size);
  const coupling = new Float64Array(size * size);
  for (let i = 0; i < N; i++) for (const [a, b, v] of [[0, 0, 0.002], [1, 1, 0.05], [2, 2, 0.0003], [0, 2, 0.0004], [2, 0, 0.0004]]) perSupernova[(3 * i + a) * size + 3 * i + b] = v;
  for (let mode = 0; mode < 3; mode++) {
    const vector = Array.from({ length: size }, (_, k) => (k % 3 === 1 ? 0.2 : 0.02) * rng.normal());
    for (let r = 0; r < size; r++) for (let c = 0; c < size; c++) coupling[r * size + c] += vector[r] * vector[c];
  }
  const matrix = (values: Float64Array): CovarianceMatrix => ({ target: 'light_curves', size, values, sourceFile: 'test' });
  const p: ParameterValues = { omega_m: 0, omega_de: 0, h0: 70, alpha: 0.15, beta: 2.9, mass_step: 0.08, sigma_int: 0.09, abs_mag: -19.28, ...populations };

  /** The full covariance and residual written out (hierarchicalBlock.ts derivation), reduced by Gaussian elimination. */
  function reference(withCoupling: boolean) {
    const sigma = Float64Array.from(perSupernova, (v, k) => v + (withCoupling ? coupling[k] : 0));
    const residual: number[] = [];
    const template: number[] = [];
    const [rx2, rc2] = [p.x1_width ** 2, p.color_width ** 2];
    rows.forEach((row, i) => {
      const [sm, sx, sc] = row.errors;
      const [cmx, cmc, cxc] = row.covariances;
      const block = [
        [sm * sm + p.sigma_int ** 2 + (0.055 * row.z) ** 2 + ((5 / Math.LN10) * (250 / 299792.458) / row.z) ** 2 + p.alpha ** 2 * rx2 + p.beta ** 2 * rc2, cmx - p.alpha * rx2, cmc + p.beta * rc2],
        [cmx - p.alpha * rx2, sx * sx + rx2, cxc], [cmc + p.beta * rc2, cxc, sc * sc + rc2],
      ];
      for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) sigma[(3 * i + a) * size + 3 * i + b] += block[a][b];
      const step = p.mass_step * ((row.mass > 10 ? 1 : row.mass < 10 ? 0 : 0.5) - 0.5);
      residual.push(row.mB - (milneModulusMag(row.z, 70) - step - p.alpha * p.x1_mean + p.beta * p.color_mean), row.x1 - p.x1_mean, row.c - p.color_mean);
      template.push(1, 0, 0);
    });
    const { solutions, logAbsDet } = solveDense(sigma, size, [residual, template]);
    const dot = (u: number[], v: number[]) => u.reduce((s, ui, k) => s + ui * v[k], 0);
    const [A, B, E] = [dot(residual, solutions[0]), dot(template, solutions[0]), dot(template, solutions[1])];
    const sampled = gaussianLogDensity(residual.map((r, k) => r - p.abs_mag * template[k]), sigma, size);
    const marginal = -0.5 * (A - (B * B) / E + Math.log(E / (2 * Math.PI)) + logAbsDet + size * LOG_TWO_PI);
    return { sigma, residual, template, sampled, marginal, bestOffset: B / E, rx2, rc2 };
  }

  for (const withCoupling of [false, true]) {
    it(`${withCoupling ? 'dense' : 'blocks'} path: ln L (sampled and marginalized offset) and latent moments match (Conley et al. 2011, appendix C; tol 1e-9)`, () => {
      const covariances = withCoupling ? [matrix(perSupernova), matrix(coupling)] : [matrix(perSupernova)];
      const sampled = createHierarchicalSupernovaTerm(hierarchicalOptions(table, covariances, { flat: false }));
      const marginal = createHierarchicalSupernovaTerm(hierarchicalOptions(table, covariances, { flat: false, offset: 'marginalize' }));
      expect(sampled.path).toBe(withCoupling ? 'dense' : 'blocks');
      const expected = reference(withCoupling);
      expect(sampled.logLikelihood(p)).toBeCloseTo(expected.sampled, 9);
      expect(marginal.logLikelihood(p)).toBeCloseTo(expected.marginal, 9);
      expect(marginal.bestFitOffset(p)).toBeCloseTo(expected.bestOffset, 9);
      // Latent posterior by conditioning the joint Gaussian of (t_i, o): E = t* + G^T Sigma^-1 delta, Cov = D - G^T Sigma^-1 G.
      const latent = sampled.latentEstimates(p);
      const delta = expected.residual.map((r, k) => r - p.abs_mag * expected.template[k]);
      for (let i = 0; i < N; i++) {
        const gx = new Array<number>(size).fill(0); const gc = new Array<number>(size).fill(0);
        [gx[3 * i], gx[3 * i + 1], gc[3 * i], gc[3 * i + 2]] = [-p.alpha * expected.rx2, expected.rx2, p.beta * expected.rc2, expected.rc2];
        const [sd, sx, sc] = solveDense(expected.sigma, size, [delta, gx, gc]).solutions;
        const dot = (u: number[], v: number[]) => u.reduce((s, ui, k) => s + ui * v[k], 0);
        expect(latent.stretchMean[i]).toBeCloseTo(p.x1_mean + dot(gx, sd), 9);
        expect(latent.colorMeanMag[i]).toBeCloseTo(p.color_mean + dot(gc, sd), 9);
        expect(latent.stretchSd[i]).toBeCloseTo(Math.sqrt(expected.rx2 - dot(gx, sx)), 9);
        expect(latent.colorSdMag[i]).toBeCloseTo(Math.sqrt(expected.rc2 - dot(gc, sc)), 9);
      }
    });
  }

  it('a coherent magnitude offset in a dense matrix is absorbed by the marginalized abs_mag (flat prior; exact identity)', () => {
    // int dM N(d - M u; 0, Sigma + s^2 u u^T) = int dM N(d - M u; 0, Sigma): the offset shifts M (translation invariance).
    const offset: CovarianceMatrix = { target: 'magnitudes', size: N, values: new Float64Array(N * N).fill(0.05 ** 2), sourceFile: 'coherent' };
    const blocks = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [matrix(perSupernova)], { flat: false, offset: 'marginalize' }));
    const dense = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [matrix(perSupernova), offset], { flat: false, offset: 'marginalize' }));
    expect(dense.path).toBe('dense');
    expect(dense.logLikelihood(p)).toBeCloseTo(blocks.logLikelihood(p), 10);
    expect(dense.bestFitOffset(p)).toBeCloseTo(blocks.bestFitOffset(p), 10);
    // At the best-fit offset the latent means agree (u^T Sigma^-1 delta = 0 there); the offset's variance widens the posterior.
    const a = blocks.latentEstimates(p);
    const b = dense.latentEstimates(p);
    for (let i = 0; i < N; i++) {
      expect(b.colorMeanMag[i]).toBeCloseTo(a.colorMeanMag[i], 10);
      expect(b.colorSdMag[i]).toBeGreaterThan(a.colorSdMag[i]);
    }
  });
});
