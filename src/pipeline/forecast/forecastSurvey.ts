import { readConfigFile } from '../../config/index.js';
import type { CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';
import type { Issue } from '../../errors.js';
import { fisherForecast } from '../../forecast/index.js';
import type { ModelForecast } from '../../forecast/index.js';
import type { ForecastFacts } from '../../output/index.js';
import { forecastSetups } from './forecastSetups.js';
import type { ForecastSetup } from './forecastSetups.js';
import { drawSurvey, loadSurvey } from '../simulate/simulateSurvey.js';

/** What the caller asks of `candela simulate --forecast`. */
export interface ForecastRequest {
  /** The survey description file. */
  surveyPath: string;
  /** A run configuration whose models, free parameters, priors and standardization the forecast follows (default: see forecastSetups). */
  fitConfigPath?: string;
  /** Replaces the description's seed (the forecast depends on it only through the drawn redshifts and populations). */
  seed?: string;
}

/** The forecast of every model, with what it was computed from (the facts the output layer prints, plus the warnings). */
export interface ForecastResult extends ForecastFacts {
  models: ModelForecast[];
  /** Problems that did not stop the forecast (survey and configuration warnings). */
  warnings: Issue[];
}

/**
 * Expected constraints of a survey: draws its noise-free realisation (the
 * same supernovae as `candela simulate` with this seed, every noise deviate
 * zero; for a model that does not contain the truth, the realisation of its
 * fiducial, see forecastSetups), builds the likelihood of each model as the
 * fit would, and computes the Fisher matrix at the truth (fisherForecast).
 * Writes nothing.
 * Cost: with a systematic matrix (output.systematics_form: matrix), an
 * N x N factorization per model plus O(P^2 N^2), and O(N^3) more per model
 * whose covariance follows alpha, beta or sigma_int; with the 'modes' form
 * O(P^2 N K^2) per model and no N x N matrix (10^5 supernovae are feasible).
 * @param request survey file, optional fit configuration, optional seed.
 * @throws CandelaError with every problem of either file, or when a forecast is degenerate.
 * @example forecastSurvey({ surveyPath: 'configs/demo-survey.yaml' }).models[0].marginals.figureOfMerit
 */
export function forecastSurvey(request: ForecastRequest): ForecastResult {
  const started = Date.now();
  const survey = loadSurvey(request.surveyPath);
  let config: CandelaConfig | null = null;
  const warnings = [...survey.warnings];
  if (request.fitConfigPath) {
    const read = readConfigFile(request.fitConfigPath);
    if (!read.ok) throw new CandelaError(read.issues);
    config = read.value;
    warnings.push(...read.warnings);
  }
  const seed = request.seed ?? survey.value.seed;
  const mock = drawSurvey(survey.value, String(seed), true);
  const setups = forecastSetups(survey.value, config, mock.table.sampleNames);
  const truth = survey.value.truth;
  const sameAsTruth = (setup: ForecastSetup): boolean =>
    (Object.keys(truth) as Array<keyof typeof truth>).every((key) => setup.fiducial[key] === truth[key]);
  const models = setups.map((setup) => fisherForecast(setup, sameAsTruth(setup) ? mock : drawSurvey({ ...survey.value, truth: setup.fiducial }, String(seed), true)));
  const samples: Record<string, number> = {};
  for (const sample of survey.value.samples) samples[sample.label] = sample.count;
  return {
    surveyFile: request.surveyPath, title: survey.value.title, seed, supernovae: mock.table.count, samples,
    fitConfig: request.fitConfigPath ?? null, models, warnings, wallSeconds: (Date.now() - started) / 1000,
  };
}
