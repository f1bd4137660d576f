import { CandelaError } from '../../errors.js';
import type { Issue } from '../../errors.js';
import type { NestedOptions } from './nestedProblem.js';

/**
 * Default volume enlargement of each bounding ellipsoid (>= 1). Mukherjee,
 * Parkinson & Liddle (2006) enlarge by a linear factor of about 1.5-2 in low
 * dimension; a volume factor of 1.5 is a middle value that kept ln Z unbiased
 * in the Gaussian tests (test/sampler/nested) for D <= 5 (common practice).
 */
export const DEFAULT_ELLIPSOID_ENLARGEMENT = 1.5;

/** The options with the default filled in. */
export interface ResolvedNestedOptions {
  livePoints: number;
  maxUnexploredLnZ: number;
  maxIterations: number;
  seed: string;
  enlargement: number;
}

function isPositiveInteger(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 1;
}

/**
 * Checks {@link NestedOptions} for a problem of `dimension` parameters and
 * fills the default enlargement. Every problem is collected; issue paths are
 * the option names (`livePoints`, `maxUnexploredLnZ`, ...).
 *
 * Cost: O(1).
 * @param options The caller's options (livePoints count, maxUnexploredLnZ in nats, maxIterations count, seed, enlargement as a volume factor).
 * @param dimension Number of parameters D of the problem.
 * @throws CandelaError with code `sampler.invalid_option` (one issue per bad field),
 *   including livePoints < 2 (D + 1), which is too few to fit a bounding ellipsoid.
 * @example resolveNestedOptions({ livePoints: 100, maxUnexploredLnZ: 0.1, maxIterations: 1e5, seed: 's' }, 2).enlargement // 1.5
 */
export function resolveNestedOptions(options: NestedOptions, dimension: number): ResolvedNestedOptions {
  const issues: Issue[] = [];
  const invalid = (path: string, expected: string, found: unknown): void => {
    issues.push({ code: 'sampler.invalid_option', path, message: `${path} is not valid for nested sampling`, expected, found: String(found) });
  };
  const resolved: ResolvedNestedOptions = {
    livePoints: options.livePoints,
    maxUnexploredLnZ: options.maxUnexploredLnZ,
    maxIterations: options.maxIterations,
    seed: options.seed,
    enlargement: options.enlargement ?? DEFAULT_ELLIPSOID_ENLARGEMENT,
  };
  if (!isPositiveInteger(dimension)) invalid('dimension', 'an integer >= 1', dimension);
  const minimumLive = isPositiveInteger(dimension) ? 2 * (dimension + 1) : 4;
  if (!isPositiveInteger(resolved.livePoints) || resolved.livePoints < minimumLive) {
    invalid('livePoints', `an integer >= ${minimumLive} (2 x (dimension + 1))`, resolved.livePoints);
  }
  if (!(resolved.maxUnexploredLnZ > 0) || !Number.isFinite(resolved.maxUnexploredLnZ)) invalid('maxUnexploredLnZ', 'a finite number > 0 (nats)', resolved.maxUnexploredLnZ);
  if (!isPositiveInteger(resolved.maxIterations)) invalid('maxIterations', 'an integer >= 1', resolved.maxIterations);
  if (typeof resolved.seed !== 'string' || resolved.seed.length === 0) invalid('seed', 'a non-empty string', resolved.seed);
  if (!(resolved.enlargement >= 1) || !Number.isFinite(resolved.enlargement)) invalid('enlargement', 'a finite volume factor >= 1', resolved.enlargement);
  if (issues.length > 0) throw new CandelaError(issues);
  return resolved;
}
