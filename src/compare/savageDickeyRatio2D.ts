import { CandelaError } from '../errors.js';
import { bootstrapLogSpread } from './bootstrapLogSpread.js';
import { kishEffectiveCount } from '../math/index.js';
import { kernelDensityAtPoint2D, resampledWeights, widthChoice, type KernelWidthChoice } from './kernelDensityAtPoint.js';
import { checkInsideEdges, checkSavageDickeyInput, DEFAULT_BOOTSTRAP_REPLICATES, DEFAULT_BOOTSTRAP_SEED, outOfReach } from './savageDickeyRatio.js';
import type { SavageDickeyEstimate } from './savageDickeyRatio.js';

/** Input of the 2-D Savage-Dickey ratio (e.g. w0 = -1 and wa = 0 together). */
export interface SavageDickeyInput2D extends KernelWidthChoice {
  /** Posterior draws of the first extra parameter (approximately independent). */
  xs: ArrayLike<number>;
  /** Posterior draws of the second extra parameter, same length. */
  ys: ArrayLike<number>;
  /** Optional non-negative weights. */
  weights?: ArrayLike<number>;
  /** The point [x, y] fixed by the base model (e.g. [-1, 0]). */
  nestedPoint: readonly [number, number];
  /** Joint prior density of the extended model at that point (1 / (x units x y units)). */
  priorDensity: number;
  /** Lower prior edges [ax, ay] for reflection (-Infinity for none). */
  lowerEdges?: readonly [number, number];
  /** Upper prior edges [bx, by] for reflection (Infinity for none). */
  upperEdges?: readonly [number, number];
  /** Kernel standard deviations [hx, hy] of the product kernel, parameter units (default: `bandwidthRule`, Scott's unless set, per axis, times `bandwidthFactor`, as the plotted contours). */
  bandwidths?: readonly [number, number];
  /** Bootstrap replicates (default 200). */
  bootstrapReplicates?: number;
  /** Seed of the bootstrap stream. */
  seed?: string;
}

/**
 * Savage-Dickey density ratio for a base model that fixes two parameters of
 * the extended one (Dickey 1971; Trotta 2007, with a 2-D point):
 * B_01 = p(x0, y0 | data, extended) / pi(x0, y0 | extended), the joint
 * posterior density from the kernel estimate of the plotted contours
 * (math/density: weighted Gaussian product kernel, Scott's rule per axis on
 * the Kish effective count, reflection at the prior edges), and a bootstrap
 * error as in the 1-D form.
 *
 * Cost: O(n x images) for the estimate plus replicates times that for the bootstrap.
 * @param input Draws, weights, nested point, joint prior density, options.
 * @returns ln B_01 (positive favours the base model) with its bootstrap error.
 * @throws CandelaError `compare.invalid_argument` for bad inputs; `compare.savage_dickey_out_of_reach` when the estimate is 0.
 * @example savageDickeyRatio2D({ xs: w0, ys: wa, nestedPoint: [-1, 0], priorDensity: 1 / 12 }).logBayesFactor
 */
export function savageDickeyRatio2D(input: SavageDickeyInput2D): SavageDickeyEstimate {
  const { xs, ys, nestedPoint, priorDensity } = input;
  const replicates = input.bootstrapReplicates ?? DEFAULT_BOOTSTRAP_REPLICATES;
  checkSavageDickeyInput(xs.length, priorDensity, replicates);
  if (ys.length !== xs.length) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'ys', message: 'both coordinates need the same number of draws', expected: String(xs.length), found: String(ys.length) });
  }
  const { weights } = input;
  const lower = input.lowerEdges ?? [-Infinity, -Infinity];
  const upper = input.upperEdges ?? [Infinity, Infinity];
  checkInsideEdges(nestedPoint[0], lower[0], upper[0], 'nestedPoint[0]');
  checkInsideEdges(nestedPoint[1], lower[1], upper[1], 'nestedPoint[1]');
  const bounds = [{ lower: lower[0], upper: upper[0] }, { lower: lower[1], upper: upper[1] }] as const;
  const { density: posteriorDensity, bandwidths } = kernelDensityAtPoint2D(xs, ys, weights, nestedPoint, bounds, input.bandwidths, widthChoice(input));
  if (!(posteriorDensity > 0)) throw outOfReach(`(${nestedPoint.join(', ')})`);
  const { spread, used } = bootstrapLogSpread(xs.length, replicates, input.seed ?? DEFAULT_BOOTSTRAP_SEED, (indices) =>
    kernelDensityAtPoint2D(xs, ys, resampledWeights(weights, xs.length, indices), nestedPoint, bounds, bandwidths).density,
  );
  return {
    logBayesFactor: Math.log(posteriorDensity) - Math.log(priorDensity),
    logBayesFactorError: spread,
    posteriorDensity,
    priorDensity,
    effectiveSampleSize: kishEffectiveCount(weights ?? xs.length),
    bootstrapReplicates: used,
    bandwidth: [bandwidths[0] ** 2, 0, 0, bandwidths[1] ** 2],
  };
}
