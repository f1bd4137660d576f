import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeFileAtomic } from '../writeFileAtomic.js';
import type { EnsembleSnapshot, SamplerSnapshot } from '../../sampler/index.js';
import { decodeBinaryState, encodeBinaryState } from './binaryState.js';
import { appendChainRecord, damagedRecord, recordShapeOf, visitChainRecord } from './chainRecordFile.js';
import { RUN_FILES } from './runFolder.js';

/*
 * A checkpoint is two files. checkpoint.bin (binaryState format, rewritten
 * atomically) holds the sampler state only: options, step count, and per
 * ensemble the random-stream state, current walkers, log posteriors, blobs
 * and acceptance counts, plus the run's wall time and evaluation count; a
 * few kilobytes. chain-record.bin (chainRecordFile.ts) holds the stored
 * chain, step after step, and is only ever appended to, so a checkpoint
 * writes the steps since the previous append instead of the whole chain.
 */

/** What a checkpoint stores besides the sampler state. */
export interface CheckpointFacts {
  /** Wall time of the run so far, s. */
  wallSeconds: number;
  /** Model evaluations of the run so far. */
  evaluations: number;
}

/**
 * Writes a checkpoint of `snapshot` into `runDir`: first the chain record
 * (appendChainRecord: the steps it lacks appended, anything past the
 * snapshot's steps cut, flushed to disk), then checkpoint.bin atomically, so
 * the checkpoint never counts a step the record does not hold.
 * Cost: O(steps not yet in the record x walkers x ensembles x (dimension + blobs)) bytes written.
 * @param runDir the run folder.
 * @param snapshot the sampler's snapshot (its held chain is read, not copied whole).
 * @param facts wall time (s) and evaluations so far.
 * @throws CandelaError `output.write_failed` naming the file and the cause (full disk, read-only); `run.bad_checkpoint`
 *   when the folder's chain record belongs to another sampler shape or lacks released steps.
 * @example writeCheckpoint('out/run', sampler.snapshot(), { wallSeconds: 12.5, evaluations: 64000 })
 */
export function writeCheckpoint(runDir: string, snapshot: SamplerSnapshot, facts: CheckpointFacts): void {
  appendChainRecord(runDir, snapshot, { sync: true });
  const live = snapshot.ensembles.map(({ chainPositions: _p, chainLogProb: _l, chainBlobs: _b, ...state }) => state);
  const state = { ...snapshot, chainFirstStep: snapshot.stepCount, ensembles: live };
  writeFileAtomic(join(runDir, RUN_FILES.checkpoint), encodeBinaryState({ snapshot: state, chainRecordSteps: snapshot.stepCount, ...facts }));
}

type StoredState = { snapshot: Omit<SamplerSnapshot, 'ensembles'> & { ensembles: Array<Partial<EnsembleSnapshot>> }; chainRecordSteps?: number } & CheckpointFacts;

function readStoredState(runDir: string): StoredState {
  const checkpointPath = join(runDir, RUN_FILES.checkpoint);
  try {
    return decodeBinaryState<StoredState>(readFileSync(checkpointPath));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw error;
    throw damagedRecord(checkpointPath, `the checkpoint is damaged: ${(error as Error).message}`);
  }
}

/**
 * Reads the checkpoint of `runDir` back into a whole snapshot: the sampler
 * state from checkpoint.bin and every step from chain-record.bin (steps past
 * the checkpoint's are ignored), chainFirstStep 0. A checkpoint that holds
 * its chains itself (written before the chain record existed) is read as it is.
 * Cost: O(stored chain) time and memory (for `candela merge`; a resumed fit
 * uses readCheckpointState, which holds no chain).
 * @param runDir the run folder.
 * @returns the snapshot, wall time (s) and evaluations.
 * @throws CandelaError `run.bad_checkpoint` when either file is unreadable, damaged, or the record is shorter than
 *   the checkpoint; Error from the file system when checkpoint.bin is missing.
 * @example readCheckpoint('out/run').snapshot.stepCount // 1200
 */
export function readCheckpoint(runDir: string): { snapshot: SamplerSnapshot } & CheckpointFacts {
  const saved = readStoredState(runDir);
  const { wallSeconds, evaluations } = saved;
  if (saved.chainRecordSteps === undefined) return { snapshot: saved.snapshot as SamplerSnapshot, wallSeconds, evaluations };
  const steps = saved.snapshot.stepCount;
  const { walkers, dimension } = saved.snapshot.options;
  const blobCount = saved.snapshot.blobCount;
  const chains = saved.snapshot.ensembles.map(() => ({
    chainPositions: new Float64Array(steps * walkers * dimension), chainLogProb: new Float64Array(steps * walkers), chainBlobs: new Float64Array(steps * walkers * blobCount),
  }));
  visitChainRecord(runDir, { ensembles: saved.snapshot.ensembles.length, walkers, dimension, blobCount }, steps, (step, ensemble, positions, logProb, blobs) => {
    chains[ensemble].chainPositions.set(positions, step * walkers * dimension);
    chains[ensemble].chainLogProb.set(logProb, step * walkers);
    chains[ensemble].chainBlobs.set(blobs, step * walkers * blobCount);
  });
  const ensembles = saved.snapshot.ensembles.map((live, k) => ({ ...live, ...chains[k] }) as EnsembleSnapshot);
  return { snapshot: { ...saved.snapshot, chainFirstStep: 0, ensembles } as SamplerSnapshot, wallSeconds, evaluations };
}

/**
 * Reads the checkpoint of `runDir` for a resumed fit without loading its
 * chain: the snapshot holds no stored step (chainFirstStep = stepCount) and
 * `earlierSteps` replays the record's steps, streaming, for
 * EnsembleSampler.restore to rebuild its diagnostic traces. A checkpoint
 * that holds its chains itself is returned whole (no replay needed).
 * Cost: O(ensembles x walkers x dimension) memory; the replay streams the record (one block at a time).
 * @param runDir the run folder.
 * @returns the snapshot, wall time (s), evaluations and the replay of the earlier steps.
 * @throws CandelaError `run.bad_checkpoint` when checkpoint.bin is damaged (and, from the replay, when the record is
 *   missing, of another shape or shorter than the checkpoint); Error from the file system when checkpoint.bin is missing.
 * @example const saved = readCheckpointState(dir); await EnsembleSampler.restore(saved.snapshot, evaluator, { earlierSteps: saved.earlierSteps })
 */
export function readCheckpointState(runDir: string): { snapshot: SamplerSnapshot; earlierSteps?: (visit: (step: number, ensemble: number, positions: Float64Array) => void) => void } & CheckpointFacts {
  const saved = readStoredState(runDir);
  const { wallSeconds, evaluations } = saved;
  if (saved.chainRecordSteps === undefined) return { snapshot: saved.snapshot as SamplerSnapshot, wallSeconds, evaluations };
  const steps = saved.snapshot.stepCount;
  const empty = new Float64Array(0);
  const ensembles = saved.snapshot.ensembles.map((live) => ({ ...live, chainPositions: empty, chainLogProb: empty, chainBlobs: empty }) as EnsembleSnapshot);
  const snapshot = { ...saved.snapshot, chainFirstStep: steps, ensembles } as SamplerSnapshot;
  const shape = recordShapeOf(snapshot);
  return {
    snapshot, wallSeconds, evaluations,
    earlierSteps: (visit) => visitChainRecord(runDir, shape, steps, (step, ensemble, positions) => visit(step, ensemble, positions)),
  };
}
