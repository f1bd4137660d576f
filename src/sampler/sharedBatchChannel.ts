import type { MessagePort } from 'node:worker_threads';
import type { Issue } from '../errors.js';
import { evaluatePoints } from './evaluatePoints.js';
import type { LogProbabilityModel } from './logProbabilityModel.js';

/*
 * The shared-memory protocol between the worker-pool evaluator (main side)
 * and its worker threads (workerPoolThread.ts). The pool shares:
 *
 * - a control block, Int32Array over a SharedArrayBuffer: the slots of
 *   CONTROL, then two per thread (done, status; see threadSlot);
 * - a data block, Float64Array over a SharedArrayBuffer, holding for
 *   `capacity` points the points (capacity x dimension), then the log
 *   posteriors (capacity), then the blobs (capacity x blobCount);
 * - one MessagePort pair per thread for the rare messages that cannot be
 *   numbers: a grown data block (main -> thread) and a failure description
 *   (thread -> main), both read synchronously with receiveMessageOnPort.
 *
 * A request: the main thread writes the points and COUNT, sets NEXT to 0,
 * stores a new sequence number in REQUEST and notifies it. Every thread (and
 * the main thread, when it shares the work) then claims GRAIN points at a
 * time with Atomics.add on NEXT until none are left, so a slower thread
 * simply takes fewer points (self-scheduling); each point is evaluated once,
 * by a pure function, so the results do not depend on who took it. A thread
 * that finds nothing left stores the sequence number in its done slot and
 * notifies it. Atomics order the plain reads and writes of the data block
 * around them (ECMAScript 2017 memory model: sequentially consistent atomics
 * synchronize with each other). No message crosses an event loop per batch.
 */

/** Index of each shared slot of the control block. */
export const CONTROL = {
  /** Sequence number of the latest request; STOP_REQUEST asks the threads to leave their loop. */
  request: 0,
  /** Points in the latest request. */
  count: 1,
  /** Points the current data block holds; larger than a thread's block means a new block waits on its port. */
  capacity: 2,
  /** The next unclaimed point of the latest request. */
  next: 3,
} as const;
/** Shared slots before the per-thread ones. */
const SHARED_SLOTS = 4;
/** Points claimed at a time: enough to make the atomic claim negligible, few enough to balance a 64-point batch. */
export const GRAIN = 2;
export const STATUS_OK = 0;
export const STATUS_FAILED = 1;
/** Request value that stops the threads. */
export const STOP_REQUEST = -1;

/**
 * Polls of a slot before blocking on it. Between two batches the main thread
 * only proposes the next positions (tens of microseconds), and a thread woken
 * from Atomics.wait starts tens of microseconds late; polling this many times
 * first (a few tens of microseconds) catches most requests and answers
 * without that latency, and costs nothing on a core that would be idle.
 */
export const SPIN_POLLS = 4000;

/**
 * Waits until control[index] differs from `value`, polling SPIN_POLLS times
 * and then blocking in Atomics.wait for at most `timeoutMs` (Infinity: no
 * limit). Returns false when it timed out with the slot unchanged.
 */
export function awaitChange(control: Int32Array, index: number, value: number, timeoutMs: number): boolean {
  for (let poll = 0; poll < SPIN_POLLS; poll++) if (Atomics.load(control, index) !== value) return true;
  return Atomics.wait(control, index, value, timeoutMs) !== 'timed-out';
}

/** Int32 slots of a control block for `threads` threads. */
export function controlSlots(threads: number): number {
  return SHARED_SLOTS + 2 * threads;
}

/** The done (sequence number of its latest finished request) and status slots of thread `index`. */
export function threadSlot(index: number): { done: number; status: number } {
  return { done: SHARED_SLOTS + 2 * index, status: SHARED_SLOTS + 2 * index + 1 };
}

/**
 * Claims and evaluates points of the current request until none are left:
 * `evaluateRange(first, count)` is called for each claimed run of at most
 * GRAIN points. Used by the threads and by the main thread alike.
 */
export function claimAndEvaluate(control: Int32Array, count: number, evaluateRange: (first: number, count: number) => void): void {
  for (;;) {
    const first = Atomics.add(control, CONTROL.next, GRAIN);
    if (first >= count) return;
    evaluateRange(first, Math.min(GRAIN, count - first));
  }
}

/** What the main thread hands a worker thread at start (workerData). */
export interface WorkerThreadData {
  role: string;
  /** This thread's index (its done and status slots). */
  index: number;
  spec: { moduleUrl: string; exportName: string; init: unknown };
  control: SharedArrayBuffer;
  port: MessagePort;
}

/** Messages from a worker thread: on the parent port at start, on the shared port after a failed request. */
export type WorkerThreadReply =
  | { kind: 'ready'; dimension: number; blobCount: number }
  | { kind: 'failed'; stage: 'load' | 'evaluate'; name: string; message: string; issues?: Issue[] };

/** A grown data block, sent main -> worker on the shared port. */
export interface DataBlockMessage { data: SharedArrayBuffer; capacity: number }

/** The data block of `capacity` points and its three regions (points row major, log posteriors, blobs row major). */
export interface DataBlock {
  readonly capacity: number;
  readonly buffer: SharedArrayBuffer;
  readonly points: Float64Array;
  readonly logProb: Float64Array;
  readonly blobs: Float64Array;
}

/**
 * Lays out a data block over `buffer` (a new one when absent). Both sides
 * call it once per growth of the block, never per batch.
 */
export function createDataBlock(capacity: number, dimension: number, blobCount: number, buffer?: SharedArrayBuffer): DataBlock {
  const shared = buffer ?? new SharedArrayBuffer(capacity * (dimension + 1 + blobCount) * Float64Array.BYTES_PER_ELEMENT);
  const whole = new Float64Array(shared, 0, capacity * (dimension + 1 + blobCount));
  return {
    capacity,
    buffer: shared,
    points: whole.subarray(0, capacity * dimension),
    logProb: whole.subarray(capacity * dimension, capacity * (dimension + 1)),
    blobs: whole.subarray(capacity * (dimension + 1)),
  };
}

/** `evaluateRange` for claimAndEvaluate: evaluates claimed runs of the block's points with `model` into the block. */
export function blockEvaluator(model: LogProbabilityModel, block: DataBlock): (first: number, count: number) => void {
  const theta = new Float64Array(model.dimension);
  return (first, count) => evaluatePoints(model, theta, block.points, first, count, block.logProb, block.blobs);
}
