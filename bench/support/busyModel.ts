/**
 * A log-probability model with a fixed, adjustable cost and nothing else: a
 * 3-dimensional standard normal whose evaluation also runs `rounds`
 * iterations of a short recurrence (about 10 ns each), so that
 * `rounds: 3000` costs about as much as the compressed supernova likelihood
 * (~30 microseconds per call). For measuring how evaluation spreads over
 * threads without building a survey. Worker factory: createBusyModel.
 */
import type { LogProbabilityModel } from '../../src/sampler/index.js';

/** Init of {@link createBusyModel}. */
export interface BusyModelInit { rounds: number }

/** Worker-thread factory (see createWorkerPoolEvaluator). */
export function createBusyModel(init: BusyModelInit): LogProbabilityModel {
  const rounds = init.rounds;
  return {
    dimension: 3,
    blobCount: 1,
    evaluate(theta, blobs, offset) {
      let state = theta[0];
      for (let round = 0; round < rounds; round++) state = Math.sin(state + round * 1e-3);
      blobs[offset] = state;
      return -0.5 * (theta[0] * theta[0] + theta[1] * theta[1] + theta[2] * theta[2]);
    },
  };
}

/** URL of this module as the workers load it (the compiled JavaScript). */
export function busyModelUrl(): string {
  return import.meta.url.replace(/\/bench\/support\/([^/]+)\.ts$/, '/dist/bench/support/$1.js');
}
