import { MessageChannel, Worker, receiveMessageOnPort, type MessagePort } from 'node:worker_threads';
import { CandelaError } from '../errors.js';
import type { BatchEvaluator, LogProbabilityModel, WorkerModelSpec } from './logProbabilityModel.js';
import {
  CONTROL, STATUS_FAILED, STOP_REQUEST, awaitChange, blockEvaluator, claimAndEvaluate, controlSlots, createDataBlock, threadSlot,
  type DataBlockMessage, type WorkerThreadData, type WorkerThreadReply,
} from './sharedBatchChannel.js';
import { WORKER_THREAD_ROLE } from './workerPoolThread.js';

/*
 * The parallel evaluator, main side (the worker side is workerPoolThread.ts;
 * the protocol is in sharedBatchChannel.ts). The points of a batch go into
 * one shared block; the threads, and the calling thread itself when it is
 * given the model (`localModel`: it would otherwise sit idle), claim them a
 * few at a time until none are left, so the work balances itself between
 * threads of different speed. A request is an atomic store and a notify, so
 * the per-batch cost is microseconds instead of a message round trip
 * through both event loops.
 */

/** Longest single blocking wait for a worker, ms; between waits the event loop runs, so a worker that died is noticed. */
const WAIT_SLICE_MS = 100;

interface PoolMember { worker: Worker; port: MessagePort; done: number; status: number }

/** Options of {@link createWorkerPoolEvaluator}. */
export interface WorkerPoolOptions {
  /**
   * The same model, built in the calling thread: when given, the caller
   * evaluates one chunk of every batch itself while the threads do theirs
   * (so `threads` = cores - 1 keeps every core busy). Must be the very
   * function the spec builds, or chains would depend on the thread count.
   * A function is called once the threads have built their models, so the
   * caller can build its own copy meanwhile, in parallel with them.
   */
  localModel?: LogProbabilityModel | (() => LogProbabilityModel);
}

/** The compiled worker script (maps src/*.ts to dist/src/*.js when running from source). */
function workerScriptUrl(): URL {
  const here = import.meta.url;
  if (!here.endsWith('.ts')) return new URL('./workerPoolThread.js', here);
  return new URL(here.replace(/\/src\/sampler\/[^/]+\.ts$/, '/dist/src/sampler/workerPoolThread.js'));
}

function replyToError(reply: Extract<WorkerThreadReply, { kind: 'failed' }>): Error {
  if (reply.name === 'CandelaError' && reply.issues) return new CandelaError(reply.issues);
  if (reply.stage === 'load') {
    return new CandelaError({
      code: 'sampler.worker_model_failed',
      message: `an evaluation worker could not build the model: ${reply.message}`,
      fix: 'check the model module URL, its export name and its init data',
    });
  }
  return new Error(`the model threw inside an evaluation worker: ${reply.message}`);
}

const yieldToEventLoop = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

/**
 * Starts `threads` worker threads, each building its own model from `spec`,
 * and returns a {@link BatchEvaluator} whose threads (and the caller, with
 * `options.localModel`) share every batch point by point (self-scheduling
 * in runs of GRAIN points). Results are bit-identical to
 * {@link createInProcessEvaluator} on the same model, for any thread count.
 *
 * Cost: thread start-up (tens of ms each, plus building the model) once; per
 * batch the evaluations in parallel, one copy of the points in and of the
 * results out, and one atomic wake-up shared by the threads. The calling
 * thread polls, then blocks in Atomics.wait (in slices of WAIT_SLICE_MS),
 * until the threads finish (awaitChange); idle threads do the same between
 * batches, so a thread spins for up to SPIN_POLLS loads before it sleeps.
 * Throws (rejects) a CandelaError `sampler.invalid_option` for a thread count
 * that is not a positive integer, `sampler.worker_model_failed` when the
 * worker script or the model cannot be loaded, `sampler.worker_mismatch`
 * when the models disagree on dimension or blob count. One batch at a time:
 * `evaluate` rejects while a previous call is still running. Call `close()`
 * when done, or the threads keep the process alive.
 * @example
 * const evaluator = await createWorkerPoolEvaluator({ moduleUrl, exportName: 'createModel', init: {} }, 1, { localModel });
 * try { await evaluator.evaluate(points, 64, logProb, blobs); } finally { await evaluator.close(); }
 */
export async function createWorkerPoolEvaluator(spec: WorkerModelSpec, threads: number, options: WorkerPoolOptions = {}): Promise<BatchEvaluator> {
  if (!Number.isInteger(threads) || threads < 1) {
    throw new CandelaError({ code: 'sampler.invalid_option', path: 'workers', message: 'the number of worker threads must be a positive integer', expected: 'an integer >= 1', found: String(threads) });
  }
  const members: PoolMember[] = [];
  let failure: Error | undefined;
  let closing = false;
  let evaluating = false;
  const control = new Int32Array(new SharedArrayBuffer(controlSlots(threads) * Int32Array.BYTES_PER_ELEMENT));
  let sequence = 0;
  const ready = Array.from({ length: threads }, (_, index) => {
    const channel = new MessageChannel();
    const data: WorkerThreadData = { role: WORKER_THREAD_ROLE, index, spec, control: control.buffer as SharedArrayBuffer, port: channel.port2 };
    const worker = new Worker(workerScriptUrl(), { workerData: data, transferList: [channel.port2] });
    members.push({ worker, port: channel.port1, ...threadSlot(index) });
    return new Promise<{ dimension: number; blobCount: number }>((resolveReady, rejectReady) => {
      worker.on('message', (reply: WorkerThreadReply) => {
        if (reply.kind === 'ready') return resolveReady(reply);
        const error = replyToError(reply);
        rejectReady(error);
        failure ??= error;
      });
      worker.on('error', (error: Error) => {
        const wrapped = new CandelaError({
          code: 'sampler.worker_model_failed',
          message: `an evaluation worker stopped: ${error.message}`,
          fix: 'when running from source, build first (npm run build) so that the compiled worker script exists',
        });
        rejectReady(wrapped);
        failure ??= wrapped;
      });
      worker.on('exit', (code) => {
        if (closing) return;
        const error = new Error(`an evaluation worker exited unexpectedly (exit code ${code})`);
        rejectReady(error);
        failure ??= error;
      });
    });
  });
  const stopAll = async (): Promise<void> => {
    closing = true;
    Atomics.store(control, CONTROL.request, STOP_REQUEST);
    Atomics.notify(control, CONTROL.request);
    for (const member of members) member.port.close();
    await Promise.all(members.map((member) => member.worker.terminate()));
  };
  let shapes: Array<{ dimension: number; blobCount: number }>;
  try {
    shapes = await Promise.all(ready);
  } catch (error) {
    await stopAll();
    throw error;
  }
  const { dimension, blobCount } = shapes[0];
  let local: LogProbabilityModel | undefined;
  try {
    local = typeof options.localModel === 'function' ? options.localModel() : options.localModel;
  } catch (error) {
    await stopAll();
    throw error;
  }
  const mismatch = shapes.some((shape) => shape.dimension !== dimension || shape.blobCount !== blobCount)
    || (local !== undefined && (local.dimension !== dimension || local.blobCount !== blobCount));
  if (mismatch) {
    await stopAll();
    throw new CandelaError({ code: 'sampler.worker_mismatch', message: 'evaluation workers built models of different dimension or blob count', expected: `${dimension} parameters and ${blobCount} blobs in every worker` });
  }
  let block = createDataBlock(0, dimension, blobCount);
  let evaluateLocally = local ? blockEvaluator(local, block) : null;

  /** Copies the points into the shared block (growing it when needed) and wakes the threads. */
  const dispatch = (points: Float64Array, count: number): void => {
    if (count > block.capacity) {
      block = createDataBlock(Math.max(count, 2 * block.capacity), dimension, blobCount);
      evaluateLocally = local ? blockEvaluator(local, block) : null;
      for (const member of members) member.port.postMessage({ data: block.buffer, capacity: block.capacity } satisfies DataBlockMessage);
      Atomics.store(control, CONTROL.capacity, block.capacity);
    }
    block.points.set(points.subarray(0, count * dimension));
    Atomics.store(control, CONTROL.count, count);
    Atomics.store(control, CONTROL.next, 0);
    sequence = sequence === 0x7fffffff ? 1 : sequence + 1;
    Atomics.store(control, CONTROL.request, sequence);
    Atomics.notify(control, CONTROL.request);
  };

  /** Waits until the thread has finished the current request; throws its failure. */
  const awaitThread = async (member: PoolMember): Promise<void> => {
    for (;;) {
      const done = Atomics.load(control, member.done);
      if (done === sequence) break;
      if (failure) throw failure;
      if (!awaitChange(control, member.done, done, WAIT_SLICE_MS)) await yieldToEventLoop();
    }
    if (Atomics.load(control, member.status) === STATUS_FAILED) {
      const reply = receiveMessageOnPort(member.port)?.message as WorkerThreadReply | undefined;
      failure ??= reply && reply.kind === 'failed' ? replyToError(reply) : new Error('the model threw inside an evaluation worker');
      throw failure;
    }
  };

  return {
    dimension,
    blobCount,
    async evaluate(points: Float64Array, count: number, logProb: Float64Array, blobs: Float64Array): Promise<void> {
      if (failure) throw failure;
      if (closing) throw new Error('the worker-pool evaluator was closed');
      if (evaluating) throw new Error('the worker-pool evaluator runs one batch at a time; await the previous evaluate');
      evaluating = true;
      try {
        dispatch(points, count);
        if (evaluateLocally) {
          try {
            claimAndEvaluate(control, count, evaluateLocally);
          } catch (error) {
            failure ??= error instanceof Error ? error : new Error(String(error)); // the threads may still be busy: stay failed
            throw failure;
          }
        }
        for (const member of members) await awaitThread(member);
        logProb.set(block.logProb.subarray(0, count));
        blobs.set(block.blobs.subarray(0, count * blobCount));
      } finally {
        evaluating = false;
      }
    },
    async close(): Promise<void> {
      await stopAll();
    },
  };
}
