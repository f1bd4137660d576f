import { forecastJson, forecastText } from '../../output/index.js';
import type { ForecastResult } from './forecastSurvey.js';

/**
 * The forecast of `candela simulate --forecast` as text for the terminal
 * (the output layer's forecastText: per model truth and 1-sigma error,
 * fixed values, priors, figure of merit, correlations, step check, notes).
 * @param result from forecastSurvey.
 * @returns the text.
 * @throws nothing.
 * @example formatForecastText(forecastSurvey({ surveyPath: 'configs/demo-survey.yaml' })).split('\n')[0] // 'Fisher forecast: ...'
 */
export function formatForecastText(result: ForecastResult): string {
  return forecastText(result);
}

/**
 * The forecast of `candela simulate --forecast --json` as one JSON object (the output layer's forecastJson).
 * @param result from forecastSurvey.
 * @returns the JSON text.
 * @throws nothing.
 * @example JSON.parse(formatForecastJson(result)).models[0].sigma.omega_m
 */
export function formatForecastJson(result: ForecastResult): string {
  return forecastJson(result);
}
