// Test helper (not a test): mock surveys with noisy x1 and c, and maximum-likelihood fits of the
// hierarchical and the conventional supernova terms (Nelder-Mead, errors from a finite-difference
// Hessian). Used by the fast recovery test and the long validation.
import type { SupernovaTable } from '../../src/data/index.js';
import { createHierarchicalSupernovaTerm, createSupernovaTerm, type LikelihoodTerm, type ParameterValues } from '../../src/likelihood/index.js';
import { minimizeNelderMead } from '../../src/math/index.js';
import { generateMockSurvey, type MockSampleDesign, type MockSurveyOptions } from '../../src/mock/index.js';
import { hierarchicalOptions, solveDense } from './hierarchicalFixtures.js';
import { options as conventionalOptions } from './pathHelpers.js';

/** Truth of the mocks: flat LambdaCDM and the usual standardization (values of the order of published fits; from memory). */
export const TRUTH = { omega_m: 0.3, alpha: 0.14, beta: 3.1, sigma_int: 0.1, x1_mean: 0.3, x1_width: 1.0, color_mean: -0.02, color_width: 0.08 };

/**
 * One sample of a fictional survey, with realistic noisy covariates: sigma_x1 from 0.3 (z = 0) to 1.0 (z = 1),
 * sigma_c from 0.03 to 0.05 mag. The colour reliability ratio R_c^2/(R_c^2 + sigma_c^2) runs from 0.88 to 0.72.
 */
export function mockDesign(count: number): MockSampleDesign {
  return {
    label: 'ridge', count, redshift: { min: 0.02, max: 1.0, shape: 'uniform' },
    stretch: { mean: TRUTH.x1_mean, sd: TRUTH.x1_width }, color: { mean: TRUTH.color_mean, sd: TRUTH.color_width },
    hostLogMass: { mean: 10, sd: 0.5, errorDex: 0.1 },
    errors: {
      peakMagMag: { atZero: 0.05, perRedshift: 0.1 }, stretch: { atZero: 0.3, perRedshift: 0.7 }, colorMag: { atZero: 0.03, perRedshift: 0.02 },
      correlationPeakMagStretch: 0.1, correlationPeakMagColor: 0.3, correlationStretchColor: -0.1,
    },
    calibrationOffsetMag: 0,
  };
}

export function mockOptions(count: number, seed: string): MockSurveyOptions {
  return {
    samples: [mockDesign(count)],
    truth: { darkEnergy: 'lambda', flat: true, omegaMatter: TRUTH.omega_m, h0KmPerSPerMpc: 70, alpha: TRUTH.alpha, beta: TRUTH.beta, absMagMag: -19.3, massStepMag: 0, massSplitLogMass: 10, sigmaIntMag: TRUTH.sigma_int },
    lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, redshiftDriftMag: 0, seed,
  };
}

/** A fit parameter: its name, a start, a Nelder-Mead step, and whether it is fitted in ln (widths). */
interface Coordinate { name: string; start: number; step: number; log?: boolean }

export interface FitResult {
  /** Maximum-likelihood values by name. */
  best: Record<string, number>;
  /** Standard errors from the inverse Hessian of -ln L (natural units for linear coordinates). */
  sd: Record<string, number>;
  evaluations: number;
}

/**
 * Maximizes ln L with Nelder-Mead (restarted once from its optimum; common practice), then
 * estimates errors from the central finite-difference Hessian of -ln L in the fit coordinates
 * (for untransformed parameters the marginal sd does not depend on how the others are parametrized).
 */
export function maximize(term: LikelihoodTerm, coordinates: Coordinate[]): FitResult {
  const toPoint = (x: ArrayLike<number>): ParameterValues =>
    Object.fromEntries(coordinates.map((c, k) => [c.name, c.log ? Math.exp(x[k]) : x[k]]));
  const objective = (x: ArrayLike<number>): number => -term.logLikelihood(toPoint(x));
  let start = coordinates.map((c) => (c.log ? Math.log(c.start) : c.start));
  let evaluations = 0;
  for (let round = 0; round < 2; round++) {
    const result = minimizeNelderMead(objective, start, { initialSteps: coordinates.map((c) => c.step), maxEvaluations: 4000, valueTolerance: 1e-7 });
    start = Array.from(result.point);
    evaluations += result.evaluations;
  }
  const n = coordinates.length;
  const h = coordinates.map((c) => c.step / 4);
  const f = (shifts: [number, number][]): number => {
    const x = [...start];
    for (const [k, sign] of shifts) x[k] += sign * h[k];
    return objective(x);
  };
  const f0 = objective(start);
  const hessian = new Float64Array(n * n);
  for (let a = 0; a < n; a++) {
    hessian[a * n + a] = (f([[a, 1]]) - 2 * f0 + f([[a, -1]])) / (h[a] * h[a]);
    for (let b = 0; b < a; b++) {
      const value = (f([[a, 1], [b, 1]]) - f([[a, 1], [b, -1]]) - f([[a, -1], [b, 1]]) + f([[a, -1], [b, -1]])) / (4 * h[a] * h[b]);
      hessian[a * n + b] = value;
      hessian[b * n + a] = value;
    }
  }
  const unit = (k: number) => Array.from({ length: n }, (_, j) => (j === k ? 1 : 0));
  const inverse = solveDense(hessian, n, coordinates.map((_, k) => unit(k))).solutions;
  const best = toPoint(start);
  const sd = Object.fromEntries(coordinates.map((c, k) => [c.name, Math.sqrt(inverse[k][k])]));
  return { best: { ...best }, sd, evaluations };
}

/** Regression-dilution prediction for a mock: reliability ratios lambda = R^2/(R^2 + <sigma^2>) and slope biases truth (lambda - 1). */
export interface Attenuation { stretchRatio: number; colorRatio: number; alphaBias: number; betaBias: number }

/**
 * The attenuation an ordinary least-squares slope would suffer with noisy covariates (Fuller 1987,
 * Measurement Error Models, section 1.1, from memory), with <sigma^2> the mean squared measurement error
 * of the drawn table.
 */
export function expectedAttenuation(table: SupernovaTable): Attenuation {
  const meanSquare = (v: Float64Array) => v.reduce((s, x) => s + x * x, 0) / v.length;
  const stretchRatio = TRUTH.x1_width ** 2 / (TRUTH.x1_width ** 2 + meanSquare(table.stretchErr as Float64Array));
  const colorRatio = TRUTH.color_width ** 2 / (TRUTH.color_width ** 2 + meanSquare(table.colorErr as Float64Array));
  return { stretchRatio, colorRatio, alphaBias: TRUTH.alpha * (stretchRatio - 1), betaBias: TRUTH.beta * (colorRatio - 1) };
}

export interface MockFits { hierarchical: FitResult; conventional: FitResult; predicted: Attenuation }

/** Draws one mock and fits it with both terms (offset marginalized, no mass step, global sigma_int). */
export function fitMock(count: number, seed: string): MockFits {
  const { table } = generateMockSurvey(mockOptions(count, seed));
  const noStep = { enabled: false, splitLogMass: 10, shape: 'sharp' as const, widthDex: 0 };
  const base = hierarchicalOptions(table, [], { offset: 'marginalize' });
  const hierarchical = createHierarchicalSupernovaTerm({ ...base, standardization: { ...base.standardization, massStep: noStep } });
  const conventionalBase = conventionalOptions(table, [], { offset: 'marginalize', fastPath: 'diagonal' });
  const conventional = createSupernovaTerm({ ...conventionalBase, standardization: { ...conventionalBase.standardization, massStep: noStep, intrinsicScatter: 'global' } });
  const stretch = table.stretch as Float64Array;
  const color = table.color as Float64Array;
  const mean = (v: Float64Array) => v.reduce((s, x) => s + x, 0) / v.length;
  const sd = (v: Float64Array) => {
    const centre = mean(v);
    return Math.sqrt(v.reduce((s, x) => s + (x - centre) ** 2, 0) / v.length);
  };
  const common: Coordinate[] = [
    { name: 'omega_m', start: 0.25, step: 0.05 }, { name: 'alpha', start: 0.12, step: 0.02 },
    { name: 'beta', start: 2.8, step: 0.2 }, { name: 'sigma_int', start: 0.12, step: 0.02 },
  ];
  const population: Coordinate[] = [
    { name: 'x1_mean', start: mean(stretch), step: 0.1 }, { name: 'x1_width', start: sd(stretch), step: 0.1, log: true },
    { name: 'color_mean', start: mean(color), step: 0.01 }, { name: 'color_width', start: sd(color), step: 0.1, log: true },
  ];
  return { hierarchical: maximize(hierarchical, [...common, ...population]), conventional: maximize(conventional, common), predicted: expectedAttenuation(table) };
}
