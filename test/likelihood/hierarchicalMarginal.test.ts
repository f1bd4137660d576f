import { describe, expect, it } from 'vitest';
import { createHierarchicalSupernovaTerm, type ParameterValues } from '../../src/likelihood/index.js';
import { fixedScatter, hierarchicalOptions, LOG_TWO_PI, lightCurveTable, milneModulusMag, solveDense, type LightCurveRow } from './hierarchicalFixtures.js';

// One supernova at z = 0.3 in an empty universe, with correlated light-curve errors
// (sigma = 0.12 mag, 0.6, 0.045 mag; correlations 0.1, 0.3, -0.2) and a high-mass host.
const z = 0.3;
const errors: [number, number, number] = [0.12, 0.6, 0.045];
const covariances: [number, number, number] = [0.1 * 0.12 * 0.6, 0.3 * 0.12 * 0.045, -0.2 * 0.6 * 0.045];
const row: LightCurveRow = { z, mB: milneModulusMag(z, 70) - 19.25 - 0.14 * 0.9 + 3.1 * 0.05 - 0.035, x1: 0.9, c: 0.05, mass: 10.6, errors, covariances };
const base = { omega_m: 0, omega_de: 0, h0: 70, abs_mag: -19.3, mass_step: 0.07 };
const POINTS: ParameterValues[] = [
  { ...base, alpha: 0.14, beta: 3.1, sigma_int: 0.1, x1_mean: 0.2, x1_width: 1.1, color_mean: -0.02, color_width: 0.09 },
  // population narrower than the measurement errors: the prior dominates the latent posterior
  { ...base, alpha: 0.2, beta: 2.5, sigma_int: 0.02, x1_mean: -0.4, x1_width: 0.3, color_mean: 0.01, color_width: 0.03 },
  { ...base, alpha: 0.1, beta: 3.6, sigma_int: 0.15, x1_mean: 1.0, x1_width: 2.0, color_mean: -0.1, color_width: 0.2, x1_mean_slope: -0.8, color_mean_slope: 0.05 },
];

/**
 * Brute force: the joint density of (observed m_B, x1, c) and (true x, c) on a uniform 1201 x 1201 grid
 * over the latent plane, summed by the trapezoid rule (spectrally accurate for a Gaussian integrand;
 * Trefethen & Weideman 2014, SIAM Review 56, 385), with the moments of the latent posterior.
 * Measurement model written out: o = (mu + M - step/2 - alpha x + beta c, x, c) + noise, noise covariance
 * V + diag(sigma_int^2 + fixed scatter, 0, 0); x ~ N(x*, R_x^2), c ~ N(c*, R_c^2).
 */
function bruteForce(p: ParameterValues) {
  const [sm, sx, sc] = errors;
  const noise = [sm * sm + p.sigma_int ** 2 + fixedScatter(z, 0.055, 250), covariances[0], covariances[1], covariances[0], sx * sx, covariances[2], covariances[1], covariances[2], sc * sc];
  const { solutions, logAbsDet } = solveDense(noise, 3, [[1, 0, 0], [0, 1, 0], [0, 0, 1]]);
  const inverse = solutions; // symmetric: columns = rows
  const xStar = p.x1_mean + (p.x1_mean_slope ?? 0) * z;
  const cStar = p.color_mean + (p.color_mean_slope ?? 0) * z;
  const offset = milneModulusMag(z, p.h0) + p.abs_mag - p.mass_step * 0.5;
  const K = 1201;
  const span = (observed: number, centre: number, spread: number) => [Math.min(observed, centre) - 12 * spread, Math.max(observed, centre) + 12 * spread];
  const [x0, x1] = span(row.x1, xStar, Math.max(sx, p.x1_width));
  const [c0, c1] = span(row.c, cStar, Math.max(sc, p.color_width));
  const hx = (x1 - x0) / (K - 1);
  const hc = (c1 - c0) / (K - 1);
  const logDensity = (x: number, c: number) => {
    const r = [row.mB - (offset - p.alpha * x + p.beta * c), row.x1 - x, row.c - c];
    let q = 0;
    for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) q += r[a] * inverse[a][b] * r[b];
    const prior = ((x - xStar) / p.x1_width) ** 2 + ((c - cStar) / p.color_width) ** 2 + 2 * Math.log(p.x1_width * p.color_width) + 2 * LOG_TWO_PI;
    return -0.5 * (q + logAbsDet + 3 * LOG_TWO_PI + prior);
  };
  const values = new Float64Array(K * K);
  let peak = -Infinity;
  for (let i = 0; i < K; i++) for (let j = 0; j < K; j++) peak = Math.max(peak, (values[i * K + j] = logDensity(x0 + i * hx, c0 + j * hc)));
  let mass = 0; let mx = 0; let mc = 0; let mxx = 0; let mcc = 0; let mxc = 0; let edge = 0;
  for (let i = 0; i < K; i++) {
    for (let j = 0; j < K; j++) {
      const weight = Math.exp(values[i * K + j] - peak) * (i === 0 || i === K - 1 ? 0.5 : 1) * (j === 0 || j === K - 1 ? 0.5 : 1);
      if (i === 0 || j === 0 || i === K - 1 || j === K - 1) edge = Math.max(edge, weight);
      const x = x0 + i * hx; const c = c0 + j * hc;
      mass += weight; mx += weight * x; mc += weight * c; mxx += weight * x * x; mcc += weight * c * c; mxc += weight * x * c;
    }
  }
  const ex = mx / mass; const ec = mc / mass;
  return {
    logLikelihood: peak + Math.log(mass * hx * hc), edge,
    meanX: ex, meanC: ec, sdX: Math.sqrt(mxx / mass - ex * ex), sdC: Math.sqrt(mcc / mass - ec * ec),
    correlation: (mxc / mass - ex * ec) / Math.sqrt((mxx / mass - ex * ex) * (mcc / mass - ec * ec)),
  };
}

describe('createHierarchicalSupernovaTerm: the analytic marginal over latent x1 and c', () => {
  POINTS.forEach((p, k) => {
    it(`equals brute-force 2-D quadrature of the joint density (point ${k + 1})`, () => {
      const term = createHierarchicalSupernovaTerm(hierarchicalOptions(lightCurveTable([row]), [], {
        flat: false, population: { perSample: false, redshiftDependentMeans: 'x1_mean_slope' in p },
      }));
      const reference = bruteForce(p);
      expect(reference.edge).toBeLessThan(1e-20); // the box holds the whole posterior
      // Contract of the task: |delta ln L| < 1e-8.
      expect(Math.abs(term.logLikelihood(p) - reference.logLikelihood)).toBeLessThan(1e-8);
      const latent = term.latentEstimates(p);
      // Posterior moments by the same quadrature; moments of a well-resolved grid agree to ~1e-12, tolerance 1e-9.
      expect(latent.stretchMean[0]).toBeCloseTo(reference.meanX, 9);
      expect(latent.colorMeanMag[0]).toBeCloseTo(reference.meanC, 9);
      expect(latent.stretchSd[0]).toBeCloseTo(reference.sdX, 9);
      expect(latent.colorSdMag[0]).toBeCloseTo(reference.sdC, 9);
      expect(latent.stretchColorCorrelation[0]).toBeCloseTo(reference.correlation, 8);
    });
  });
});
