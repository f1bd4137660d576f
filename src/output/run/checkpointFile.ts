import { closeSync, existsSync, fstatSync, fsyncSync, ftruncateSync, openSync, readFileSync, readSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError, isCandelaError } from '../../errors.js';
import { writeFailure, writeFileAtomic } from '../writeFileAtomic.js';
import type { EnsembleSnapshot, SamplerSnapshot } from '../../sampler/index.js';
import { decodeBinaryState, encodeBinaryState } from './binaryState.js';
import { RUN_FILES } from './runFolder.js';

/*
 * A checkpoint is two files. checkpoint.bin (binaryState format, rewritten
 * atomically) holds the sampler state only: options, step count, and per
 * ensemble the random-stream state, current walkers, log posteriors, blobs
 * and acceptance counts, plus the run's wall time and evaluation count; a
 * few kilobytes. chain-record.bin holds the stored chain, step after step,
 * and is only ever appended to, so a checkpoint writes the steps since the
 * previous one instead of the whole chain again.
 *
 * chain-record.bin layout: 8-byte magic 'CNDLREC1', then four uint32
 * (ensembles, walkers, dimension, blob count), zero padding to 32 bytes;
 * then one block per step, each holding for every ensemble in turn the
 * walkers' positions (walkers x dimension doubles), log posteriors (walkers
 * doubles) and blobs (walkers x blob count doubles). Doubles are stored
 * bit for bit in the byte order of the machine (little-endian on every
 * platform Node.js runs on in practice). The record may hold more steps than
 * the checkpoint (a run killed between the two writes) or end inside a step
 * (a full disk): only the checkpoint's steps count, and the next checkpoint
 * cuts the rest before appending.
 */
const RECORD_MAGIC = 'CNDLREC1';
const RECORD_HEADER_BYTES = 32;
/** Steps packed into one write or read of the chain record (bounds the buffer, not the file). */
const STEPS_PER_BLOCK = 256;

/** What a checkpoint stores besides the sampler state. */
export interface CheckpointFacts {
  /** Wall time of the run so far, s. */
  wallSeconds: number;
  /** Model evaluations of the run so far. */
  evaluations: number;
}

interface RecordShape { ensembles: number; walkers: number; dimension: number; blobCount: number }

const stepBytesOf = (shape: RecordShape): number => shape.ensembles * shape.walkers * (shape.dimension + 1 + shape.blobCount) * 8;

function shapeOf(snapshot: SamplerSnapshot): RecordShape {
  return { ensembles: snapshot.ensembles.length, walkers: snapshot.options.walkers, dimension: snapshot.options.dimension, blobCount: snapshot.blobCount };
}

function recordHeader(shape: RecordShape): Buffer {
  const header = Buffer.alloc(RECORD_HEADER_BYTES);
  header.write(RECORD_MAGIC, 0, 'latin1');
  [shape.ensembles, shape.walkers, shape.dimension, shape.blobCount].forEach((value, k) => header.writeUInt32LE(value, 8 + 4 * k));
  return header;
}

function damagedRecord(path: string, message: string): CandelaError {
  return new CandelaError({ code: 'run.bad_checkpoint', file: path, message, fix: 'start the run again with --force (the checkpoint cannot be continued)' });
}

function writeAll(descriptor: number, bytes: Buffer, position: number): void {
  let written = 0;
  while (written < bytes.length) written += writeSync(descriptor, bytes, written, bytes.length - written, position + written);
}

/** Copies steps [from, to) of every ensemble's chain into one buffer, in the record's step-block order. */
function packSteps(snapshot: SamplerSnapshot, shape: RecordShape, from: number, to: number): Buffer {
  const { walkers, dimension, blobCount } = shape;
  const block = new Float64Array((to - from) * (stepBytesOf(shape) / 8));
  let offset = 0;
  for (let step = from; step < to; step++) {
    for (const ensemble of snapshot.ensembles) {
      block.set(ensemble.chainPositions.subarray(step * walkers * dimension, (step + 1) * walkers * dimension), offset);
      offset += walkers * dimension;
      block.set(ensemble.chainLogProb.subarray(step * walkers, (step + 1) * walkers), offset);
      offset += walkers;
      block.set(ensemble.chainBlobs.subarray(step * walkers * blobCount, (step + 1) * walkers * blobCount), offset);
      offset += walkers * blobCount;
    }
  }
  return Buffer.from(block.buffer, block.byteOffset, block.byteLength);
}

/**
 * Writes a checkpoint of `snapshot` into `runDir`: first the chain record
 * (steps it lacks are appended, anything past the last whole step it should
 * hold is cut, then it is flushed to disk), then checkpoint.bin atomically,
 * so the checkpoint never counts a step the record does not hold.
 * Cost: O(steps since the last checkpoint x walkers x ensembles x (dimension + blobs)) bytes written.
 * @param runDir the run folder.
 * @param snapshot the sampler's snapshot (its chains are read, not copied whole).
 * @param facts wall time (s) and evaluations so far.
 * @throws CandelaError `output.write_failed` naming the file and the cause (full disk, read-only); `run.bad_checkpoint`
 *   when the folder's chain record belongs to another sampler shape.
 * @example writeCheckpoint('out/run', sampler.snapshot(), { wallSeconds: 12.5, evaluations: 64000 })
 */
export function writeCheckpoint(runDir: string, snapshot: SamplerSnapshot, facts: CheckpointFacts): void {
  const recordPath = join(runDir, RUN_FILES.chainRecord);
  const shape = shapeOf(snapshot);
  const stepBytes = stepBytesOf(shape);
  let descriptor: number | undefined;
  try {
    const fresh = !existsSync(recordPath);
    const target = openSync(recordPath, fresh ? 'w+' : 'r+');
    descriptor = target;
    const header = recordHeader(shape);
    if (fresh) {
      writeAll(target, header, 0);
    } else {
      const found = Buffer.alloc(RECORD_HEADER_BYTES);
      readSync(target, found, 0, RECORD_HEADER_BYTES, 0);
      if (!found.equals(header)) throw damagedRecord(recordPath, 'the chain record was written by a sampler of another shape (ensembles, walkers, parameters or blobs)');
    }
    const held = Math.floor(Math.max(0, fstatSync(target).size - RECORD_HEADER_BYTES) / stepBytes);
    const start = Math.min(held, snapshot.stepCount);
    ftruncateSync(target, RECORD_HEADER_BYTES + start * stepBytes);
    for (let from = start; from < snapshot.stepCount; from += STEPS_PER_BLOCK) {
      const to = Math.min(snapshot.stepCount, from + STEPS_PER_BLOCK);
      writeAll(target, packSteps(snapshot, shape, from, to), RECORD_HEADER_BYTES + from * stepBytes);
    }
    fsyncSync(target);
  } catch (error) {
    if (isCandelaError(error)) throw error;
    throw writeFailure(recordPath, error);
  } finally {
    if (descriptor !== undefined) closeSync(descriptor);
  }
  const state = { ...snapshot, ensembles: snapshot.ensembles.map(({ chainPositions: _p, chainLogProb: _l, chainBlobs: _b, ...live }) => live) };
  writeFileAtomic(join(runDir, RUN_FILES.checkpoint), encodeBinaryState({ snapshot: state, chainRecordSteps: snapshot.stepCount, ...facts }));
}

type StoredState = { snapshot: Omit<SamplerSnapshot, 'ensembles'> & { ensembles: Array<Partial<EnsembleSnapshot>> }; chainRecordSteps?: number } & CheckpointFacts;

/**
 * Reads the checkpoint of `runDir` back into a whole snapshot: the sampler
 * state from checkpoint.bin and its steps from chain-record.bin (steps past
 * the checkpoint's are ignored). A checkpoint that holds its chains itself
 * (written before the chain record existed) is read as it is.
 * Cost: O(stored chain) time and memory, read in blocks of STEPS_PER_BLOCK steps.
 * @param runDir the run folder.
 * @returns the snapshot, wall time (s) and evaluations.
 * @throws CandelaError `run.bad_checkpoint` when either file is unreadable, damaged, or the record is shorter than
 *   the checkpoint; Error from the file system when checkpoint.bin is missing.
 * @example readCheckpoint('out/run').snapshot.stepCount // 1200
 */
export function readCheckpoint(runDir: string): { snapshot: SamplerSnapshot } & CheckpointFacts {
  const checkpointPath = join(runDir, RUN_FILES.checkpoint);
  let saved: StoredState;
  try {
    saved = decodeBinaryState<StoredState>(readFileSync(checkpointPath));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw error;
    throw damagedRecord(checkpointPath, `the checkpoint is damaged: ${(error as Error).message}`);
  }
  const { wallSeconds, evaluations } = saved;
  if (saved.chainRecordSteps === undefined) return { snapshot: saved.snapshot as SamplerSnapshot, wallSeconds, evaluations };
  const steps = saved.snapshot.stepCount;
  const { walkers, dimension } = saved.snapshot.options;
  const blobCount = saved.snapshot.blobCount;
  const chains = saved.snapshot.ensembles.map(() => ({
    chainPositions: new Float64Array(steps * walkers * dimension), chainLogProb: new Float64Array(steps * walkers), chainBlobs: new Float64Array(steps * walkers * blobCount),
  }));
  const shape: RecordShape = { ensembles: saved.snapshot.ensembles.length, walkers, dimension, blobCount };
  visitChainRecord(runDir, shape, steps, (step, ensemble, positions, logProb, blobs) => {
    chains[ensemble].chainPositions.set(positions, step * walkers * dimension);
    chains[ensemble].chainLogProb.set(logProb, step * walkers);
    chains[ensemble].chainBlobs.set(blobs, step * walkers * blobCount);
  });
  const ensembles = saved.snapshot.ensembles.map((live, k) => ({ ...live, ...chains[k] }) as EnsembleSnapshot);
  return { snapshot: { ...saved.snapshot, ensembles } as SamplerSnapshot, wallSeconds, evaluations };
}

/** The layout of a chain record: ensembles, walkers, parameters and blobs per walker. */
export type ChainRecordShape = RecordShape;

/**
 * Streams the first `steps` steps of the chain record of `runDir`, calling
 * `visit` once per step and ensemble with views (valid during the call only)
 * of that ensemble's walkers: positions (walkers x dimension), log
 * posteriors (walkers) and blobs (walkers x blob count).
 * Cost: O(steps x walkers x ensembles x (dimension + blobs)); memory one block of STEPS_PER_BLOCK steps.
 * @param runDir the run folder.
 * @param shape the layout the record must have.
 * @param steps steps to read (the record may hold more).
 * @param visit receives (step, ensemble, positions, logProb, blobs).
 * @throws CandelaError `run.bad_checkpoint` when the record is missing, of another shape, or shorter than `steps`.
 * @example visitChainRecord('out/run', shape, 1200, (step, k, positions) => { ... })
 */
export function visitChainRecord(
  runDir: string, shape: ChainRecordShape, steps: number,
  visit: (step: number, ensemble: number, positions: Float64Array, logProb: Float64Array, blobs: Float64Array) => void,
): void {
  const recordPath = join(runDir, RUN_FILES.chainRecord);
  const { walkers, dimension, blobCount } = shape;
  const stepBytes = stepBytesOf(shape);
  let descriptor: number;
  try {
    descriptor = openSync(recordPath, 'r');
  } catch {
    throw damagedRecord(recordPath, 'the chain record of the run is missing');
  }
  try {
    const header = Buffer.alloc(RECORD_HEADER_BYTES);
    readSync(descriptor, header, 0, RECORD_HEADER_BYTES, 0);
    if (!header.equals(recordHeader(shape))) throw damagedRecord(recordPath, 'the chain record does not match the run (ensembles, walkers, parameters or blobs)');
    if (fstatSync(descriptor).size < RECORD_HEADER_BYTES + steps * stepBytes) throw damagedRecord(recordPath, `the chain record holds fewer than the run's ${steps} steps`);
    const block = new Float64Array(STEPS_PER_BLOCK * (stepBytes / 8));
    const bytes = Buffer.from(block.buffer);
    for (let from = 0; from < steps; from += STEPS_PER_BLOCK) {
      const count = Math.min(STEPS_PER_BLOCK, steps - from);
      readSync(descriptor, bytes, 0, count * stepBytes, RECORD_HEADER_BYTES + from * stepBytes);
      let offset = 0;
      for (let step = from; step < from + count; step++) {
        for (let ensemble = 0; ensemble < shape.ensembles; ensemble++) {
          const positions = block.subarray(offset, offset + walkers * dimension);
          offset += walkers * dimension;
          const logProb = block.subarray(offset, offset + walkers);
          offset += walkers;
          const blobs = block.subarray(offset, offset + walkers * blobCount);
          offset += walkers * blobCount;
          visit(step, ensemble, positions, logProb, blobs);
        }
      }
    }
  } finally {
    closeSync(descriptor);
  }
}
