import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { CandelaError, isCandelaError } from '../errors.js';
import type { Issue } from '../errors.js';
import { evaluatePoints } from './evaluatePoints.js';
import type { BatchEvaluator, LogProbabilityModel, WorkerModelSpec } from './logProbabilityModel.js';

/*
 * The parallel evaluator, both sides in this one file (the only sampler file
 * that touches worker_threads). The main side splits a batch into contiguous
 * chunks, one per worker, and waits for all. Each worker owns three buffers
 * (points, log posteriors, blobs) that travel back and forth by transfer, not
 * by copy: the main thread fills the points buffer and transfers all three;
 * the worker evaluates in place and transfers them back. Steady state costs
 * one copy of each chunk in and one out, and no allocation.
 * The worker side runs when this module is loaded as a worker script with
 * `workerData.role === WORKER_ROLE`; imported normally it does nothing.
 */

const WORKER_ROLE = 'candela-sampler-evaluator';

interface EvaluateRequest { count: number; points: Float64Array; logProb: Float64Array; blobs: Float64Array }
type WorkerReply =
  | { kind: 'ready'; dimension: number; blobCount: number }
  | { kind: 'done'; points: Float64Array; logProb: Float64Array; blobs: Float64Array }
  | { kind: 'failed'; stage: 'load' | 'evaluate'; name: string; message: string; issues?: Issue[] };

interface Pending { first: number; count: number; logProb: Float64Array; blobs: Float64Array; resolve(): void; reject(error: Error): void }
interface PoolMember { worker: Worker; blobCount: number; points: Float64Array; logProb: Float64Array; blobs: Float64Array; pending?: Pending }

/** The compiled worker script: this file in dist/ (maps src/*.ts to dist/src/*.js when running from source). */
function workerScriptUrl(): URL {
  const here = import.meta.url;
  if (!here.endsWith('.ts')) return new URL(here);
  return new URL(here.replace(/\/src\/sampler\/([^/]+)\.ts$/, '/dist/src/sampler/$1.js'));
}

/** The buffers behind the arrays, to move (not copy) them to the other thread. */
function transferList(...arrays: Float64Array[]): ArrayBuffer[] {
  return arrays.map((array) => array.buffer as ArrayBuffer);
}

function replyToError(reply: Extract<WorkerReply, { kind: 'failed' }>): Error {
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

/**
 * Starts `workers` worker threads, each building its own model from `spec`,
 * and returns a {@link BatchEvaluator} that splits every batch into one
 * contiguous chunk per worker. Results are bit-identical to
 * {@link createInProcessEvaluator} on the same model, for any worker count.
 *
 * Cost: thread start-up (tens of ms each) once; per batch one message round
 * trip per busy worker plus the model evaluations, in parallel.
 * Throws (rejects) a CandelaError `sampler.invalid_option` for a worker count
 * that is not a positive integer, `sampler.worker_model_failed` when the
 * worker script or the model cannot be loaded, `sampler.worker_mismatch`
 * when workers disagree on dimension or blob count. One batch at a time:
 * `evaluate` rejects while a previous call is still running. Call `close()`
 * when done, or the threads keep the process alive.
 * @example
 * const evaluator = await createWorkerPoolEvaluator({ moduleUrl, exportName: 'createModel', init: {} }, 2);
 * try { await evaluator.evaluate(points, 64, logProb, blobs); } finally { await evaluator.close(); }
 */
export async function createWorkerPoolEvaluator(spec: WorkerModelSpec, workers: number): Promise<BatchEvaluator> {
  if (!Number.isInteger(workers) || workers < 1) {
    throw new CandelaError({ code: 'sampler.invalid_option', path: 'workers', message: 'the number of worker threads must be a positive integer', expected: 'an integer >= 1', found: String(workers) });
  }
  const members: PoolMember[] = [];
  let failure: Error | undefined;
  let closing = false;
  let evaluating = false;
  const fail = (member: PoolMember, error: Error): void => {
    failure ??= error;
    const pending = member.pending;
    member.pending = undefined;
    pending?.reject(error);
  };
  const ready = Array.from({ length: workers }, () => {
    const worker = new Worker(workerScriptUrl(), { workerData: { role: WORKER_ROLE, spec } });
    const member: PoolMember = { worker, blobCount: 0, points: new Float64Array(0), logProb: new Float64Array(0), blobs: new Float64Array(0) };
    members.push(member);
    return new Promise<{ dimension: number; blobCount: number }>((resolveReady, rejectReady) => {
      worker.on('message', (reply: WorkerReply) => {
        if (reply.kind === 'ready') {
          member.blobCount = reply.blobCount;
          return resolveReady(reply);
        }
        if (reply.kind === 'failed') {
          const error = replyToError(reply);
          if (reply.stage === 'load') return rejectReady(error);
          return fail(member, error);
        }
        const pending = member.pending;
        member.pending = undefined;
        member.points = reply.points;
        member.logProb = reply.logProb;
        member.blobs = reply.blobs;
        if (!pending) return;
        pending.logProb.set(reply.logProb.subarray(0, pending.count), pending.first);
        pending.blobs.set(reply.blobs.subarray(0, pending.count * member.blobCount), pending.first * member.blobCount);
        pending.resolve();
      });
      worker.on('error', (error: Error) => {
        const wrapped = new CandelaError({
          code: 'sampler.worker_model_failed',
          message: `an evaluation worker stopped: ${error.message}`,
          fix: 'when running from source, build first (npm run build) so that the compiled worker script exists',
        });
        rejectReady(wrapped);
        fail(member, wrapped);
      });
      worker.on('exit', (code) => {
        if (closing) return;
        const error = new Error(`an evaluation worker exited unexpectedly (exit code ${code})`);
        rejectReady(error);
        fail(member, error);
      });
    });
  });
  let shapes: Array<{ dimension: number; blobCount: number }>;
  try {
    shapes = await Promise.all(ready);
  } catch (error) {
    closing = true;
    await Promise.all(members.map((member) => member.worker.terminate()));
    throw error;
  }
  const { dimension, blobCount } = shapes[0];
  if (shapes.some((shape) => shape.dimension !== dimension || shape.blobCount !== blobCount)) {
    closing = true;
    await Promise.all(members.map((member) => member.worker.terminate()));
    throw new CandelaError({ code: 'sampler.worker_mismatch', message: 'evaluation workers built models of different dimension or blob count', expected: `${dimension} parameters and ${blobCount} blobs in every worker` });
  }

  const request = (member: PoolMember, points: Float64Array, first: number, count: number, logProb: Float64Array, blobs: Float64Array): Promise<void> => {
    if (member.points.length < count * dimension) member.points = new Float64Array(count * dimension);
    if (member.logProb.length < count) member.logProb = new Float64Array(count);
    if (member.blobs.length < count * blobCount) member.blobs = new Float64Array(count * blobCount);
    member.points.set(points.subarray(first * dimension, (first + count) * dimension));
    return new Promise<void>((resolve, reject) => {
      member.pending = { first, count, logProb, blobs, resolve, reject };
      const message: EvaluateRequest = { count, points: member.points, logProb: member.logProb, blobs: member.blobs };
      member.worker.postMessage(message, transferList(member.points, member.logProb, member.blobs));
    });
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
        const base = Math.floor(count / members.length);
        const remainder = count % members.length;
        const requests: Promise<void>[] = [];
        let first = 0;
        for (let index = 0; index < members.length; index++) {
          const chunk = base + (index < remainder ? 1 : 0);
          if (chunk === 0) continue;
          requests.push(request(members[index], points, first, chunk, logProb, blobs));
          first += chunk;
        }
        await Promise.all(requests);
      } finally {
        evaluating = false;
      }
    },
    async close(): Promise<void> {
      closing = true;
      await Promise.all(members.map((member) => member.worker.terminate()));
    },
  };
}

function describeFailure(error: unknown, stage: 'load' | 'evaluate'): WorkerReply {
  if (isCandelaError(error)) return { kind: 'failed', stage, name: 'CandelaError', message: error.message, issues: error.issues };
  const message = error instanceof Error ? error.message : String(error);
  return { kind: 'failed', stage, name: error instanceof Error ? error.name : 'Error', message };
}

/** Worker side: build the model from the spec, then evaluate chunks until terminated. */
async function serveAsWorker(spec: WorkerModelSpec): Promise<void> {
  const port = parentPort!;
  let model: LogProbabilityModel;
  try {
    const module = (await import(spec.moduleUrl)) as Record<string, unknown>;
    const factory = module[spec.exportName];
    if (typeof factory !== 'function') throw new Error(`${spec.moduleUrl} has no exported function '${spec.exportName}'`);
    model = (await factory(spec.init)) as LogProbabilityModel;
    if (!model || !Number.isInteger(model.dimension) || !Number.isInteger(model.blobCount) || typeof model.evaluate !== 'function') {
      throw new Error(`'${spec.exportName}' did not return a model with integer dimension, integer blobCount and an evaluate function`);
    }
  } catch (error) {
    port.postMessage(describeFailure(error, 'load'));
    return;
  }
  const theta = new Float64Array(model.dimension);
  port.on('message', (message: EvaluateRequest) => {
    try {
      evaluatePoints(model, theta, message.points, 0, message.count, message.logProb, message.blobs);
    } catch (error) {
      port.postMessage(describeFailure(error, 'evaluate'));
      return;
    }
    const reply: WorkerReply = { kind: 'done', points: message.points, logProb: message.logProb, blobs: message.blobs };
    port.postMessage(reply, transferList(message.points, message.logProb, message.blobs));
  });
  port.postMessage({ kind: 'ready', dimension: model.dimension, blobCount: model.blobCount } satisfies WorkerReply);
}

if (!isMainThread && parentPort && (workerData as { role?: string } | null)?.role === WORKER_ROLE) {
  void serveAsWorker((workerData as { spec: WorkerModelSpec }).spec);
}
