import { CandelaError } from '../../errors.js';
import { createRandomStream, kishEffectiveCount } from '../../math/index.js';
import { buildEllipsoidalBound } from './buildEllipsoidalBound.js';
import type { EllipsoidalBound } from './buildEllipsoidalBound.js';
import { DeadPointStore } from './deadPointStore.js';
import { drawFromBound } from './drawFromBound.js';
import { addDeadPoint, createEvidenceTally } from './evidenceTally.js';
import { logAddExp } from './logAddExp.js';
import type { NestedOptions, NestedProblem, NestedProgress, NestedResult } from './nestedProblem.js';
import { resolveNestedOptions } from './resolveNestedOptions.js';

/**
 * The bounding ellipsoids are rebuilt every 0.1 N iterations, i.e. whenever the
 * enclosed prior volume has shrunk by a further factor e^-0.1 (about 10%)
 * (common practice; rebuilding costs O(N D^2) against N / 10 replacements).
 */
export const BOUND_REBUILD_SHARE = 0.1;
/**
 * Likelihood calls allowed for one replacement before the run stops with
 * `sampler.nested_stalled` (a likelihood plateau, or a region far smaller than
 * the bound; normal runs need a few to a few tens).
 */
export const MAX_CALLS_PER_REPLACEMENT = 100_000;

function badLikelihood(found: number, theta: Float64Array): CandelaError {
  return new CandelaError({
    code: 'sampler.nested_invalid_likelihood',
    message: 'the log-likelihood returned a value nested sampling cannot use',
    expected: 'a finite number or -Infinity',
    found: `${found} at theta = [${Array.from(theta).join(', ')}]`,
    fix: 'return -Infinity for unphysical parameters; never NaN or +Infinity',
  });
}

function zeroEvidence(calls: number): CandelaError {
  return new CandelaError({
    code: 'sampler.nested_zero_evidence',
    message: 'every point nested sampling drew had zero likelihood',
    expected: 'some prior volume with ln L > -Infinity',
    found: `${calls} likelihood calls, all -Infinity`,
    fix: 'check the prior ranges against the likelihood',
  });
}

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
 * the enlargement); bounds are rebuilt every {@link BOUND_REBUILD_SHARE} x N
 * iterations at O(N D^2) each. Memory O((iterations + N) D).
 *
 * Assumes the likelihood has no plateaus (regions of exactly constant L > 0);
 * a zero likelihood (-Infinity) region is fine.
 * @param problem Dimension, prior transform and log-likelihood (nats).
 * @param options Live points, maxUnexploredLnZ (nats), iteration cap, seed, enlargement.
 * @param onProgress Called after every iteration with (iteration, ln Z so far, remaining-evidence estimate in nats).
 * @returns Evidence, its error, information, the weighted posterior samples and counts.
 * @throws CandelaError `sampler.invalid_option` for bad options;
 *   `sampler.nested_invalid_likelihood` when ln L is NaN or +Infinity;
 *   `sampler.nested_stalled` when one replacement needs more than {@link MAX_CALLS_PER_REPLACEMENT} calls;
 *   `sampler.nested_zero_evidence` when every initial live point (or every point) had zero likelihood.
 * @example
 * const result = runNestedSampling(
 *   { dimension: 1, priorTransform: (u, x) => { x[0] = 20 * u[0] - 10; }, logLikelihood: (x) => -0.5 * x[0] ** 2 - 0.5 * Math.log(2 * Math.PI) },
 *   { livePoints: 200, maxUnexploredLnZ: 0.1, maxIterations: 100_000, seed: 'demo' });
 * result.logZ // about ln(1/20) = -3.00 +- 0.09
 */
export function runNestedSampling(problem: NestedProblem, options: NestedOptions, onProgress?: NestedProgress): NestedResult {
  const dimension = problem.dimension;
  const settings = resolveNestedOptions(options, dimension);
  const liveCount = settings.livePoints;
  const random = createRandomStream(settings.seed);
  const liveUnit = new Float64Array(liveCount * dimension);
  const liveTheta = new Float64Array(liveCount * dimension);
  const liveLogL = new Float64Array(liveCount);
  const unit = new Float64Array(dimension);
  const theta = new Float64Array(dimension);
  const scratch = new Float64Array(dimension);
  let likelihoodCalls = 0;
  const evaluate = (): number => {
    problem.priorTransform(unit, theta);
    const value = problem.logLikelihood(theta);
    likelihoodCalls++;
    if (Number.isNaN(value) || value === Infinity) throw badLikelihood(value, theta);
    return value;
  };
  const adopt = (row: number, logLikelihood: number): void => {
    liveUnit.set(unit, row * dimension);
    liveTheta.set(theta, row * dimension);
    liveLogL[row] = logLikelihood;
  };
  for (let row = 0; row < liveCount; row++) {
    for (let i = 0; i < dimension; i++) unit[i] = random.uniform();
    adopt(row, evaluate());
  }
  if (liveLogL.every((value) => value === -Infinity)) throw zeroEvidence(likelihoodCalls);

  const store = new DeadPointStore(dimension);
  const tally = createEvidenceTally();
  const logShrink = Math.log(-Math.expm1(-1 / liveCount)); // ln(1 - e^(-1/N))
  const rebuildInterval = Math.max(1, Math.round(BOUND_REBUILD_SHARE * liveCount));
  let bound: EllipsoidalBound | null = null;
  let sinceRebuild = 0;
  let iteration = 0;
  let remaining = Infinity;
  let stopReason: NestedResult['stopReason'] = 'iterations';
  for (;;) {
    let worst = 0;
    let best = 0;
    for (let row = 1; row < liveCount; row++) {
      if (liveLogL[row] < liveLogL[worst]) worst = row;
      if (liveLogL[row] > liveLogL[best]) best = row;
    }
    const logX = -iteration / liveCount;
    remaining = tally.logZ === -Infinity ? Infinity : logAddExp(tally.logZ, liveLogL[best] + logX) - tally.logZ;
    if (remaining < settings.maxUnexploredLnZ) {
      stopReason = 'evidence_settled';
      break;
    }
    if (iteration >= settings.maxIterations) break;
    iteration++;
    const logLStar = liveLogL[worst];
    const logWidth = logX + logShrink;
    addDeadPoint(tally, logWidth, logLStar);
    store.push(liveTheta, worst, logLStar, logWidth);
    onProgress?.(iteration, tally.logZ, remaining);

    if (bound === null || sinceRebuild >= rebuildInterval) {
      bound = buildEllipsoidalBound(liveUnit, dimension, liveCount, settings.enlargement, logX);
      sinceRebuild = 0;
    }
    sinceRebuild++;
    for (let calls = 1; ; calls++) {
      drawFromBound(bound, random, unit, scratch);
      const logLikelihood = evaluate();
      if (logLikelihood > logLStar) {
        adopt(worst, logLikelihood);
        break;
      }
      if (calls >= MAX_CALLS_PER_REPLACEMENT) {
        throw new CandelaError({
          code: 'sampler.nested_stalled',
          message: `nested sampling found no point above the likelihood threshold in ${calls} draws (iteration ${iteration})`,
          expected: 'a likelihood without plateaus whose constrained region the bounding ellipsoids can find',
          found: `ln L* = ${logLStar}`,
          fix: 'raise livePoints or enlargement, or check the likelihood for flat regions',
        });
      }
    }
  }

  // The final live points share the remaining prior mass X equally (Skilling 2006).
  const logFinalWidth = -iteration / liveCount - Math.log(liveCount);
  const order = Array.from({ length: liveCount }, (_, row) => row).sort((a, b) => liveLogL[a] - liveLogL[b]);
  for (const row of order) {
    addDeadPoint(tally, logFinalWidth, liveLogL[row]);
    store.push(liveTheta, row, liveLogL[row], logFinalWidth);
  }
  if (tally.logZ === -Infinity) throw zeroEvidence(likelihoodCalls);
  const { samples, logLikelihoods, logWidths } = store.finish();
  const logWeights = new Float64Array(logLikelihoods.length);
  const weights = new Float64Array(logLikelihoods.length);
  for (let k = 0; k < logWeights.length; k++) {
    logWeights[k] = logLikelihoods[k] === -Infinity ? -Infinity : logWidths[k] + logLikelihoods[k] - tally.logZ;
    weights[k] = Math.exp(logWeights[k]);
  }
  const information = Math.max(0, tally.information);
  return {
    logZ: tally.logZ,
    logZError: Math.sqrt(information / liveCount),
    information,
    iterations: iteration,
    likelihoodCalls,
    samples,
    logLikelihoods,
    logWeights,
    effectiveSampleSize: kishEffectiveCount(weights),
    stopReason,
    remainingLogZ: remaining,
  };
}
