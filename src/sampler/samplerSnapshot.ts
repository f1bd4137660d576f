import { CandelaError } from '../errors.js';
import type { Issue } from '../errors.js';
import type { RandomState } from '../math/index.js';
import type { ResolvedEnsembleOptions } from './ensembleOptions.js';

/** Format tag written into every snapshot. */
export const SNAPSHOT_FORMAT = 'candela.ensemble-sampler';
/** Snapshot layout version; bumped when fields change meaning. */
export const SNAPSHOT_VERSION = 1;

/** The saved state of one ensemble. Arrays are step major like {@link ChainView}. */
export interface EnsembleSnapshot<A extends ArrayLike<number> = Float64Array> {
  /** State of the ensemble's random stream after the last step. */
  randomState: RandomState;
  /** Current walkers, walkers x dimension. */
  positions: A;
  /** Current log posterior per walker. */
  logProb: A;
  /** Current blobs, walkers x blobCount. */
  blobs: A;
  /** Accepted proposals per walker since the start. */
  acceptedCounts: A;
  /** Stored chain held in memory (steps chainFirstStep .. stepCount - 1), held steps x walkers x dimension. */
  chainPositions: A;
  /** Stored log posterior held in memory, held steps x walkers. */
  chainLogProb: A;
  /** Stored blobs held in memory, held steps x walkers x blobCount. */
  chainBlobs: A;
}

/**
 * Everything needed to continue a run exactly: resolved options, step count,
 * and per ensemble its random-stream state, current walkers and the stored
 * steps still held in memory, chainFirstStep .. stepCount - 1 (all of them
 * unless the caller released steps it had saved, see
 * EnsembleSampler.releaseStoredSteps; the steps before chainFirstStep are
 * then given back to EnsembleSampler.restore by the caller).
 * Typed arrays may be written as plain number arrays (JSON); every stored
 * number is finite, so JSON round trips are exact.
 */
export interface SamplerSnapshot<A extends ArrayLike<number> = Float64Array> {
  format: typeof SNAPSHOT_FORMAT;
  version: typeof SNAPSHOT_VERSION;
  options: ResolvedEnsembleOptions;
  blobCount: number;
  stepCount: number;
  /** Index of the first stored step the chain arrays hold (absent: 0, every step). */
  chainFirstStep?: number;
  ensembles: Array<EnsembleSnapshot<A>>;
}

/**
 * Checks that a snapshot (for example parsed from a checkpoint file) has the
 * right format and array lengths for `options` and `blobCount`.
 * Cost: O(ensembles). Throws a CandelaError `sampler.snapshot_invalid`
 * listing every problem, with paths like `ensembles[2].chainLogProb`.
 * @example checkSnapshotShape(sampler.snapshot(), evaluator.blobCount) // no throw
 */
export function checkSnapshotShape(snapshot: SamplerSnapshot<ArrayLike<number>>, blobCount: number): void {
  const issues: Issue[] = [];
  const problem = (path: string, expected: string, found: unknown): void => {
    issues.push({ code: 'sampler.snapshot_invalid', path, message: 'the sampler snapshot does not fit this run', expected, found: String(found) });
  };
  if (snapshot.format !== SNAPSHOT_FORMAT) problem('format', SNAPSHOT_FORMAT, snapshot.format);
  if (snapshot.version !== SNAPSHOT_VERSION) problem('version', String(SNAPSHOT_VERSION), snapshot.version);
  if (snapshot.blobCount !== blobCount) problem('blobCount', `${blobCount} (the model's blob count)`, snapshot.blobCount);
  const steps = snapshot.stepCount;
  if (!Number.isInteger(steps) || steps < 0) problem('stepCount', 'an integer >= 0', steps);
  const first = snapshot.chainFirstStep ?? 0;
  if (!Number.isInteger(first) || first < 0 || first > steps) problem('chainFirstStep', `an integer from 0 to the step count ${steps}`, first);
  const held = steps - first;
  const { walkers, dimension, ensembles } = snapshot.options;
  if (!Array.isArray(snapshot.ensembles) || snapshot.ensembles.length !== ensembles) {
    problem('ensembles', `${ensembles} ensembles`, snapshot.ensembles?.length);
  }
  if (issues.length > 0) throw new CandelaError(issues);
  snapshot.ensembles.forEach((ensemble, index) => {
    const expectLength = (field: keyof EnsembleSnapshot, length: number): void => {
      const found = (ensemble[field] as ArrayLike<number> | undefined)?.length;
      if (found !== length) problem(`ensembles[${index}].${field}`, `${length} numbers`, found);
    };
    const state = ensemble.randomState;
    if (!state || ![state.c, state.s0, state.s1, state.s2].every((v) => typeof v === 'number')) {
      problem(`ensembles[${index}].randomState`, 'a random-stream state {c, s0, s1, s2}', JSON.stringify(state));
    }
    expectLength('positions', walkers * dimension);
    expectLength('logProb', walkers);
    expectLength('blobs', walkers * blobCount);
    expectLength('acceptedCounts', walkers);
    expectLength('chainPositions', held * walkers * dimension);
    expectLength('chainLogProb', held * walkers);
    expectLength('chainBlobs', held * walkers * blobCount);
  });
  if (issues.length > 0) throw new CandelaError(issues);
}
