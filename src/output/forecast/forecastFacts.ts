/** One model of a Fisher forecast, as the forecast files print it (plain values; the forecast layer's ModelForecast has this shape). */
export interface ForecastModelFacts {
  label: string;
  /** Dark-energy law name, as in the configuration (lambda, constant_w, cpl). */
  darkEnergy: string;
  flat: boolean;
  /** Free parameters, in matrix order. */
  parameters: readonly string[];
  /** Their values at the truth, in the parameters' units. */
  truth: ArrayLike<number>;
  /** Values held fixed, by parameter name. */
  fixed: Record<string, number>;
  /** Finite-difference steps per parameter (0 for parameters that shape only the covariance). */
  steps: ArrayLike<number>;
  /** The step rule's fraction of the conditional errors. */
  stepFraction: number;
  /** Fisher matrix including the Gaussian priors, row major. */
  fisher: Float64Array;
  /** Marginalized covariance, 1-sigma errors and correlations (row major), and the (w0, wa) figure of merit or null. */
  marginals: { covariance: Float64Array; sigma: Float64Array; correlation: Float64Array; figureOfMerit: number | null };
  /** Gaussian priors added to the diagonal, with their standard deviations. */
  priors: ReadonlyArray<{ name: string; sd: number }>;
  /** Parameters whose effect on the covariance adds information. */
  covarianceParameters: readonly string[];
  /** chi^2 of the noise-free survey at the evaluation point. */
  chiSquareAtTruth: number;
  /** Largest relative change of the results when every step is halved. */
  halvedStepChange: number;
  notes: readonly string[];
}

/** A whole forecast with what it was computed from, as the forecast files print it. */
export interface ForecastFacts {
  /** The survey description file, as given. */
  surveyFile: string;
  title: string;
  seed: number | string;
  supernovae: number;
  /** Supernovae per sample label. */
  samples: Record<string, number>;
  /** The fit configuration followed, as given, or null (default parameter set). */
  fitConfig: string | null;
  models: readonly ForecastModelFacts[];
  /** Wall-clock time, s. */
  wallSeconds: number;
}
