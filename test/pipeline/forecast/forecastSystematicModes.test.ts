// Fisher forecasts of a survey whose systematics are written as modes (C = D + U U^T,
// Woodbury path, no N x N matrix) against the same survey with the dense matrix.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseConfigText, surveyFromText } from '../../../src/config/index.js';
import type { SurveyDescription } from '../../../src/config/index.js';
import { MAX_COVARIANCE_SUPERNOVAE } from '../../../src/mock/index.js';
import { createSupernovaTerm } from '../../../src/likelihood/index.js';
import { covariancePart, fisherForecast, type ModelForecast } from '../../../src/forecast/index.js';
import { forecastSurvey } from '../../../src/pipeline/index.js';
import { drawSurvey } from '../../../src/pipeline/simulate/simulateSurvey.js';
import { forecastSetups } from '../../../src/pipeline/forecast/forecastSetups.js';
import { mockFitConfigText } from '../support/mockFitConfigText.js';
import { SMALL_SURVEY } from '../support/simulateSurveyText.js';

/**
 * Agreement of the modes forecast with the matrix forecast (the task's
 * bound on a small survey). The two likelihoods are the same algebra
 * (Woodbury 1950; the matrix determinant lemma) and differ by rounding
 * only; the Fisher matrices agree to ~1e-10 in correlation units (F_ij /
 * sqrt(F_ii F_jj)), and a well-conditioned forecast passes that on
 * (measured 8e-10 in the figure of merit and the errors).
 */
const FORECAST_RELATIVE_TOLERANCE = 1e-8;
/** Fisher matrices in correlation units, F_ij / sqrt(F_ii F_jj): measured 1.1e-10 (rounding amplified by the finite differences). */
const FISHER_CORRELATION_UNITS_TOLERANCE = 1e-9;
/**
 * Marginal errors of the default w0waCDM set on 90 supernovae, which is
 * nearly degenerate (sigma(omega_m) ~ 3.8, sigma(wa) ~ 28; the condition
 * number of its correlation matrix is 3.7e4): the 1e-10 agreement of F is
 * amplified up to ~4e-6; measured 5.5e-8. The forecast's own step check
 * (halving every step) moves it by 2e-5.
 */
const DEGENERATE_FORECAST_RELATIVE_TOLERANCE = 1e-6;
/** The covariance part alone (closed form of the trace, dense inverse vs Woodbury): rounding only. */
const COVARIANCE_PART_RELATIVE_TOLERANCE = 1e-10;

function survey(form: 'matrix' | 'modes', edit: (s: SurveyDescription) => void = () => {}): SurveyDescription {
  const result = surveyFromText(SMALL_SURVEY, 'survey.yaml');
  if (!result.ok) throw new Error('invalid test survey');
  result.value.output.systematicsForm = form;
  edit(result.value);
  return result.value;
}

/** A fit configuration of the test survey with an omega_m prior, sigma_int free and alpha, beta followed by the covariance. */
function sigmaIntFree() {
  const result = parseConfigText(mockFitConfigText('sn.csv', '', `  omega_m: { prior: gaussian, mean: 0.3, sd: 0.02 }
  w0: { prior: uniform, min: -3, max: 1 }
  wa: { prior: uniform, min: -5, max: 5 }
  abs_mag: { prior: uniform, min: -21, max: -18 }
  alpha: { prior: uniform, min: 0, max: 0.5 }
  beta: { prior: uniform, min: 0, max: 6 }
  mass_step: { fixed: 0.05 }
  sigma_int: { prior: uniform, min: 0, max: 0.5 }`), 'fit.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => `${issue.path}: ${issue.message}`).join('\n'));
  return result.value;
}

function relative(a: number, b: number): number {
  return Math.abs(a / b - 1);
}

function expectSameForecast(modes: ModelForecast, matrix: ModelForecast, tolerance: number): void {
  expect(modes.parameters).toEqual(matrix.parameters);
  expect(modes.covarianceParameters).toEqual(matrix.covarianceParameters);
  const size = modes.parameters.length;
  const diagonal = (i: number) => matrix.fisher[i * size + i];
  let worst = 0;
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      worst = Math.max(worst, Math.abs(modes.fisher[i * size + j] - matrix.fisher[i * size + j]) / Math.sqrt(diagonal(i) * diagonal(j)));
    }
  }
  expect(worst).toBeLessThan(FISHER_CORRELATION_UNITS_TOLERANCE);
  expect(relative(modes.marginals.figureOfMerit!, matrix.marginals.figureOfMerit!)).toBeLessThan(tolerance);
  modes.marginals.sigma.forEach((sigma, i) => expect(relative(sigma, matrix.marginals.sigma[i]), modes.parameters[i]).toBeLessThan(tolerance));
}

describe('fisherForecast with systematic modes', () => {
  it('equals the forecast with the dense matrix: default w0waCDM set, alpha and beta in the covariance part', () => {
    const [matrixMock, modesMock] = [drawSurvey(survey('matrix'), '99', true), drawSurvey(survey('modes'), '99', true)];
    expect(modesMock.systematicCovariance).toBeNull();
    expect(modesMock.systematicModes!.modeCount).toBe(3);
    const [setup] = forecastSetups(survey('matrix'), null, matrixMock.table.sampleNames);
    const matrix = fisherForecast(setup, matrixMock);
    const modes = fisherForecast(setup, modesMock);
    expect(modes.covarianceParameters).toEqual(['alpha', 'beta']);
    expectSameForecast(modes, matrix, DEGENERATE_FORECAST_RELATIVE_TOLERANCE);
  });

  it('equals the forecast with the dense matrix to 1e-8 in the figure of merit (omega_m prior, sigma_int free)', () => {
    const config = sigmaIntFree();
    const [matrixMock, modesMock] = [drawSurvey(survey('matrix'), '4', true), drawSurvey(survey('modes'), '4', true)];
    const [setup] = forecastSetups(survey('matrix'), config, matrixMock.table.sampleNames);
    const matrix = fisherForecast(setup, matrixMock);
    const modes = fisherForecast(setup, modesMock);
    expect(modes.covarianceParameters).toEqual(['alpha', 'beta', 'sigma_int']);
    expectSameForecast(modes, matrix, FORECAST_RELATIVE_TOLERANCE);
    // sigma_int shapes only the covariance: its Fisher entries are the covariance part alone.
    const s = modes.parameters.indexOf('sigma_int');
    const size = modes.parameters.length;
    expect(relative(modes.fisher[s * size + s], matrix.fisher[s * size + s])).toBeLessThan(COVARIANCE_PART_RELATIVE_TOLERANCE);
    // The modes carry information: without them sigma(w0) is smaller (calibration and drift are degenerate with w0, wa).
    const none = fisherForecast(setup, drawSurvey(survey('modes', (d) => {
      d.redshiftDriftMag = 0;
      d.samples.forEach((sample) => { sample.calibrationOffsetMag = 0; });
    }), '4', true));
    const w0 = modes.parameters.indexOf('w0');
    expect(none.marginals.sigma[w0]).toBeLessThan(modes.marginals.sigma[w0]);
  });
});

describe('covariancePart with systematic modes', () => {
  it('gives the information matrix of the dense C = D + U U^T (alpha, beta, sigma_int) without forming it', () => {
    const mock = drawSurvey(survey('matrix'), '4', true);
    const [setup] = forecastSetups(survey('matrix'), sigmaIntFree(), mock.table.sampleNames);
    const n = mock.table.count;
    const modes = mock.systematicModes!;
    const term = (withModes: boolean) => () => createSupernovaTerm({
      name: 'part', table: mock.table, offset: 'sample', standardization: setup.standardization, fixed: setup.fixed,
      cosmologyModel: { darkEnergy: 'cpl', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
      ...(withModes
        ? { covariances: [], systematicModes: modes, fastPath: 'low_rank' as const }
        : { covariances: [{ target: 'magnitudes' as const, size: n, values: mock.systematicCovariance!, sourceFile: 'mock' }], fastPath: 'general' as const }),
    });
    const atTruth: Record<string, number> = { ...setup.fixed };
    for (const p of setup.free) atTruth[p.name] = p.value;
    const names = setup.free.map((p) => p.name);
    const dense = covariancePart(term(false), atTruth, names, mock.systematicCovariance, n);
    const lowRank = covariancePart(term(true), atTruth, names, modes, n);
    expect(lowRank.names).toEqual(['alpha', 'beta', 'sigma_int']);
    expect(lowRank.names).toEqual(dense.names);
    // Woodbury (1950) against the dense inverse: exact algebra, COVARIANCE_PART_RELATIVE_TOLERANCE of the largest entry.
    const scale = Math.max(...Array.from(dense.information, Math.abs));
    lowRank.information.forEach((value, k) => expect(Math.abs(value - dense.information[k]) / scale).toBeLessThan(COVARIANCE_PART_RELATIVE_TOLERANCE));
    expect(dense.information[8]).toBeGreaterThan(0); // sigma_int carries information
  });
});

describe('forecastSurvey with systematics_form: modes', () => {
  mkdirSync('.candela-tmp', { recursive: true });
  const scratch = mkdtempSync(join('.candela-tmp', 'forecast-modes-'));
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it(`forecasts ${2 * MAX_COVARIANCE_SUPERNOVAE} supernovae with systematics (no N x N matrix)`, () => {
    const text = SMALL_SURVEY.replace('  covariance: sys.txt\n', '  covariance: sys.txt\n  systematics_form: modes\n')
      .replace('    count: 50', `    count: ${2 * MAX_COVARIANCE_SUPERNOVAE - 40}`);
    const path = join(scratch, 'large.yaml');
    writeFileSync(path, text);
    const result = forecastSurvey({ surveyPath: path });
    expect(result.supernovae).toBe(2 * MAX_COVARIANCE_SUPERNOVAE);
    const [model] = result.models;
    expect(model.covarianceParameters).toEqual(['alpha', 'beta']);
    expect(model.marginals.figureOfMerit).toBeGreaterThan(0);
    expect(model.halvedStepChange).toBeLessThan(1e-3);
  });
});
