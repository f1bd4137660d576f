import { NestedRun } from './nestedRun.js';
import type { NestedOptions, NestedProblem, NestedProgress, NestedResult } from './nestedProblem.js';

/**
 * Nested sampling (Skilling 2004, AIP Conf. Proc. 735, 395; Skilling 2006,
 * Bayesian Analysis 1, 833) with ellipsoidal rejection sampling (Mukherjee,
 * Parkinson & Liddle 2006) and multi-ellipsoid bounds for several modes
 * (Shaw, Bridges & Hobson 2007; Feroz & Hobson 2008).
 *
 * N live points are drawn from the prior (uniform in the unit cube, mapped by
 * `priorTransform`). Iteration i removes the live point of lowest likelihood
 * L_i, assigns it the prior mass w_i = X_(i-1) - X_i with the deterministic
 * shrinkage X_i = exp(-i / N), adds w_i L_i to Z, and replaces it by a prior
 * draw with L > L_i taken uniformly inside the enlarged bounding ellipsoids of
 * the live points. The run stops when ln(Z + L_max X_i) - ln Z < maxUnexploredLnZ; the
 * final live points are then added, each with prior mass X_i / N. The error
 * of ln Z is sqrt(H / N) (Skilling 2006).
 *
 * Deterministic for a given seed (one createRandomStream stream; the draw
 * order is fixed). Cost: about N (H + ln(1/maxUnexploredLnZ)) iterations, each one O(N)
 * scan plus a few likelihood calls (the rejection rate grows with D and with
 * the enlargement); bounds are rebuilt every BOUND_REBUILD_SHARE x N
 * iterations at O(N D^2) each. Memory O((iterations + N) D).
 *
 * Runs to the end in one go; {@link NestedRun} gives the same result in
 * slices of likelihood calls, for a caller that must stay responsive.
 *
 * Assumes the likelihood has no plateaus (regions of exactly constant L > 0);
 * a zero likelihood (-Infinity) region is fine.
 * @param problem Dimension, prior transform and log-likelihood (nats).
 * @param options Live points, maxUnexploredLnZ (nats), iteration cap, seed, enlargement.
 * @param onProgress Called after every iteration with (iteration, ln Z so far, remaining-evidence estimate in nats).
 * @returns Evidence, its error, information, the weighted posterior samples and counts.
 * @throws CandelaError `sampler.invalid_option` for bad options;
 *   `sampler.nested_invalid_likelihood` when ln L is NaN or +Infinity;
 *   `sampler.nested_stalled` when one replacement needs more than MAX_CALLS_PER_REPLACEMENT calls;
 *   `sampler.nested_zero_evidence` when every initial live point (or every point) had zero likelihood.
 * @example
 * const result = runNestedSampling(
 *   { dimension: 1, priorTransform: (u, x) => { x[0] = 20 * u[0] - 10; }, logLikelihood: (x) => -0.5 * x[0] ** 2 - 0.5 * Math.log(2 * Math.PI) },
 *   { livePoints: 200, maxUnexploredLnZ: 0.1, maxIterations: 100_000, seed: 'demo' });
 * result.logZ // about ln(1/20) = -3.00 +- 0.09
 */
export function runNestedSampling(problem: NestedProblem, options: NestedOptions, onProgress?: NestedProgress): NestedResult {
  const run = new NestedRun(problem, options, onProgress);
  run.advance(Infinity);
  return run.result();
}
