import type { LogProbabilityModel } from './logProbabilityModel.js';

/**
 * Evaluates `count` consecutive points of a row-major batch with one model:
 * point i (i = 0 .. count-1) is `points[(first + i) * dimension ...]`, its
 * log posterior goes to `logProb[first + i]` and its blobs to
 * `blobs[(first + i) * blobCount ...]`. Each point is copied into the reusable
 * `theta` buffer (length dimension) so that the model never sees a view into
 * the batch and no object is allocated per point.
 *
 * Shared by the in-process evaluator and the worker threads.
 * Cost: `count` model evaluations plus count x dimension copies.
 * Throws whatever the model throws.
 * @example evaluatePoints(model, new Float64Array(2), points, 0, 10, logProb, blobs)
 */
export function evaluatePoints(
  model: LogProbabilityModel,
  theta: Float64Array,
  points: Float64Array,
  first: number,
  count: number,
  logProb: Float64Array,
  blobs: Float64Array,
): void {
  const dimension = model.dimension;
  const blobCount = model.blobCount;
  for (let point = first; point < first + count; point++) {
    const offset = point * dimension;
    for (let k = 0; k < dimension; k++) theta[k] = points[offset + k];
    logProb[point] = model.evaluate(theta, blobs, point * blobCount);
  }
}
