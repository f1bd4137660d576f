import { evaluatePoints } from './evaluatePoints.js';
import type { BatchEvaluator, LogProbabilityModel } from './logProbabilityModel.js';

/**
 * A {@link BatchEvaluator} that evaluates every point in the calling thread,
 * one after the other. The choice for one worker, for tests, and for cheap
 * models where messaging would cost more than evaluating.
 *
 * Cost: one model evaluation per point; allocates nothing per call.
 * Throws (rejects) whatever the model throws.
 * @example
 * const evaluator = createInProcessEvaluator(model);
 * await evaluator.evaluate(points, 4, logProb, blobs);
 */
export function createInProcessEvaluator(model: LogProbabilityModel): BatchEvaluator {
  const theta = new Float64Array(model.dimension);
  return {
    dimension: model.dimension,
    blobCount: model.blobCount,
    async evaluate(points: Float64Array, count: number, logProb: Float64Array, blobs: Float64Array): Promise<void> {
      evaluatePoints(model, theta, points, 0, count, logProb, blobs);
    },
    async close(): Promise<void> {},
  };
}
