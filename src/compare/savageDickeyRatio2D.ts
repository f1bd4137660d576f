import { CandelaError } from '../errors.js';
import { bootstrapLogSpread } from './bootstrapLogSpread.js';
import { kernelBandwidth2D, kernelDensity2D } from './kernelDensity2D.js';
import { checkSavageDickeyInput, DEFAULT_BOOTSTRAP_REPLICATES, DEFAULT_BOOTSTRAP_SEED, outOfReach } from './savageDickeyRatio.js';
import type { SavageDickeyEstimate } from './savageDickeyRatio.js';
import { checkedWeights, effectiveDrawCount } from './weightedDraws.js';

/** Input of the 2-D Savage-Dickey ratio (e.g. w0 = -1 and wa = 0 together). */
export interface SavageDickeyInput2D {
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
  /** Kernel covariance [Hxx, Hxy, Hxy, Hyy] (default: Scott's rule). */
  bandwidthMatrix?: ArrayLike<number>;
  /** Bootstrap replicates (default 200). */
  bootstrapReplicates?: number;
  /** Seed of the bootstrap stream. */
  seed?: string;
}

/**
 * Savage-Dickey density ratio for a base model that fixes two parameters of
 * the extended one (Dickey 1971; Trotta 2007, with a 2-D point):
 * B_01 = p(x0, y0 | data, extended) / pi(x0, y0 | extended), the joint
 * posterior density from a weighted 2-D Gaussian kernel estimate with
 * reflection at the prior edges, and a bootstrap error as in the 1-D form.
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
  const weights = checkedWeights(xs.length, input.weights, 'weights');
  const bandwidthMatrix = input.bandwidthMatrix ?? kernelBandwidth2D(xs, ys, weights);
  const lower = input.lowerEdges ?? [-Infinity, -Infinity];
  const upper = input.upperEdges ?? [Infinity, Infinity];
  const posteriorDensity = kernelDensity2D(xs, ys, weights, nestedPoint, bandwidthMatrix, lower, upper);
  if (!(posteriorDensity > 0)) throw outOfReach(`(${nestedPoint.join(', ')})`);
  const { spread, used } = bootstrapLogSpread(xs.length, replicates, input.seed ?? DEFAULT_BOOTSTRAP_SEED, (indices) =>
    kernelDensity2D(xs, ys, weights, nestedPoint, bandwidthMatrix, lower, upper, indices),
  );
  return {
    logBayesFactor: Math.log(posteriorDensity) - Math.log(priorDensity),
    logBayesFactorError: spread,
    posteriorDensity,
    priorDensity,
    effectiveSampleSize: effectiveDrawCount(weights),
    bootstrapReplicates: used,
    bandwidth: Array.from(bandwidthMatrix),
  };
}
