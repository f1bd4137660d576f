import { CandelaError } from '../errors.js';
import type { ResolvedEnsembleOptions } from './ensembleOptions.js';
import { ensembleSpanProblem } from './ensembleSpan.js';
import { evaluateBatchChecked } from './evaluateBatchChecked.js';
import type { BatchEvaluator } from './logProbabilityModel.js';

/**
 * Checks the walkers a run starts from and evaluates all of them in one
 * batch. `initialPositions[k]` holds ensemble k's walkers (walkers x
 * dimension). Returns the log posteriors (ensembles x walkers) and blobs
 * (ensembles x walkers x blobCount).
 *
 * Cost: one evaluator call of walkers x ensembles points plus the span check.
 * Throws CandelaError `sampler.invalid_start` (wrong number of ensembles or
 * numbers, a non-finite coordinate, a walker with -Infinity log posterior),
 * `sampler.degenerate_start` (walkers not spanning the space, see
 * ensembleSpan.ts), `sampler.invalid_log_probability`.
 * @example await evaluateInitialWalkers(settings, evaluator, start.positions)
 */
export async function evaluateInitialWalkers(settings: ResolvedEnsembleOptions, evaluator: BatchEvaluator, initialPositions: Float64Array[]): Promise<{ logProb: Float64Array; blobs: Float64Array }> {
  const { walkers, dimension, ensembles } = settings;
  const invalidStart = (message: string, fix?: string): CandelaError =>
    new CandelaError({ code: 'sampler.invalid_start', path: 'initialPositions', message, fix });
  if (initialPositions.length !== ensembles) throw invalidStart(`expected initial walkers for ${ensembles} ensembles, found ${initialPositions.length}`);
  const all = new Float64Array(ensembles * walkers * dimension);
  initialPositions.forEach((positions, k) => {
    if (positions.length !== walkers * dimension) throw invalidStart(`ensemble ${k} has ${positions.length} initial numbers, expected walkers x dimension = ${walkers * dimension}`);
    if (!positions.every(Number.isFinite)) throw invalidStart(`ensemble ${k} has a non-finite initial coordinate`);
    const problem = ensembleSpanProblem(positions, walkers, dimension);
    if (problem) {
      throw new CandelaError({ code: 'sampler.degenerate_start', path: 'initialPositions', message: `ensemble ${k}: ${problem}`, fix: 'start the walkers in a small random ball (see initializeWalkers), not at one point or on a line' });
    }
    all.set(positions, k * walkers * dimension);
  });
  const result = await evaluateBatchChecked(evaluator, all, ensembles * walkers);
  const rejected = result.logProb.indexOf(-Infinity);
  if (rejected >= 0) {
    throw invalidStart(`walker ${rejected % walkers} of ensemble ${Math.floor(rejected / walkers)} starts where the log posterior is -Infinity`, 'start every walker inside the prior (see initializeWalkers)');
  }
  return result;
}
