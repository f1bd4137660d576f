import { describe, expect, it } from 'vitest';
import { parseConfigText, surveyFromText } from '../../src/config/index.js';
import type { SurveyDescription } from '../../src/config/index.js';
import { createSupernovaTerm } from '../../src/likelihood/index.js';
import { choleskyInPlace, choleskySolveInPlace } from '../../src/math/index.js';
import type { MockSurvey } from '../../src/mock/index.js';
import { drawSurvey } from '../../src/pipeline/simulate/simulateSurvey.js';
import { fisherForecast } from '../../src/forecast/index.js';
import { forecastSetups } from '../../src/pipeline/forecast/forecastSetups.js';
import { SMALL_SURVEY } from '../pipeline/support/simulateSurveyText.js';

const SPEED_OF_LIGHT_KM_PER_S = 299792.458; // CODATA exact value

function smallSurvey(edit: (survey: SurveyDescription) => void = () => {}): SurveyDescription {
  const result = surveyFromText(SMALL_SURVEY, 'survey.yaml');
  if (!result.ok) throw new Error('invalid test survey');
  edit(result.value);
  return result.value;
}

/** A fit configuration for the test survey's columns, with a parameters block. */
function fitConfig(parameters: string, model = '{ label: m, dark_energy: cpl }') {
  const text = `seed: 1
supernovae:
  - label: mock
    kind: light_curves
    table: { file: sn.csv, delimiter: comma }
    columns: { id: id, sample: sample, z: z_cmb, m_b: m_b, m_b_err: m_b_err, x1: x1, x1_err: x1_err, color: color, color_err: color_err, host_log_mass: host_log_mass }
standardization:
  host_mass_step: { enabled: true, split_log_mass: 10 }
  scatter: { intrinsic: global, lensing_per_redshift: 0.055, peculiar_velocity_km_s: 300, redshift_errors: false }
  offset: sample
models:
  - ${model}
parameters:
${parameters}
reference_h0: 70
`;
  const result = parseConfigText(text, 'fit.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => `${issue.path}: ${issue.message}`).join('\n'));
  return result.value;
}

const ALL_FIXED = `  omega_m: { fixed: 0.3 }
  w0: { fixed: -0.9 }
  wa: { fixed: 0.2 }
  alpha: { fixed: 0.14 }
  beta: { fixed: 3.1 }
  mass_step: { fixed: 0.05 }`;

/**
 * The diagonal of the covariance at the truth, by the JLA formula (Betoule
 * et al. 2014, eq. 13 from memory) with the scatter terms of the run configuration:
 * sigma_mB^2 + alpha^2 sigma_x1^2 + beta^2 sigma_c^2 + 2 alpha C_mx - 2 beta C_mc - 2 alpha beta C_xc
 * + sigma_int^2 + (0.055 z)^2 + ((5 / ln 10) (300 km/s / c) / z)^2.
 */
function handVariances(mock: MockSurvey, sigmaInt: number): Float64Array {
  const t = mock.table;
  const alpha = 0.14;
  const beta = 3.1;
  return Float64Array.from({ length: t.count }, (_, i) => t.peakMagErr![i] ** 2 + (alpha * t.stretchErr![i]) ** 2 + (beta * t.colorErr![i]) ** 2 +
    2 * alpha * t.covPeakMagStretch![i] - 2 * beta * t.covPeakMagColor![i] - 2 * alpha * beta * t.covStretchColor![i] +
    sigmaInt ** 2 + (0.055 * t.redshift[i]) ** 2 + ((5 / Math.LN10) * (300 / SPEED_OF_LIGHT_KM_PER_S) / t.redshift[i]) ** 2);
}

/** c2 of the least-squares parabola y = c0 + c1 x + c2 x^2 (normal equations solved by Cholesky). */
function quadraticCoefficient(xs: number[], ys: number[]): number {
  const normal = new Float64Array(9);
  const right = new Float64Array(3);
  xs.forEach((x, k) => {
    const powers = [1, x, x * x];
    for (let i = 0; i < 3; i++) {
      right[i] += powers[i] * ys[k];
      for (let j = 0; j < 3; j++) normal[i * 3 + j] += powers[i] * powers[j];
    }
  });
  if (!choleskyInPlace(normal, 3).ok) throw new Error('singular normal equations');
  return choleskySolveInPlace(normal, 3, right)[2];
}

describe('fisherForecast', () => {
  it('with only the offset free equals 1^T C^-1 1 computed directly (exact for a linear parameter)', () => {
    const survey = smallSurvey();
    const mock = drawSurvey(survey, '99', true);
    const config = fitConfig(`${ALL_FIXED}\n  sigma_int: { fixed: 0.1 }\n  abs_mag: { prior: uniform, min: -21, max: -18 }`);
    const [setup] = forecastSetups(survey, config, mock.table.sampleNames);
    expect(setup.free.map((p) => p.name)).toEqual(['abs_mag']);
    const forecast = fisherForecast(setup, mock);
    const n = mock.table.count;
    const covariance = Float64Array.from(mock.systematicCovariance!);
    handVariances(mock, 0.1).forEach((v, i) => { covariance[i * n + i] += v; });
    expect(choleskyInPlace(covariance, n).ok).toBe(true);
    const solved = choleskySolveInPlace(covariance, n, new Float64Array(n).fill(1));
    const expected = solved.reduce((a, b) => a + b, 0);
    expect(Math.abs(forecast.fisher[0] / expected - 1)).toBeLessThan(1e-8);
    expect(Math.abs(forecast.marginals.sigma[0] * Math.sqrt(expected) - 1)).toBeLessThan(1e-8);
    expect(forecast.chiSquareAtTruth).toBeLessThan(1e-20);
  });

  it('matches the curvature of a 1-D grid of ln L in omega_m on a large noise-free survey (within 1%)', () => {
    const survey = smallSurvey((s) => {
      s.truth = { ...s.truth, darkEnergy: 'lambda', w0: -1, wa: 0 };
      s.samples[0].count = 1500;
      s.samples[1].count = 2500;
      s.redshiftDriftMag = 0;
      s.samples.forEach((sample) => { sample.calibrationOffsetMag = 0; });
    });
    const mock = drawSurvey(survey, '5', true);
    const free = ALL_FIXED.replace('omega_m: { fixed: 0.3 }', 'omega_m: { prior: uniform, min: 0, max: 1 }').replace(/  w0: .*\n  wa: .*\n/, '');
    const config = fitConfig(`${free}\n  sigma_int: { fixed: 0.1 }\n  abs_mag: { fixed: -19.3 }`, '{ label: lcdm, dark_energy: lambda }');
    const [setup] = forecastSetups(survey, config, mock.table.sampleNames);
    expect(setup.free.map((p) => p.name)).toEqual(['omega_m']);
    expect(setup.notes).toEqual([]);
    const forecast = fisherForecast(setup, mock);
    const sigma = forecast.marginals.sigma[0];
    const term = createSupernovaTerm({
      name: 'grid', table: mock.table, covariances: [], offset: 'sample',
      cosmologyModel: { darkEnergy: 'lambda', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
      standardization: setup.standardization,
    });
    // Least-squares parabola through 41 points over +-3 sigma, in units u = x / sigma:
    // ln L = c0 + c1 u + c2 u^2, so sigma_grid = sigma / sqrt(-2 c2).
    const us = Array.from({ length: 41 }, (_, k) => (k - 20) * 0.15);
    const ys = us.map((u) => term.logLikelihood({ ...setup.fixed, omega_m: 0.3 + u * sigma, sigma_int: 0.1, abs_mag: -19.3 }));
    const curvature = quadraticCoefficient(us, ys.map((y) => y - ys[20]));
    // Measured: the grid's sigma is 2e-4 below Fisher's (the small cubic term of ln L over +-3 sigma).
    expect(Math.abs(1 / Math.sqrt(-2 * curvature) - 1)).toBeLessThan(0.01);
    expect(forecast.halvedStepChange).toBeLessThan(1e-6);
  });

  it('gives the spread of the best-fit offset over noisy realisations (Cramer-Rao bound reached by the linear Gaussian case)', () => {
    // For a parameter entering the mean linearly, the best fit M^ = (1^T C^-1 d) / (1^T C^-1 1) has
    // variance exactly 1/F (Tegmark et al. 1997, section 2). Pulls (M^ - M)/sigma_F over K realisations:
    // sum of squares ~ chi^2_K (mean K, sd sqrt(2K); Abramowitz & Stegun 1964, 26.4), tolerance 4 sd.
    const survey = smallSurvey();
    const config = fitConfig(`${ALL_FIXED}\n  sigma_int: { fixed: 0.1 }\n  abs_mag: { prior: uniform, min: -21, max: -18 }`);
    const realisations = 300;
    let sumOfSquares = 0;
    for (let k = 0; k < realisations; k++) {
      const seed = `pull-${k}`;
      const clean = drawSurvey(survey, seed, true);
      const noisy = drawSurvey(survey, seed, false);
      const [setup] = forecastSetups(survey, config, clean.table.sampleNames);
      const sigma = fisherForecast(setup, clean).marginals.sigma[0];
      const term = createSupernovaTerm({
        name: 'fit', table: noisy.table, offset: 'sample', fastPath: 'general',
        covariances: [{ target: 'magnitudes', size: noisy.table.count, values: noisy.systematicCovariance!, sourceFile: 'mock' }],
        cosmologyModel: { darkEnergy: 'cpl', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
        standardization: setup.standardization,
      });
      const best = term.bestFitOffset({ ...setup.fixed, abs_mag: -19.3 });
      sumOfSquares += ((best - -19.3) / sigma) ** 2;
    }
    expect(Math.abs(sumOfSquares - realisations)).toBeLessThan(4 * Math.sqrt(2 * realisations));
  });

  it('adds the covariance information of sigma_int: 1/2 sum (2 s)^2 / C_aa^2 for a diagonal C (Tegmark et al. 1997, eq. 15 from memory)', () => {
    const survey = smallSurvey((s) => {
      s.redshiftDriftMag = 0;
      s.samples.forEach((sample) => { sample.calibrationOffsetMag = 0; });
    });
    const mock = drawSurvey(survey, '3', true);
    const config = fitConfig(`${ALL_FIXED}\n  abs_mag: { fixed: -19.3 }\n  sigma_int: { prior: uniform, min: 0, max: 0.5 }`);
    const [setup] = forecastSetups(survey, config, mock.table.sampleNames);
    const forecast = fisherForecast(setup, mock);
    expect(forecast.covarianceParameters).toEqual(['sigma_int']);
    const expected = handVariances(mock, 0.1).reduce((sum, v) => sum + (0.5 * (2 * 0.1) ** 2) / (v * v), 0);
    expect(Math.abs(forecast.fisher[0] / expected - 1)).toBeLessThan(1e-9);
  });

  it('adds a Gaussian prior as 1/sd^2 on the diagonal', () => {
    const survey = smallSurvey();
    const mock = drawSurvey(survey, '99', true);
    const free = `  omega_m: { prior: uniform, min: 0, max: 1 }\n  w0: { fixed: -0.9 }\n  wa: { fixed: 0.2 }\n  alpha: { fixed: 0.14 }\n  beta: { fixed: 3.1 }\n  mass_step: { fixed: 0.05 }\n  sigma_int: { fixed: 0.1 }`;
    const flat = fisherForecast(forecastSetups(survey, fitConfig(`${free}\n  abs_mag: { prior: uniform, min: -21, max: -18 }`), ['near', 'far'])[0], mock);
    const withPrior = fisherForecast(forecastSetups(survey, fitConfig(`${free}\n  abs_mag: { prior: gaussian, mean: -19.3, sd: 0.05 }`), ['near', 'far'])[0], mock);
    expect(withPrior.parameters).toEqual(['omega_m', 'abs_mag']);
    expect(withPrior.fisher[3] - flat.fisher[3]).toBeCloseTo(1 / 0.05 ** 2, 6);
    expect(withPrior.fisher[0]).toBe(flat.fisher[0]);
    expect(withPrior.priors).toEqual([{ name: 'abs_mag', sd: 0.05 }]);
  });

  it('default set: w0waCDM with the covariance information of alpha and beta, a stable step and FoM = 1/sqrt(det Cov(w0, wa))', () => {
    const survey = smallSurvey();
    const mock = drawSurvey(survey, '99', true);
    const [setup] = forecastSetups(survey, null, mock.table.sampleNames);
    const forecast = fisherForecast(setup, mock);
    expect(forecast.parameters).toEqual(['omega_m', 'w0', 'wa', 'abs_mag', 'alpha', 'beta', 'mass_step']);
    expect(forecast.covarianceParameters).toEqual(['alpha', 'beta']);
    expect(forecast.chiSquareAtTruth).toBeLessThan(1e-18);
    // Measured 2e-5 for this nearly degenerate 90-supernova survey (sigma(wa) ~ 28).
    expect(forecast.halvedStepChange).toBeLessThan(1e-3);
    const c = forecast.marginals.covariance;
    const determinant = c[1 * 7 + 1] * c[2 * 7 + 2] - c[1 * 7 + 2] * c[2 * 7 + 1];
    expect(forecast.marginals.figureOfMerit).toBeCloseTo(1 / Math.sqrt(determinant), 10);
  });
});
