import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { join } from 'node:path';
import type { EnsembleDraws } from './chainsFile.js';
import { checkChainRecordHeader, damagedRecord, RECORD_HEADER_BYTES, recordStepBytes, type ChainRecordShape } from './chainRecordFile.js';
import { RUN_FILES } from './runFolder.js';

/** Steps read from the chain record in one block (bounds the buffer, not the run). */
export const STORED_DRAWS_BLOCK_STEPS = 256;

/**
 * The stored steps of an ensemble run, read a block at a time: what the end
 * of a fit, `merge` and `unblind` write chains.csv, the best fit and the
 * Hubble files from, so that no step count makes them hold the whole chain.
 * Steps are 0-based; a block is one ensemble's steps [from, to).
 */
export interface StoredDraws {
  ensembles: number;
  steps: number;
  walkers: number;
  dimension: number;
  blobCount: number;
  /**
   * Steps [from, to) of one ensemble, laid out as EnsembleDraws (its `steps`
   * is to - from). The arrays may be views that the next call overwrites:
   * copy what must outlive it.
   */
  block(ensemble: number, from: number, to: number): EnsembleDraws;
}

/**
 * Stored draws held in memory (nested sampling, tests): blocks are views of the arrays.
 * Cost: O(1) per block.
 * @param ensembles one EnsembleDraws per ensemble, all of one shape.
 * @returns the source.
 * @throws nothing.
 * @example drawsInMemory([draws]).block(0, 10, 20).steps // 10
 */
export function drawsInMemory(ensembles: readonly EnsembleDraws[]): StoredDraws {
  const first = ensembles[0];
  return {
    ensembles: ensembles.length, steps: first?.steps ?? 0, walkers: first?.walkers ?? 0, dimension: first?.dimension ?? 0, blobCount: first?.blobCount ?? 0,
    block(ensemble, from, to) {
      const draws = ensembles[ensemble];
      const { walkers, dimension, blobCount } = draws;
      return {
        steps: to - from, walkers, dimension, blobCount,
        positions: draws.positions.subarray(from * walkers * dimension, to * walkers * dimension),
        logProb: draws.logProb.subarray(from * walkers, to * walkers),
        blobs: draws.blobs.subarray(from * walkers * blobCount, to * walkers * blobCount),
      };
    },
  };
}

/**
 * Stored draws as a source: a source as it is, one EnsembleDraws per ensemble in memory (drawsInMemory).
 * Cost: O(1). @throws nothing.
 * @example asStoredDraws([draws]).ensembles // 1
 */
export function asStoredDraws(draws: StoredDraws | readonly EnsembleDraws[]): StoredDraws {
  return 'block' in draws ? draws : drawsInMemory(draws);
}

/**
 * The first `steps` steps of the chain record of `runDir` (chain-record.bin,
 * see chainRecordFile.ts) as stored draws, read from disk block by block:
 * memory is one block of every ensemble (at most STORED_DRAWS_BLOCK_STEPS
 * steps), whatever the run's length. The file is opened per block, so the
 * source holds no descriptor.
 * Cost: each block reads its steps of every ensemble (the record interleaves
 * ensembles step by step), so reading all of E ensembles reads the file E times.
 * @param runDir the run folder.
 * @param shape the layout the record must have.
 * @param steps steps of the run (the record may hold more, which are ignored).
 * @returns the source.
 * @throws CandelaError `run.bad_checkpoint` when the record is missing, of another shape or shorter than `steps`.
 * @example drawsFromChainRecord('out/run', shape, 1200).block(0, 0, 256).logProb.length // 256 x walkers
 */
export function drawsFromChainRecord(runDir: string, shape: ChainRecordShape, steps: number): StoredDraws {
  const path = join(runDir, RUN_FILES.chainRecord);
  const { ensembles, walkers, dimension, blobCount } = shape;
  const stepBytes = recordStepBytes(shape);
  const open = (): number => {
    let descriptor: number;
    try {
      descriptor = openSync(path, 'r');
    } catch {
      throw damagedRecord(path, 'the chain record of the run is missing');
    }
    return descriptor;
  };
  const descriptor = open();
  try {
    checkChainRecordHeader(path, descriptor, shape);
    if (fstatSync(descriptor).size < RECORD_HEADER_BYTES + steps * stepBytes) throw damagedRecord(path, `the chain record holds fewer than the run's ${steps} steps`);
  } finally {
    closeSync(descriptor);
  }
  const perEnsemble = walkers * (dimension + 1 + blobCount);
  let buffer = new Float64Array(0);
  let out: EnsembleDraws | null = null;
  return {
    ensembles, steps, walkers, dimension, blobCount,
    block(ensemble, from, to) {
      const count = to - from;
      if (buffer.length < count * ensembles * perEnsemble) buffer = new Float64Array(Math.max(count, 1) * ensembles * perEnsemble);
      if (!out || out.positions.length < count * walkers * dimension) {
        out = { steps: count, walkers, dimension, blobCount, positions: new Float64Array(count * walkers * dimension), logProb: new Float64Array(count * walkers), blobs: new Float64Array(count * walkers * blobCount) };
      }
      const bytes = Buffer.from(buffer.buffer, 0, count * stepBytes);
      const file = open();
      try {
        let read = 0;
        while (read < bytes.length) {
          const got = readSync(file, bytes, read, bytes.length - read, RECORD_HEADER_BYTES + from * stepBytes + read);
          if (got === 0) throw damagedRecord(path, `the chain record ends before step ${to}`);
          read += got;
        }
      } finally {
        closeSync(file);
      }
      const positions = out.positions.subarray(0, count * walkers * dimension);
      const logProb = out.logProb.subarray(0, count * walkers);
      const blobs = out.blobs.subarray(0, count * walkers * blobCount);
      for (let s = 0; s < count; s++) {
        let offset = (s * ensembles + ensemble) * perEnsemble;
        positions.set(buffer.subarray(offset, offset + walkers * dimension), s * walkers * dimension);
        offset += walkers * dimension;
        logProb.set(buffer.subarray(offset, offset + walkers), s * walkers);
        offset += walkers;
        blobs.set(buffer.subarray(offset, offset + walkers * blobCount), s * walkers * blobCount);
      }
      return { steps: count, walkers, dimension, blobCount, positions, logProb, blobs };
    },
  };
}

/**
 * Stored draws with fixed offsets added to the sampled parameters (a blinded
 * run's shown chains, docs/blinding.md): each block is a shifted copy.
 * Cost: O(block size) per block.
 * @param source the true draws.
 * @param shifts offset per sampled parameter, in theta order (0 for unblinded ones).
 * @returns the shifted source.
 * @throws nothing.
 * @example shiftedDraws(source, [0, 0.2]).block(0, 0, 1).positions[1] // source's + 0.2
 */
export function shiftedDraws(source: StoredDraws, shifts: readonly number[]): StoredDraws {
  return {
    ...source,
    block(ensemble, from, to) {
      const draws = source.block(ensemble, from, to);
      const positions = Float64Array.from(draws.positions);
      for (let i = 0; i < positions.length; i++) positions[i] += shifts[i % draws.dimension];
      return { ...draws, positions };
    },
  };
}

/**
 * Visits every stored step of every ensemble in chains.csv order (ensemble,
 * then step), a block at a time.
 * Cost: reads the source once.
 * @param source the stored draws.
 * @param visit receives (ensemble, first step of the block, the block).
 * @param fromStep first step visited (default 0).
 * @throws what the source throws.
 * @example forEachStoredBlock(source, (k, first, block) => { ... })
 */
export function forEachStoredBlock(source: StoredDraws, visit: (ensemble: number, firstStep: number, block: EnsembleDraws) => void, fromStep = 0): void {
  for (let ensemble = 0; ensemble < source.ensembles; ensemble++) {
    for (let from = fromStep; from < source.steps; from += STORED_DRAWS_BLOCK_STEPS) {
      const to = Math.min(source.steps, from + STORED_DRAWS_BLOCK_STEPS);
      visit(ensemble, from, source.block(ensemble, from, to));
    }
  }
}

/** The stored draw of highest log posterior: its parameters, log posterior and log likelihood (blob 1). */
export interface BestStoredDraw {
  theta: Float64Array;
  logProb: number;
  logLikelihood: number;
  ensemble: number;
  /** Its step. */
  step: number;
  walker: number;
}

/**
 * The stored draw with the highest log posterior from step `fromStep` on
 * (the first of equal values, in ensemble, step, walker order), streaming
 * the source a block at a time.
 * Cost: reads the source once; memory one block.
 * @param source the stored draws.
 * @param fromStep first step searched (the burn-in is skipped).
 * @returns the best draw; theta of zeros and -Infinity when no finite draw exists.
 * @throws what the source throws.
 * @example bestStoredDraw(drawsInMemory([draws]), 100).logProb
 */
export function bestStoredDraw(source: StoredDraws, fromStep: number): BestStoredDraw {
  let best: BestStoredDraw = { theta: new Float64Array(source.dimension), logProb: -Infinity, logLikelihood: Number.NaN, ensemble: 0, step: fromStep, walker: 0 };
  forEachStoredBlock(source, (ensemble, firstStep, block) => {
    const { walkers, dimension, blobCount } = block;
    for (let row = 0; row < block.steps * walkers; row++) {
      if (block.logProb[row] > best.logProb) {
        best = {
          theta: block.positions.slice(row * dimension, (row + 1) * dimension), logProb: block.logProb[row], logLikelihood: block.blobs[row * blobCount + 1],
          ensemble, step: firstStep + Math.floor(row / walkers), walker: row % walkers,
        };
      }
    }
  }, fromStep);
  return best;
}

/**
 * Accepted moves per walker over the first `steps` steps: the steps whose
 * log posterior differs from the walker's previous one (a stretch move that
 * is refused leaves the walker, and so its log posterior, unchanged; common
 * practice), streaming the source.
 * Cost: reads the log posteriors once; memory one block plus ensembles x walkers.
 * @param source the stored draws.
 * @param steps steps counted (at most source.steps).
 * @returns counts, ensemble-major (ensemble k, walker w at k x walkers + w).
 * @throws what the source throws.
 * @example acceptedMoveCounts(source, source.steps)[0] / (source.steps - 1) // walker 0's acceptance fraction
 */
export function acceptedMoveCounts(source: StoredDraws, steps: number): Float64Array {
  const { walkers } = source;
  const counts = new Float64Array(source.ensembles * walkers);
  const previous = new Float64Array(walkers);
  for (let ensemble = 0; ensemble < source.ensembles; ensemble++) {
    for (let from = 0; from < steps; from += STORED_DRAWS_BLOCK_STEPS) {
      const block = source.block(ensemble, from, Math.min(steps, from + STORED_DRAWS_BLOCK_STEPS));
      for (let s = 0; s < block.steps; s++) {
        for (let w = 0; w < walkers; w++) {
          const value = block.logProb[s * walkers + w];
          if (from + s > 0 && value !== previous[w]) counts[ensemble * walkers + w] += 1;
          previous[w] = value;
        }
      }
    }
  }
  return counts;
}

/**
 * Stored draws of several single-ensemble runs (cluster parts) seen as the
 * ensembles of one run, cut to `steps`: ensemble k is sources[k]'s ensemble 0.
 * Cost: O(1); blocks are read from the sources.
 * @param sources one source per ensemble, all of one walker count, dimension and blob count.
 * @param steps steps of the combined run (at most the shortest source's).
 * @returns the combined source.
 * @throws nothing.
 * @example ensemblesSideBySide([part0, part1], 800).ensembles // 2
 */
export function ensemblesSideBySide(sources: readonly StoredDraws[], steps: number): StoredDraws {
  const first = sources[0];
  return {
    ensembles: sources.length, steps, walkers: first.walkers, dimension: first.dimension, blobCount: first.blobCount,
    block: (ensemble, from, to) => sources[ensemble].block(0, from, to),
  };
}

/**
 * Draws after the burn-in counted one by one, ensemble after ensemble, then
 * step, then walker (the order chains.csv lists them): how many there are,
 * and the parameters of the pick-th, read from the source one step at a
 * time (for seeded random picks that must not load the chain).
 * Cost: O(1) for the count; one single-step block read per draw.
 * @param source the stored draws.
 * @param fromStep first step after the burn-in.
 * @returns `count`, and `at(pick)` giving a copy of draw pick's parameters (0 <= pick < count).
 * @throws what the source throws.
 * @example const draws = drawsAfterBurnIn(source, 500); draws.at(draws.count - 1) // the last walker of the last step of the last ensemble
 */
export function drawsAfterBurnIn(source: StoredDraws, fromStep: number): { count: number; at: (pick: number) => Float64Array } {
  const perEnsemble = Math.max(0, source.steps - fromStep) * source.walkers;
  return {
    count: source.ensembles * perEnsemble,
    at(pick) {
      const ensemble = Math.floor(pick / perEnsemble);
      const row = pick % perEnsemble;
      const step = fromStep + Math.floor(row / source.walkers);
      const walker = row % source.walkers;
      return source.block(ensemble, step, step + 1).positions.slice(walker * source.dimension, (walker + 1) * source.dimension);
    },
  };
}
