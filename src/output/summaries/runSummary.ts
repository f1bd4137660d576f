import type { SampleStatistics } from './sampleStatistics.js';

/** Convergence numbers of one parameter, as computed by the diagnostics layer. */
export interface ParameterDiagnostics {
  /** Rank-normalized split R-hat (Vehtari et al. 2021). */
  rHat?: number;
  /** Bulk effective sample size. */
  essBulk?: number;
  /** Tail effective sample size. */
  essTail?: number;
}

/** One row of a summary table. */
export interface ParameterSummary {
  /** Parameter name as in the configuration (snake_case), e.g. `omega_m`. */
  name: string;
  stats: SampleStatistics;
  diagnostics?: ParameterDiagnostics;
  /** True for quantities computed from the sampled ones (omega_k, age_gyr, ...). */
  derived?: boolean;
  /**
   * Set when the posterior is cut by a hard prior edge: tables then quote this
   * one-sided limit instead of mean ± sd. `upper`: the parameter is below
   * `value` with probability `mass` (the lower prior edge was touched);
   * `lower`: above it (the upper edge was touched).
   */
  oneSidedLimit?: { side: 'upper' | 'lower'; value: number; mass: number };
  /** A short qualifier printed beside the value, e.g. 'at fixed H0 = 70 km/s/Mpc'. */
  note?: string;
}

/**
 * Everything the tables need about one posterior: the input type of
 * summaryMarkdown, summaryLatex and summaryTerminal. Built by
 * summarizePosterior, or by hand (tests, the pipeline after diagnostics).
 */
export interface RunSummary {
  /** Heading, e.g. the model name. */
  title?: string;
  /** Number of samples summarized (after burn-in and thinning). */
  sampleCount: number;
  parameters: ParameterSummary[];
  /** Parameter names of the correlation matrix, in order. */
  correlationNames?: string[];
  /** Row-major correlation matrix, entry [i * p + j]. */
  correlation?: Float64Array;
  /** Highest log posterior among the samples (dimensionless, natural log). */
  maxLogPosterior?: number;
}
