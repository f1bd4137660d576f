import { CandelaError } from '../errors.js';
import type { BatchEvaluator } from './logProbabilityModel.js';

/**
 * The error for a model that broke its contract by returning NaN or
 * +Infinity at a point (row `row` of the row-major `points`).
 * @example invalidLogProbabilityError(Float64Array.of(1, 2), 0, 2, NaN).issues[0].code // 'sampler.invalid_log_probability'
 */
export function invalidLogProbabilityError(points: Float64Array, row: number, dimension: number, value: number): CandelaError {
  const where = Array.from(points.subarray(row * dimension, (row + 1) * dimension), (v) => String(v)).join(', ');
  return new CandelaError({
    code: 'sampler.invalid_log_probability',
    message: `the model returned ${value} at (${where}); a log posterior must be finite or -Infinity`,
    fix: 'this is a bug in the model: return -Infinity (with a reason) for impossible points',
  });
}

/**
 * Evaluates `count` points (row major) outside the step loop, allocating the
 * result arrays, and checks the contract: every log posterior finite or
 * -Infinity. Used by the walker initialization.
 * Cost: one evaluator call. Throws CandelaError
 * `sampler.invalid_log_probability`; rejects with the evaluator's errors.
 * @example (await evaluateBatchChecked(evaluator, Float64Array.of(0, 0), 1)).logProb[0]
 */
export async function evaluateBatchChecked(evaluator: BatchEvaluator, points: Float64Array, count: number): Promise<{ logProb: Float64Array; blobs: Float64Array }> {
  const logProb = new Float64Array(count);
  const blobs = new Float64Array(count * evaluator.blobCount);
  if (count === 0) return { logProb, blobs };
  await evaluator.evaluate(points, count, logProb, blobs);
  for (let row = 0; row < count; row++) {
    if (!(logProb[row] < Infinity)) throw invalidLogProbabilityError(points, row, evaluator.dimension, logProb[row]);
  }
  return { logProb, blobs };
}
