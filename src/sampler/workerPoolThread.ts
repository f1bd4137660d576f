import { isMainThread, parentPort, receiveMessageOnPort, workerData } from 'node:worker_threads';
import { isCandelaError } from '../errors.js';
import type { LogProbabilityModel } from './logProbabilityModel.js';
import {
  CONTROL, STATUS_FAILED, STATUS_OK, STOP_REQUEST, awaitChange, blockEvaluator, claimAndEvaluate, createDataBlock, threadSlot,
  type DataBlockMessage, type WorkerThreadData, type WorkerThreadReply,
} from './sharedBatchChannel.js';

/*
 * The worker-thread side of the worker-pool evaluator (see
 * sharedBatchChannel.ts for the protocol). Loaded as a worker script with
 * `workerData.role === WORKER_THREAD_ROLE`; imported normally it does nothing.
 * After building the model it polls, then blocks in Atomics.wait, between requests, so
 * its event loop no longer runs: everything after start-up goes through
 * shared memory and synchronous port reads.
 */

/** workerData.role that makes this module serve as an evaluation thread. */
export const WORKER_THREAD_ROLE = 'candela-sampler-evaluator';
/** How long one blocking wait for a grown data block lasts before trying the port again, ms. */
const PORT_POLL_MS = 5;

function describeFailure(error: unknown, stage: 'load' | 'evaluate'): WorkerThreadReply {
  if (isCandelaError(error)) return { kind: 'failed', stage, name: 'CandelaError', message: error.message, issues: error.issues };
  const message = error instanceof Error ? error.message : String(error);
  return { kind: 'failed', stage, name: error instanceof Error ? error.name : 'Error', message };
}

async function loadModel(spec: WorkerThreadData['spec']): Promise<LogProbabilityModel> {
  const module = (await import(spec.moduleUrl)) as Record<string, unknown>;
  const factory = module[spec.exportName];
  if (typeof factory !== 'function') throw new Error(`${spec.moduleUrl} has no exported function '${spec.exportName}'`);
  const model = (await factory(spec.init)) as LogProbabilityModel;
  if (!model || !Number.isInteger(model.dimension) || !Number.isInteger(model.blobCount) || typeof model.evaluate !== 'function') {
    throw new Error(`'${spec.exportName}' did not return a model with integer dimension, integer blobCount and an evaluate function`);
  }
  return model;
}

/** Builds the model, reports ready, then serves requests until STOP_REQUEST or termination. */
async function serve(data: WorkerThreadData): Promise<void> {
  let model: LogProbabilityModel;
  try {
    model = await loadModel(data.spec);
  } catch (error) {
    parentPort!.postMessage(describeFailure(error, 'load'));
    return;
  }
  const { dimension, blobCount } = model;
  const control = new Int32Array(data.control);
  const slot = threadSlot(data.index);
  let block = createDataBlock(0, dimension, blobCount);
  let evaluateRange = blockEvaluator(model, block);
  // The main thread numbers requests from 1 once every thread is ready; starting from the block's
  // initial 0 (not a fresh load) keeps a request that arrives before the first wait from being missed.
  let seen = 0;
  parentPort!.postMessage({ kind: 'ready', dimension, blobCount } satisfies WorkerThreadReply);
  for (;;) {
    awaitChange(control, CONTROL.request, seen, Infinity);
    const request = Atomics.load(control, CONTROL.request);
    if (request === STOP_REQUEST) return;
    if (request === seen) continue;
    seen = request;
    while (Atomics.load(control, CONTROL.capacity) > block.capacity) {
      const received = receiveMessageOnPort(data.port);
      if (!received) {
        Atomics.wait(control, CONTROL.request, request, PORT_POLL_MS); // the grown block is on its way
        continue;
      }
      const message = received.message as DataBlockMessage;
      block = createDataBlock(message.capacity, dimension, blobCount, message.data);
      evaluateRange = blockEvaluator(model, block);
    }
    const count = Atomics.load(control, CONTROL.count);
    let status = STATUS_OK;
    try {
      claimAndEvaluate(control, count, evaluateRange);
    } catch (error) {
      data.port.postMessage(describeFailure(error, 'evaluate'));
      status = STATUS_FAILED;
    }
    Atomics.store(control, slot.status, status);
    Atomics.store(control, slot.done, request);
    Atomics.notify(control, slot.done);
  }
}

if (!isMainThread && parentPort && (workerData as { role?: string } | null)?.role === WORKER_THREAD_ROLE) {
  void serve(workerData as WorkerThreadData);
}
