/**
 * A log-probability model that costs almost nothing (a 3-dimensional standard
 * normal with 2 blobs), so that a worker pool evaluating it measures only
 * the messaging round trip of a batch. Worker factory: createTrivialModel.
 */
import type { LogProbabilityModel } from '../../src/sampler/index.js';

/** Worker-thread factory (see createWorkerPoolEvaluator); `init` is ignored. */
export function createTrivialModel(): LogProbabilityModel {
  return {
    dimension: 3,
    blobCount: 2,
    evaluate(theta, blobs, offset) {
      const value = -0.5 * (theta[0] * theta[0] + theta[1] * theta[1] + theta[2] * theta[2]);
      blobs[offset] = 0;
      blobs[offset + 1] = value;
      return value;
    },
  };
}

/** URL of this module as the workers load it (the compiled JavaScript). */
export function trivialModelUrl(): string {
  return import.meta.url.replace(/\/bench\/support\/([^/]+)\.ts$/, '/dist/bench/support/$1.js');
}
