import type { ForecastFacts } from './forecastFacts.js';

/**
 * The forecast as one JSON object (matrices as arrays of rows, errors by name).
 * Full double precision, snake_case keys.
 * Cost O(models x P^2).
 * @param result the forecast (the pipeline's ForecastResult has this shape).
 * @returns the JSON text, ending in a line break.
 * @throws nothing.
 * @example JSON.parse(forecastJson(result)).models[0].sigma.omega_m // the marginal error of omega_m
 */
export function forecastJson(result: ForecastFacts): string {
  const rows = (values: Float64Array, size: number): number[][] =>
    Array.from({ length: size }, (_, i) => Array.from(values.subarray(i * size, (i + 1) * size)));
  const record = {
    survey: result.surveyFile, title: result.title, seed: result.seed, supernovae: result.supernovae, samples: result.samples,
    fit_config: result.fitConfig,
    models: result.models.map((model) => {
      const size = model.parameters.length;
      return {
        label: model.label, dark_energy: model.darkEnergy, curvature: model.flat ? 'flat' : 'free',
        parameters: model.parameters,
        truth: Object.fromEntries(model.parameters.map((name, i) => [name, model.truth[i]])),
        sigma: Object.fromEntries(model.parameters.map((name, i) => [name, model.marginals.sigma[i]])),
        figure_of_merit: model.marginals.figureOfMerit,
        correlation: rows(model.marginals.correlation, size),
        covariance: rows(model.marginals.covariance, size),
        fisher: rows(model.fisher, size),
        fixed: model.fixed, gaussian_priors: model.priors, covariance_parameters: model.covarianceParameters,
        step_fraction: model.stepFraction,
        steps: Object.fromEntries(model.parameters.map((name, i) => [name, model.steps[i]])),
        halved_step_change: model.halvedStepChange, chi_square_at_truth: model.chiSquareAtTruth, notes: model.notes,
      };
    }),
    wall_seconds: result.wallSeconds,
  };
  return `${JSON.stringify(record, null, 2)}\n`;
}
