import { CandelaError } from '../errors.js';
import { bootstrapLogSpread } from './bootstrapLogSpread.js';
import { kishEffectiveCount } from '../math/index.js';
import { kernelDensityAtPoint1D, resampledWeights, widthChoice, type KernelWidthChoice } from './kernelDensityAtPoint.js';

/** Bootstrap resamples for the Savage-Dickey error: 200 give the spread to about 5% (1 / sqrt(2 x 200)) (common practice). */
export const DEFAULT_BOOTSTRAP_REPLICATES = 200;
/** Seed of the bootstrap stream when the caller gives none. */
export const DEFAULT_BOOTSTRAP_SEED = 'savage-dickey';

/** Savage-Dickey estimate of the Bayes factor of a nested model. */
export interface SavageDickeyEstimate {
  /** ln B_01 = ln p(nested value | data, extended) - ln pi(nested value): positive favours the simpler (base) model. */
  logBayesFactor: number;
  /** Bootstrap standard deviation of ln B_01 (sampling noise of the density estimate at a fixed kernel width). */
  logBayesFactorError: number;
  /** Kernel estimate of the marginal posterior density at the nested value (1 / parameter units). */
  posteriorDensity: number;
  /** Prior density at the nested value, as passed in. */
  priorDensity: number;
  /** Kish effective number of draws. */
  effectiveSampleSize: number;
  /** Bootstrap replicates used. */
  bootstrapReplicates: number;
  /** Kernel width: [h] in 1-D; in 2-D the kernel covariance [hx^2, 0, 0, hy^2] of the product kernel (parameter units squared). */
  bandwidth: number[];
}

/** Input of the 1-D Savage-Dickey ratio. */
export interface SavageDickeyInput extends KernelWidthChoice {
  /** Posterior draws of the extra parameter under the extended model (approximately independent: thin MCMC chains first). */
  samples: ArrayLike<number>;
  /** Optional non-negative weights (e.g. nested-sampling posterior weights). */
  weights?: ArrayLike<number>;
  /** Value at which the base model fixes the parameter (e.g. w0 = -1). */
  nestedValue: number;
  /** Prior density of the extended model at that value (1 / parameter units; e.g. 1/(b - a) for a uniform prior). */
  priorDensity: number;
  /** Lower prior edge for reflection (default: none). */
  lowerEdge?: number;
  /** Upper prior edge for reflection (default: none). */
  upperEdge?: number;
  /** Kernel standard deviation, parameter units (default: `bandwidthRule`, Scott's unless set, on the Kish effective count, times `bandwidthFactor`, as the plotted marginal). */
  bandwidth?: number;
  /** Bootstrap replicates (default {@link DEFAULT_BOOTSTRAP_REPLICATES}). */
  bootstrapReplicates?: number;
  /** Seed of the bootstrap stream (default {@link DEFAULT_BOOTSTRAP_SEED}). */
  seed?: string;
}

/** Throws when the draw count, prior density or replicate count is unusable (shared with the 2-D form). */
export function checkSavageDickeyInput(sampleCount: number, priorDensity: number, replicates: number): void {
  if (sampleCount < 2) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'samples', message: 'a density estimate needs at least two draws', expected: '>= 2 draws', found: String(sampleCount) });
  }
  if (!(priorDensity > 0) || !Number.isFinite(priorDensity)) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'priorDensity', message: 'the prior density at the nested value must be positive', expected: '> 0', found: String(priorDensity) });
  }
  if (!Number.isInteger(replicates) || replicates < 2) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'bootstrapReplicates', message: 'the bootstrap needs at least two replicates', expected: 'an integer >= 2', found: String(replicates) });
  }
}

/** Throws when the nested value lies outside the prior edges (shared with the 2-D form). */
export function checkInsideEdges(value: number, lower: number, upper: number, path: string): void {
  if (!(value >= lower && value <= upper)) {
    throw new CandelaError({ code: 'compare.invalid_argument', path, message: 'the density is wanted outside the prior edges', expected: `${lower} <= value <= ${upper}`, found: String(value) });
  }
}

/** The error raised when no draw comes near the nested value. */
export function outOfReach(where: string): CandelaError {
  return new CandelaError({
    code: 'compare.savage_dickey_out_of_reach',
    message: `the posterior draws do not reach the nested value ${where}: its density estimate is zero`,
    expected: 'draws within a few kernel widths of the nested value',
    found: 'density 0',
    fix: 'the data exclude the nested value so strongly that the ratio cannot be estimated from draws; compare evidences instead',
  });
}

/**
 * Savage-Dickey density ratio (Dickey 1971, Ann. Math. Stat. 42, 204; Trotta
 * 2007, MNRAS 378, 72): when the base model fixes one parameter of
 * the extended model at a value, and the extended model's prior for the other
 * parameters at that value is the base model's prior,
 *   B_01 = p(value | data, extended) / pi(value | extended).
 * The posterior density comes from the kernel estimate of the plotted
 * marginal (math/density: weighted Gaussian kernel, Scott's rule on the Kish
 * effective count, reflection at the prior edges); its uncertainty from a
 * bootstrap over the draws, which assumes them approximately independent. The kernel estimate
 * smooths: deep in a tail it overestimates the density (by about
 * h^2 / (2 sigma^2) x (z^2 - 1) in ln p at z sigma from the mean).
 *
 * Cost: O(n) for the estimate plus O(replicates x n) for the bootstrap.
 * @param input Draws, weights, nested value, prior density and options (see {@link SavageDickeyInput}).
 * @returns ln B_01 with its bootstrap error and the ingredients.
 * @throws CandelaError `compare.invalid_argument` for bad inputs; `compare.savage_dickey_out_of_reach` when the estimate is 0.
 * @example savageDickeyRatio({ samples: w0Draws, nestedValue: -1, priorDensity: 1 / 2, lowerEdge: -2, upperEdge: 0 }).logBayesFactor
 */
export function savageDickeyRatio(input: SavageDickeyInput): SavageDickeyEstimate {
  const { samples, nestedValue, priorDensity } = input;
  const replicates = input.bootstrapReplicates ?? DEFAULT_BOOTSTRAP_REPLICATES;
  checkSavageDickeyInput(samples.length, priorDensity, replicates);
  const { weights } = input;
  const bounds = { lower: input.lowerEdge, upper: input.upperEdge };
  checkInsideEdges(nestedValue, input.lowerEdge ?? -Infinity, input.upperEdge ?? Infinity, 'nestedValue');
  const { density: posteriorDensity, bandwidth } = kernelDensityAtPoint1D(samples, weights, nestedValue, bounds, input.bandwidth, widthChoice(input));
  if (!(posteriorDensity > 0)) throw outOfReach(String(nestedValue));
  const { spread, used } = bootstrapLogSpread(samples.length, replicates, input.seed ?? DEFAULT_BOOTSTRAP_SEED, (indices) =>
    kernelDensityAtPoint1D(samples, resampledWeights(weights, samples.length, indices), nestedValue, bounds, bandwidth).density,
  );
  return {
    logBayesFactor: Math.log(posteriorDensity) - Math.log(priorDensity),
    logBayesFactorError: spread,
    posteriorDensity,
    priorDensity,
    effectiveSampleSize: kishEffectiveCount(weights ?? samples.length),
    bootstrapReplicates: used,
    bandwidth: [bandwidth],
  };
}
