/**
 * A BatchEvaluator wrapper that adds up the wall time spent inside
 * `evaluate` (every log-posterior call of a batch, in process or in the
 * worker threads including their messaging) and counts the points, so that
 * a run's wall time splits into likelihood and sampler overhead.
 */
import type { BatchEvaluator } from '../../src/sampler/index.js';

/** The wrapper with its counters (milliseconds, points); `reset()` zeroes both. */
export interface TimedEvaluator extends BatchEvaluator {
  readonly evaluateMs: number;
  readonly points: number;
  reset(): void;
}

/** Wraps `inner`; costs one hrtime pair per batch. */
export function timedEvaluator(inner: BatchEvaluator): TimedEvaluator {
  let nanoseconds = 0n;
  let points = 0;
  return {
    dimension: inner.dimension,
    blobCount: inner.blobCount,
    get evaluateMs() {
      return Number(nanoseconds) / 1e6;
    },
    get points() {
      return points;
    },
    reset() {
      nanoseconds = 0n;
      points = 0;
    },
    async evaluate(batch, count, logProb, blobs) {
      const start = process.hrtime.bigint();
      await inner.evaluate(batch, count, logProb, blobs);
      nanoseconds += process.hrtime.bigint() - start;
      points += count;
    },
    close: () => inner.close(),
  };
}
