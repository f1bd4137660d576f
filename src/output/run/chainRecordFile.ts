import { closeSync, existsSync, fstatSync, fsyncSync, ftruncateSync, openSync, readSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError, isCandelaError } from '../../errors.js';
import { writeFailure } from '../writeFileAtomic.js';
import type { SamplerSnapshot } from '../../sampler/index.js';
import type { EnsembleDraws } from './chainsFile.js';
import type { StoredDraws } from './storedDraws.js';
import { RUN_FILES } from './runFolder.js';

/*
 * chain-record.bin holds the stored chain of an ensemble run, step after
 * step, and is only ever appended to (and cut back to a whole step).
 * Layout: 8-byte magic 'CNDLREC1', then four uint32 (ensembles, walkers,
 * dimension, blob count), zero padding to 32 bytes; then one block per step,
 * each holding for every ensemble in turn the walkers' positions (walkers x
 * dimension doubles), log posteriors (walkers doubles) and blobs (walkers x
 * blob count doubles). Doubles are stored bit for bit in the byte order of
 * the machine (little-endian on every platform Node.js runs on in practice).
 * The record may hold more steps than the checkpoint (a run killed between
 * the two writes) or end inside a step (a full disk): only the checkpoint's
 * steps count, and the next append cuts the rest first.
 */
const RECORD_MAGIC = 'CNDLREC1';
/** Bytes of the record's header (magic, shape, padding). */
export const RECORD_HEADER_BYTES = 32;
/** Steps packed into one write or read of the chain record (bounds the buffer, not the file). */
const STEPS_PER_BLOCK = 256;

/** The layout of a chain record: ensembles, walkers, parameters and blobs per walker. */
export interface ChainRecordShape { ensembles: number; walkers: number; dimension: number; blobCount: number }

const stepBytesOf = (shape: ChainRecordShape): number => shape.ensembles * shape.walkers * (shape.dimension + 1 + shape.blobCount) * 8;

/** Bytes of one step of every ensemble in a chain record of this shape. Cost O(1). @throws nothing. @example recordStepBytes({ ensembles: 1, walkers: 2, dimension: 1, blobCount: 2 }) // 64 */
export function recordStepBytes(shape: ChainRecordShape): number {
  return stepBytesOf(shape);
}

/** The record shape of a sampler snapshot. Cost O(1). @throws nothing. @example recordShapeOf(sampler.snapshot()).walkers // 32 */
export function recordShapeOf(snapshot: SamplerSnapshot): ChainRecordShape {
  return { ensembles: snapshot.ensembles.length, walkers: snapshot.options.walkers, dimension: snapshot.options.dimension, blobCount: snapshot.blobCount };
}

function recordHeader(shape: ChainRecordShape): Buffer {
  const header = Buffer.alloc(RECORD_HEADER_BYTES);
  header.write(RECORD_MAGIC, 0, 'latin1');
  [shape.ensembles, shape.walkers, shape.dimension, shape.blobCount].forEach((value, k) => header.writeUInt32LE(value, 8 + 4 * k));
  return header;
}

/** A checkpoint or chain record that cannot be continued: `run.bad_checkpoint` naming the file. */
export function damagedRecord(path: string, message: string): CandelaError {
  return new CandelaError({ code: 'run.bad_checkpoint', file: path, message, fix: 'start the run again with --force (the checkpoint cannot be continued)' });
}

function writeAll(descriptor: number, bytes: Buffer, position: number): void {
  let written = 0;
  while (written < bytes.length) written += writeSync(descriptor, bytes, written, bytes.length - written, position + written);
}

/** Copies steps [from, to) of every ensemble's held chain (which starts at snapshot.chainFirstStep) into one buffer, in the record's order. */
function packSteps(snapshot: SamplerSnapshot, shape: ChainRecordShape, from: number, to: number): Buffer {
  const { walkers, dimension, blobCount } = shape;
  const first = snapshot.chainFirstStep ?? 0;
  const block = new Float64Array((to - from) * (stepBytesOf(shape) / 8));
  let offset = 0;
  for (let step = from; step < to; step++) {
    const held = step - first;
    for (const ensemble of snapshot.ensembles) {
      block.set(ensemble.chainPositions.subarray(held * walkers * dimension, (held + 1) * walkers * dimension), offset);
      offset += walkers * dimension;
      block.set(ensemble.chainLogProb.subarray(held * walkers, (held + 1) * walkers), offset);
      offset += walkers;
      block.set(ensemble.chainBlobs.subarray(held * walkers * blobCount, (held + 1) * walkers * blobCount), offset);
      offset += walkers * blobCount;
    }
  }
  return Buffer.from(block.buffer, block.byteOffset, block.byteLength);
}

/**
 * Brings the chain record of `runDir` to exactly the snapshot's steps: a
 * step past them (from a run stopped after an append but before its
 * checkpoint) or a partial step is cut, and the steps the record lacks are
 * appended from the snapshot's held chain; with `sync`, the file is then
 * flushed to disk. The sampler may then release the steps (they are on disk).
 * Cost: O(steps appended x walkers x ensembles x (dimension + blobs)) bytes written.
 * @param runDir the run folder.
 * @param snapshot the sampler's snapshot (its held chain is read, not copied whole).
 * @param options `sync`: fsync before returning (a checkpoint needs it; appends between checkpoints do not).
 * @throws CandelaError `output.write_failed` naming the file and the cause (full disk, read-only); `run.bad_checkpoint`
 *   when the record belongs to another sampler shape or lacks steps the snapshot no longer holds.
 * @example appendChainRecord('out/run', sampler.snapshot(), { sync: false }); sampler.releaseStoredSteps(sampler.stepCount)
 */
export function appendChainRecord(runDir: string, snapshot: SamplerSnapshot, options: { sync: boolean }): void {
  const recordPath = join(runDir, RUN_FILES.chainRecord);
  const shape = recordShapeOf(snapshot);
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
    if (start < (snapshot.chainFirstStep ?? 0)) throw damagedRecord(recordPath, `the chain record holds ${held} steps, fewer than the ${snapshot.chainFirstStep} the sampler has already saved`);
    ftruncateSync(target, RECORD_HEADER_BYTES + start * stepBytes);
    for (let from = start; from < snapshot.stepCount; from += STEPS_PER_BLOCK) {
      const to = Math.min(snapshot.stepCount, from + STEPS_PER_BLOCK);
      writeAll(target, packSteps(snapshot, shape, from, to), RECORD_HEADER_BYTES + from * stepBytes);
    }
    if (options.sync) fsyncSync(target);
  } catch (error) {
    if (isCandelaError(error)) throw error;
    throw writeFailure(recordPath, error);
  } finally {
    if (descriptor !== undefined) closeSync(descriptor);
  }
}

/**
 * Checks that an open chain record was written for `shape`.
 * Cost: one 32-byte read.
 * @param path the record (for the message).
 * @param descriptor the open file.
 * @param shape the layout the record must have.
 * @throws CandelaError `run.bad_checkpoint` when the header differs.
 * @example checkChainRecordHeader(path, descriptor, shape) // no throw for the run's own record
 */
export function checkChainRecordHeader(path: string, descriptor: number, shape: ChainRecordShape): void {
  const header = Buffer.alloc(RECORD_HEADER_BYTES);
  readSync(descriptor, header, 0, RECORD_HEADER_BYTES, 0);
  if (!header.equals(recordHeader(shape))) throw damagedRecord(path, 'the chain record does not match the run (ensembles, walkers, parameters or blobs)');
}

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
    checkChainRecordHeader(recordPath, descriptor, shape);
    if (fstatSync(descriptor).size < RECORD_HEADER_BYTES + steps * stepBytes) throw damagedRecord(recordPath, `the chain record holds fewer than the run's ${steps} steps`);
    const block = new Float64Array(Math.min(STEPS_PER_BLOCK, Math.max(1, steps)) * (stepBytes / 8));
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

/**
 * The first `steps` steps of the chain record, per ensemble, in memory: what
 * the fit writes chains.csv, run.json's best fit and the Hubble files from.
 * Cost: O(steps x walkers x ensembles x (dimension + blobs)) time and memory.
 * @param runDir the run folder.
 * @param shape the layout the record must have.
 * @param steps steps to read.
 * @returns one EnsembleDraws per ensemble.
 * @throws CandelaError `run.bad_checkpoint` (see visitChainRecord).
 * @example readChainRecordDraws('out/run', shape, 1200)[0].steps // 1200
 */
export function readChainRecordDraws(runDir: string, shape: ChainRecordShape, steps: number): EnsembleDraws[] {
  const { walkers, dimension, blobCount } = shape;
  const draws: EnsembleDraws[] = Array.from({ length: shape.ensembles }, () => ({
    steps, walkers, dimension, blobCount,
    positions: new Float64Array(steps * walkers * dimension), logProb: new Float64Array(steps * walkers), blobs: new Float64Array(steps * walkers * blobCount),
  }));
  visitChainRecord(runDir, shape, steps, (step, ensemble, positions, logProb, blobs) => {
    draws[ensemble].positions.set(positions, step * walkers * dimension);
    draws[ensemble].logProb.set(logProb, step * walkers);
    draws[ensemble].blobs.set(blobs, step * walkers * blobCount);
  });
  return draws;
}

/**
 * Writes a new chain record in `runDir` from stored draws (for `candela
 * merge`, from the parts' records), a block of steps at a time, and flushes
 * it; an existing record is replaced. The result reads back as the source.
 * Cost: O(source size) bytes read and written; memory one block of every ensemble.
 * @param runDir the run folder.
 * @param source the draws to store.
 * @throws CandelaError `output.write_failed` naming the file and the cause (full disk, read-only); what the source throws.
 * @example writeChainRecordFrom('out/merged', ensemblesSideBySide(parts, 800))
 */
export function writeChainRecordFrom(runDir: string, source: StoredDraws): void {
  const recordPath = join(runDir, RUN_FILES.chainRecord);
  const shape = { ensembles: source.ensembles, walkers: source.walkers, dimension: source.dimension, blobCount: source.blobCount };
  const { walkers, dimension, blobCount } = shape;
  const perEnsemble = walkers * (dimension + 1 + blobCount);
  let descriptor: number | undefined;
  try {
    const target = openSync(recordPath, 'w');
    descriptor = target;
    writeAll(target, recordHeader(shape), 0);
    for (let from = 0; from < source.steps; from += STEPS_PER_BLOCK) {
      const to = Math.min(source.steps, from + STEPS_PER_BLOCK);
      const packed = new Float64Array((to - from) * source.ensembles * perEnsemble);
      for (let ensemble = 0; ensemble < source.ensembles; ensemble++) {
        const block = source.block(ensemble, from, to);
        for (let s = 0; s < to - from; s++) {
          let offset = (s * source.ensembles + ensemble) * perEnsemble;
          packed.set(block.positions.subarray(s * walkers * dimension, (s + 1) * walkers * dimension), offset);
          offset += walkers * dimension;
          packed.set(block.logProb.subarray(s * walkers, (s + 1) * walkers), offset);
          offset += walkers;
          packed.set(block.blobs.subarray(s * walkers * blobCount, (s + 1) * walkers * blobCount), offset);
        }
      }
      writeAll(target, Buffer.from(packed.buffer), RECORD_HEADER_BYTES + from * stepBytesOf(shape));
    }
    fsyncSync(target);
  } catch (error) {
    if (isCandelaError(error)) throw error;
    throw writeFailure(recordPath, error);
  } finally {
    if (descriptor !== undefined) closeSync(descriptor);
  }
}
