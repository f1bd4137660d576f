import type { BatchEvaluator } from '../../sampler/index.js';

/**
 * Longest stretch of evaluation between two turns of the event loop, ms.
 * Signal handlers (SIGINT, SIGTERM) only run on a turn of the event loop, so
 * this bounds how late an interrupt is noticed; a turn costs microseconds,
 * so at this spacing it is invisible in the run time.
 */
export const EVENT_LOOP_SLICE_MS = 100;

/** Thrown (rejected) by an {@link createInterruptibleEvaluator} evaluator once its signal is aborted. */
export class RunInterrupted extends Error {
  constructor() {
    super('the run was interrupted');
    this.name = 'RunInterrupted';
  }
}

/** True when `error` is a {@link RunInterrupted}. */
export function isRunInterrupted(error: unknown): error is RunInterrupted {
  return error instanceof Error && error.name === 'RunInterrupted';
}

/** Lets the event loop turn once (signal handlers, timers, I/O callbacks run), then resolves. Cost: microseconds. */
export const turnOfEventLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/**
 * Wraps an evaluator so that a long run lets the event loop turn at least
 * every `sliceMs` of evaluation and stops at once when `signal` is aborted.
 * A batch whose points would take longer than half a slice is evaluated in
 * consecutive parts sized from the time per point measured so far (the first
 * batch starts with `minimumPartPoints` points, and no part is smaller, so
 * that every thread of a worker pool has a point); between parts, and before each batch, the
 * event loop turns when a slice has passed, and an aborted signal makes
 * `evaluate` reject with {@link RunInterrupted} without touching the outputs
 * any further. The points of a batch are independent, so evaluating a batch
 * in parts gives the same numbers bit for bit; nothing here draws a random
 * number, so the random streams are untouched.
 *
 * Cost: two clock reads per part; one event-loop turn (a few microseconds)
 * per `sliceMs`. A model slower than half a slice per point is evaluated
 * `minimumPartPoints` points at a time, so give the number of threads that
 * evaluate (the caller included) to keep them all busy.
 * @param inner the evaluator doing the work (in-process or worker pool).
 * @param signal aborted on an interrupt; without one the wrapper only yields.
 * @param sliceMs longest evaluation between turns of the event loop, ms.
 * @param minimumPartPoints fewest points evaluated together (the evaluating threads), >= 1.
 * @returns an evaluator with the dimension and blob count of `inner`; `close` closes `inner`.
 * @throws (rejects) RunInterrupted after `signal` is aborted; whatever `inner` rejects with.
 * @example const evaluator = createInterruptibleEvaluator(createInProcessEvaluator(model), controller.signal)
 */
export function createInterruptibleEvaluator(inner: BatchEvaluator, signal?: AbortSignal, sliceMs = EVENT_LOOP_SLICE_MS, minimumPartPoints = 1): BatchEvaluator {
  const { dimension, blobCount } = inner;
  let lastTurn = performance.now();
  let msPerPoint = Number.NaN;
  const pauseIfDue = async (): Promise<void> => {
    if (performance.now() - lastTurn >= sliceMs) {
      await turnOfEventLoop();
      lastTurn = performance.now();
    }
    if (signal?.aborted) throw new RunInterrupted();
  };
  return {
    dimension,
    blobCount,
    async evaluate(points: Float64Array, count: number, logProb: Float64Array, blobs: Float64Array): Promise<void> {
      await pauseIfDue();
      let first = 0;
      while (first < count) {
        const fewest = Math.max(1, Math.floor(minimumPartPoints));
        const partSize = Number.isFinite(msPerPoint) ? Math.max(fewest, Math.floor(sliceMs / 2 / Math.max(msPerPoint, 1e-9))) : fewest;
        const size = Math.min(count - first, partSize);
        const started = performance.now();
        if (first === 0 && size === count) {
          await inner.evaluate(points, count, logProb, blobs);
        } else {
          await inner.evaluate(points.subarray(first * dimension), size, logProb.subarray(first), blobs.subarray(first * blobCount));
        }
        msPerPoint = (performance.now() - started) / size;
        first += size;
        if (first < count) await pauseIfDue();
      }
    },
    close: () => inner.close(),
  };
}
