/**
 * What nested sampling needs to know about a problem, how it is run and what
 * it returns. Types only; the algorithm is in runNestedSampling.ts.
 */

/**
 * A Bayesian problem for nested sampling (Skilling 2004, 2006): a prior given
 * as a map from the unit hypercube to parameter space, and a log-likelihood.
 * The evidence is Z = integral of L(theta) over the prior.
 */
export interface NestedProblem {
  /** Number of parameters D (>= 1). */
  dimension: number;
  /**
   * Maps a point `unit` of the unit cube [0, 1)^D, uniformly distributed, to a
   * parameter vector `out` distributed as the prior (e.g. inverse cumulative
   * distribution per parameter). Must write all D entries of `out` and must not
   * keep either array.
   */
  priorTransform(unit: Float64Array, out: Float64Array): void;
  /**
   * Natural log of the likelihood at `theta` (natural-log units, any additive
   * constant allowed but it enters ln Z). May be -Infinity (zero likelihood);
   * never NaN. Must not keep `theta`.
   */
  logLikelihood(theta: Float64Array): number;
}

/** How to run nested sampling. */
export interface NestedOptions {
  /** Number of live points N (an integer >= 2 (D + 1)); the ln Z error scales as 1/sqrt(N). */
  livePoints: number;
  /**
   * Stopping tolerance in nats: stop when the largest evidence the live points
   * could still add, ln(Z + L_max X) - ln Z, is below it (e.g. 0.01 to 0.5).
   */
  maxUnexploredLnZ: number;
  /** Hard cap on iterations (dead points), an integer >= 1; reaching it sets `stopReason: 'iterations'`. */
  maxIterations: number;
  /** Seed string of the random stream (src/math createRandomStream); same seed, same result. */
  seed: string;
  /**
   * Volume factor (>= 1) applied to each bounding ellipsoid after it has been
   * scaled to touch the outermost live point; default {@link DEFAULT_ELLIPSOID_ENLARGEMENT}.
   */
  enlargement?: number;
}

/** Called once per iteration with the iteration number, the running ln Z and the remaining-evidence estimate (nats). */
export type NestedProgress = (iteration: number, logZ: number, remaining: number) => void;

/** What a nested-sampling run returns. All logs are natural logs. */
export interface NestedResult {
  /** ln Z, the log evidence (same units as the log-likelihood's normalization). */
  logZ: number;
  /** Statistical uncertainty of ln Z, sqrt(H / N) (Skilling 2006). */
  logZError: number;
  /** Information (Kullback-Leibler divergence of posterior from prior) H, in nats. */
  information: number;
  /** Number of dead points removed before the final live points were added. */
  iterations: number;
  /** Number of log-likelihood evaluations, including the initial live points. */
  likelihoodCalls: number;
  /** Parameter vectors, row major (iterations + N rows of D): dead points in order of rising likelihood, then the final live points sorted. */
  samples: Float64Array;
  /** ln L of each row of `samples`. */
  logLikelihoods: Float64Array;
  /** Normalized posterior weight of each row, as a natural log (the weights sum to 1). */
  logWeights: Float64Array;
  /** Kish (1965) effective sample size of the weights, 1 / sum(weight^2). */
  effectiveSampleSize: number;
  /** Why the run stopped: the unexplored evidence fell below maxUnexploredLnZ, or maxIterations was reached. */
  stopReason: 'evidence_settled' | 'iterations';
  /** The remaining-evidence estimate ln(Z + L_max X) - ln Z when the run stopped (nats). */
  remainingLogZ: number;
}
