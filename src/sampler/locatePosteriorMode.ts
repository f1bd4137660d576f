import { nelderMeadSearch } from '../math/index.js';
import type { NelderMeadResult } from '../math/index.js';
import { evaluateBatchChecked } from './evaluateBatchChecked.js';
import type { BatchEvaluator } from './logProbabilityModel.js';

/** The best mode found by several Nelder-Mead searches. */
export interface PosteriorMode {
  /** Parameters at the highest log posterior found. */
  point: Float64Array;
  /** Log posterior there. */
  logProb: number;
  /** Every search's result (objective = minus log posterior), in start order. */
  searches: NelderMeadResult[];
  /** Evaluations used by all searches together. */
  evaluations: number;
}

/**
 * Maximizes the log posterior with one Nelder & Mead (1965) search (see
 * math/nelderMead.ts) from each start point, all searches advancing
 * together: the points every search asks for are evaluated in ONE evaluator
 * call, so worker threads share the work. Keeps the best end point.
 * Deterministic: no random numbers are used.
 *
 * `initialSteps` is the simplex edge per coordinate (parameter units);
 * `maxEvaluations` the budget per search.
 * Cost: up to starts x maxEvaluations model evaluations, in about
 * maxEvaluations / 1.5 batches. Throws CandelaError
 * `sampler.invalid_log_probability` for NaN model values; RangeError for
 * an empty start list or bad steps.
 * @example (await locatePosteriorMode(evaluator, [Float64Array.of(0, 0)], [0.1, 0.1], 400)).point
 */
export async function locatePosteriorMode(evaluator: BatchEvaluator, starts: Float64Array[], initialSteps: ArrayLike<number>, maxEvaluations: number): Promise<PosteriorMode> {
  if (starts.length === 0) throw new RangeError('locatePosteriorMode: no start points');
  const dimension = evaluator.dimension;
  const searches = starts.map((start) => nelderMeadSearch(start, { initialSteps, maxEvaluations }));
  const requests = searches.map((search) => search.next());
  for (;;) {
    const active = requests.flatMap((request, index) => (request.done ? [] : [index]));
    if (active.length === 0) break;
    const total = active.reduce((sum, index) => sum + (requests[index].value as Float64Array).length, 0);
    const batch = new Float64Array(total);
    let offset = 0;
    for (const index of active) {
      const points = requests[index].value as Float64Array;
      batch.set(points, offset);
      offset += points.length;
    }
    const { logProb } = await evaluateBatchChecked(evaluator, batch, total / dimension);
    let row = 0;
    for (const index of active) {
      const count = (requests[index].value as Float64Array).length / dimension;
      const objective = logProb.slice(row, row + count).map((value) => -value);
      row += count;
      requests[index] = searches[index].next(objective);
    }
  }
  const results = requests.map((request) => request.value as NelderMeadResult);
  let best = 0;
  results.forEach((result, index) => {
    if (result.value < results[best].value) best = index;
  });
  return {
    point: results[best].point,
    logProb: -results[best].value,
    searches: results,
    evaluations: results.reduce((sum, result) => sum + result.evaluations, 0),
  };
}
