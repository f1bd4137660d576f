import { CandelaError } from '../errors.js';
import type { Issue } from '../errors.js';

/** Stretch-move scale a of Goodman & Weare (2010), their recommended value. */
export const DEFAULT_STRETCH_SCALE = 2;
/** Independent ensembles per run; four gives a usable between-ensemble R-hat (common practice). */
export const DEFAULT_ENSEMBLE_COUNT = 4;

/** What the caller chooses about an ensemble run. */
export interface EnsembleRunOptions {
  /** Number of parameters; must equal the evaluator's dimension. */
  dimension: number;
  /** Walkers per ensemble, at least 2 x dimension (and at least 4 when the differential-evolution move is used). */
  walkers: number;
  /** Independent ensembles stepped in lockstep (default 4). */
  ensembles?: number;
  /** Run seed; ensemble k draws from `deriveSeed(seed, 'ensemble', k)`. */
  seed: string;
  /** Stretch scale a > 1 (default 2, Goodman & Weare 2010). */
  stretchScale?: number;
  /** Probability in [0, 1] that a walker proposes a differential-evolution move instead of a stretch (default 0). */
  differentialEvolutionWeight?: number;
  /**
   * Original index of each ensemble held, when the sampler runs a subset of a
   * larger run (one part of a cluster job): held ensemble j draws from
   * `deriveSeed(seed, 'ensemble', ensembleIndices[j])`, so its chain equals
   * that ensemble's chain in the full run. Distinct integers >= 0, one per
   * ensemble; `ensembles` defaults to their count. Omitted: 0, 1, 2, ...
   */
  ensembleIndices?: readonly number[];
}

/** The options with every default filled in, as stored in snapshots. */
export interface ResolvedEnsembleOptions {
  dimension: number;
  walkers: number;
  ensembles: number;
  seed: string;
  stretchScale: number;
  differentialEvolutionWeight: number;
  /** Present only when given: original index of each held ensemble (see EnsembleRunOptions). */
  ensembleIndices?: number[];
}

function isPositiveInteger(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 1;
}

/**
 * Fills defaults and checks an {@link EnsembleRunOptions}. Every problem is
 * collected; issue paths are the option names (`walkers`, `stretchScale`,
 * ...), which the pipeline may prefix with its configuration section.
 *
 * Cost: O(1). Throws one CandelaError listing all problems: codes
 * `sampler.invalid_option`, `sampler.too_few_walkers`,
 * `sampler.dimension_mismatch` (when `evaluatorDimension` differs); a bad
 * `ensembleIndices` (repeated, negative, or not one per ensemble) is a
 * `sampler.invalid_option` at path `ensembleIndices`.
 * @example resolveEnsembleOptions({ dimension: 3, walkers: 8, seed: '1' }).ensembles // 4
 */
export function resolveEnsembleOptions(options: EnsembleRunOptions, evaluatorDimension?: number): ResolvedEnsembleOptions {
  const issues: Issue[] = [];
  const invalid = (path: string, expected: string, found: unknown): void => {
    issues.push({ code: 'sampler.invalid_option', path, message: `${path} is not valid`, expected, found: String(found) });
  };
  const resolved: ResolvedEnsembleOptions = {
    dimension: options.dimension,
    walkers: options.walkers,
    ensembles: options.ensembles ?? options.ensembleIndices?.length ?? DEFAULT_ENSEMBLE_COUNT,
    seed: options.seed,
    stretchScale: options.stretchScale ?? DEFAULT_STRETCH_SCALE,
    differentialEvolutionWeight: options.differentialEvolutionWeight ?? 0,
  };
  if (options.ensembleIndices !== undefined) {
    const indices = [...options.ensembleIndices];
    resolved.ensembleIndices = indices;
    const valid = indices.every((index) => Number.isInteger(index) && index >= 0) && new Set(indices).size === indices.length;
    if (!valid || indices.length !== resolved.ensembles) invalid('ensembleIndices', `${resolved.ensembles} distinct integers >= 0, one per ensemble`, JSON.stringify(indices));
  }
  if (!isPositiveInteger(resolved.dimension)) invalid('dimension', 'an integer >= 1', resolved.dimension);
  if (!isPositiveInteger(resolved.ensembles)) invalid('ensembles', 'an integer >= 1', resolved.ensembles);
  if (typeof resolved.seed !== 'string' || resolved.seed.length === 0) invalid('seed', 'a non-empty string', resolved.seed);
  if (!(resolved.stretchScale > 1) || !Number.isFinite(resolved.stretchScale)) invalid('stretchScale', 'a finite number > 1', resolved.stretchScale);
  const weight = resolved.differentialEvolutionWeight;
  if (!(weight >= 0 && weight <= 1)) invalid('differentialEvolutionWeight', 'a number between 0 and 1', weight);
  if (!isPositiveInteger(resolved.walkers)) {
    invalid('walkers', 'an integer', resolved.walkers);
  } else if (isPositiveInteger(resolved.dimension)) {
    // Goodman & Weare (2010): the ensemble must be able to span the parameter space; each half needs a partner set.
    const minimum = Math.max(2 * resolved.dimension, weight > 0 ? 4 : 2);
    if (resolved.walkers < minimum) {
      issues.push({
        code: 'sampler.too_few_walkers',
        path: 'walkers',
        message: `an ensemble needs at least ${minimum} walkers for ${resolved.dimension} parameters` +
          (weight > 0 ? ' (2 x dimension, and 4 for the differential-evolution move)' : ' (2 x dimension)'),
        expected: `>= ${minimum}`,
        found: String(resolved.walkers),
        fix: `use walkers: ${minimum} or more (an even number about 4 x dimension is a good start)`,
      });
    }
  }
  if (evaluatorDimension !== undefined && isPositiveInteger(resolved.dimension) && evaluatorDimension !== resolved.dimension) {
    issues.push({ code: 'sampler.dimension_mismatch', path: 'dimension', message: 'the sampler and the model disagree on the number of parameters', expected: String(evaluatorDimension), found: String(resolved.dimension) });
  }
  if (issues.length > 0) throw new CandelaError(issues);
  return resolved;
}
