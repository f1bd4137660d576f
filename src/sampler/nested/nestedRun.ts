import { CandelaError } from '../../errors.js';
import { createRandomStream, kishEffectiveCount } from '../../math/index.js';
import type { RandomStream } from '../../math/index.js';
import { buildEllipsoidalBound } from './buildEllipsoidalBound.js';
import type { EllipsoidalBound } from './buildEllipsoidalBound.js';
import { DeadPointStore } from './deadPointStore.js';
import { drawFromBound } from './drawFromBound.js';
import { addDeadPoint, createEvidenceTally } from './evidenceTally.js';
import { logAddExp } from './logAddExp.js';
import type { NestedOptions, NestedProblem, NestedProgress, NestedResult } from './nestedProblem.js';
import { resolveNestedOptions } from './resolveNestedOptions.js';
import type { ResolvedNestedOptions } from './resolveNestedOptions.js';

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
    code: 'sampler.nested_invalid_likelihood', message: 'the log-likelihood returned a value nested sampling cannot use',
    expected: 'a finite number or -Infinity', found: `${found} at theta = [${Array.from(theta).join(', ')}]`,
    fix: 'return -Infinity for unphysical parameters; never NaN or +Infinity',
  });
}

function zeroEvidence(calls: number): CandelaError {
  return new CandelaError({
    code: 'sampler.nested_zero_evidence', message: 'every point nested sampling drew had zero likelihood',
    expected: 'some prior volume with ln L > -Infinity', found: `${calls} likelihood calls, all -Infinity`, fix: 'check the prior ranges against the likelihood',
  });
}

/**
 * A nested-sampling run (the algorithm is described at runNestedSampling)
 * that advances by a bounded number of likelihood calls at a time, so that a
 * caller can let other work happen in between (an interrupt, a progress
 * display) and stop when it likes. Its random draws and arithmetic do not
 * depend on how the calls are sliced: any slicing gives the result of
 * runNestedSampling bit for bit.
 *
 * Memory O((iterations + N) D). Create, call {@link NestedRun.advance} until
 * it returns true, then {@link NestedRun.result}.
 * @example
 * const run = new NestedRun(problem, { livePoints: 200, maxUnexploredLnZ: 0.1, maxIterations: 1e5, seed: 'demo' });
 * while (!run.advance(1000)) await somethingElse();
 * run.result().logZ
 */
export class NestedRun {
  /** Log-likelihood evaluations so far (the initial live points included). */
  likelihoodCalls = 0;
  private readonly settings: ResolvedNestedOptions;
  private readonly dimension: number;
  private readonly random: RandomStream;
  private readonly liveUnit: Float64Array;
  private readonly liveTheta: Float64Array;
  private readonly liveLogL: Float64Array;
  private readonly unit: Float64Array;
  private readonly theta: Float64Array;
  private readonly scratch: Float64Array;
  private readonly store: DeadPointStore;
  private readonly tally = createEvidenceTally();
  private readonly logShrink: number;
  private readonly rebuildInterval: number;
  private bound: EllipsoidalBound | null = null;
  private sinceRebuild = 0;
  private iteration = 0;
  private remaining = Infinity;
  private stopReason: NestedResult['stopReason'] = 'iterations';
  /** Initial live points drawn so far; the iterations start once all N are. */
  private initialRows = 0;
  /** Live row being replaced, its threshold ln L*, and the draws spent on it (-1: no replacement in progress). */
  private worst = -1;
  private logLStar = -Infinity;
  private replacementCalls = 0;
  private finished: NestedResult | null = null;

  /**
   * Checks the options; draws nothing yet.
   * @throws CandelaError `sampler.invalid_option` for bad options (see resolveNestedOptions).
   */
  constructor(private readonly problem: NestedProblem, options: NestedOptions, private readonly onProgress?: NestedProgress) {
    this.dimension = problem.dimension;
    this.settings = resolveNestedOptions(options, this.dimension);
    const liveCount = this.settings.livePoints;
    this.random = createRandomStream(this.settings.seed);
    this.liveUnit = new Float64Array(liveCount * this.dimension);
    this.liveTheta = new Float64Array(liveCount * this.dimension);
    this.liveLogL = new Float64Array(liveCount);
    this.unit = new Float64Array(this.dimension);
    this.theta = new Float64Array(this.dimension);
    this.scratch = new Float64Array(this.dimension);
    this.store = new DeadPointStore(this.dimension);
    this.logShrink = Math.log(-Math.expm1(-1 / liveCount)); // ln(1 - e^(-1/N))
    this.rebuildInterval = Math.max(1, Math.round(BOUND_REBUILD_SHARE * liveCount));
  }

  /** Iterations (dead points) so far. */
  get iterations(): number {
    return this.iteration;
  }

  /**
   * Runs until about `callBudget` more likelihood calls are spent (never
   * more, and at least one while the run is not finished) or the run ends.
   * Cost: the calls, plus O(N) per iteration and O(N D^2) per bound rebuild.
   * @param callBudget likelihood calls allowed in this slice (>= 1; Infinity runs to the end).
   * @returns true once the run has finished (then {@link NestedRun.result} holds the result).
   * @throws CandelaError `sampler.nested_invalid_likelihood`, `sampler.nested_stalled`, `sampler.nested_zero_evidence`.
   */
  advance(callBudget: number): boolean {
    const stopAt = this.likelihoodCalls + Math.max(1, callBudget);
    while (this.finished === null && this.likelihoodCalls < stopAt) {
      if (this.initialRows < this.settings.livePoints) this.drawInitialPoint();
      else if (this.worst < 0) this.beginIteration();
      else this.tryReplacement();
    }
    return this.finished !== null;
  }

  /** The result once {@link NestedRun.advance} has returned true. @throws Error before that. */
  result(): NestedResult {
    if (this.finished === null) throw new Error('the nested-sampling run has not finished');
    return this.finished;
  }

  private evaluate(): number {
    this.problem.priorTransform(this.unit, this.theta);
    const value = this.problem.logLikelihood(this.theta);
    this.likelihoodCalls++;
    if (Number.isNaN(value) || value === Infinity) throw badLikelihood(value, this.theta);
    return value;
  }

  private adopt(row: number, logLikelihood: number): void {
    this.liveUnit.set(this.unit, row * this.dimension);
    this.liveTheta.set(this.theta, row * this.dimension);
    this.liveLogL[row] = logLikelihood;
  }

  private drawInitialPoint(): void {
    for (let i = 0; i < this.dimension; i++) this.unit[i] = this.random.uniform();
    this.adopt(this.initialRows, this.evaluate());
    this.initialRows++;
    if (this.initialRows === this.settings.livePoints && this.liveLogL.every((value) => value === -Infinity)) throw zeroEvidence(this.likelihoodCalls);
  }

  /** Removes the worst live point (or ends the run) and prepares its replacement. */
  private beginIteration(): void {
    const liveCount = this.settings.livePoints;
    const liveLogL = this.liveLogL;
    let worst = 0;
    let best = 0;
    for (let row = 1; row < liveCount; row++) {
      if (liveLogL[row] < liveLogL[worst]) worst = row;
      if (liveLogL[row] > liveLogL[best]) best = row;
    }
    const logX = -this.iteration / liveCount;
    this.remaining = this.tally.logZ === -Infinity ? Infinity : logAddExp(this.tally.logZ, liveLogL[best] + logX) - this.tally.logZ;
    if (this.remaining < this.settings.maxUnexploredLnZ) {
      this.stopReason = 'evidence_settled';
      this.finish();
      return;
    }
    if (this.iteration >= this.settings.maxIterations) {
      this.finish();
      return;
    }
    this.iteration++;
    this.logLStar = liveLogL[worst];
    addDeadPoint(this.tally, logX + this.logShrink, this.logLStar);
    this.store.push(this.liveTheta, worst, this.logLStar, logX + this.logShrink);
    this.onProgress?.(this.iteration, this.tally.logZ, this.remaining);
    if (this.bound === null || this.sinceRebuild >= this.rebuildInterval) {
      this.bound = buildEllipsoidalBound(this.liveUnit, this.dimension, liveCount, this.settings.enlargement, logX);
      this.sinceRebuild = 0;
    }
    this.sinceRebuild++;
    this.worst = worst;
    this.replacementCalls = 0;
  }

  /** One draw inside the bound for the replacement in progress. */
  private tryReplacement(): void {
    drawFromBound(this.bound as EllipsoidalBound, this.random, this.unit, this.scratch);
    const logLikelihood = this.evaluate();
    this.replacementCalls++;
    if (logLikelihood > this.logLStar) {
      this.adopt(this.worst, logLikelihood);
      this.worst = -1;
      return;
    }
    if (this.replacementCalls >= MAX_CALLS_PER_REPLACEMENT) {
      throw new CandelaError({
        code: 'sampler.nested_stalled',
        message: `nested sampling found no point above the likelihood threshold in ${this.replacementCalls} draws (iteration ${this.iteration})`,
        expected: 'a likelihood without plateaus whose constrained region the bounding ellipsoids can find',
        found: `ln L* = ${this.logLStar}`,
        fix: 'raise livePoints or enlargement, or check the likelihood for flat regions',
      });
    }
  }

  /** Adds the final live points, which share the remaining prior mass X equally (Skilling 2006), and the weights. */
  private finish(): void {
    const liveCount = this.settings.livePoints;
    const liveLogL = this.liveLogL;
    const logFinalWidth = -this.iteration / liveCount - Math.log(liveCount);
    const order = Array.from({ length: liveCount }, (_, row) => row).sort((a, b) => liveLogL[a] - liveLogL[b]);
    for (const row of order) {
      addDeadPoint(this.tally, logFinalWidth, liveLogL[row]);
      this.store.push(this.liveTheta, row, liveLogL[row], logFinalWidth);
    }
    if (this.tally.logZ === -Infinity) throw zeroEvidence(this.likelihoodCalls);
    const { samples, logLikelihoods, logWidths } = this.store.finish();
    const logWeights = new Float64Array(logLikelihoods.length);
    const weights = new Float64Array(logLikelihoods.length);
    for (let k = 0; k < logWeights.length; k++) {
      logWeights[k] = logLikelihoods[k] === -Infinity ? -Infinity : logWidths[k] + logLikelihoods[k] - this.tally.logZ;
      weights[k] = Math.exp(logWeights[k]);
    }
    const information = Math.max(0, this.tally.information);
    this.finished = {
      logZ: this.tally.logZ, logZError: Math.sqrt(information / liveCount), information, iterations: this.iteration,
      likelihoodCalls: this.likelihoodCalls, samples, logLikelihoods, logWeights, effectiveSampleSize: kishEffectiveCount(weights),
      stopReason: this.stopReason, remainingLogZ: this.remaining,
    };
  }
}
