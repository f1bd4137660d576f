import { CandelaError } from '../errors.js';
import { createRandomStream, deriveSeed } from '../math/index.js';
import { ChainStorage } from './chainStorage.js';
import type { ChainView } from './chainStorage.js';
import { resolveEnsembleOptions } from './ensembleOptions.js';
import type { EnsembleRunOptions, ResolvedEnsembleOptions } from './ensembleOptions.js';
import { acceptHalf, halfSize, proposeHalf } from './ensembleStep.js';
import type { EnsembleState, HalfStepBatch } from './ensembleStep.js';
import { evaluateInitialWalkers } from './evaluateInitialWalkers.js';
import type { BatchEvaluator } from './logProbabilityModel.js';
import { checkSnapshotShape, SNAPSHOT_FORMAT, SNAPSHOT_VERSION } from './samplerSnapshot.js';
import type { SamplerSnapshot } from './samplerSnapshot.js';
import { ThinnedTrace, traceCapacitySteps } from './thinnedTrace.js';
import type { TraceView } from './thinnedTrace.js';
import type { RandomState } from '../math/index.js';

/** One ensemble's live state copied at the start of a step. */
interface StepStartCopy {
  randomState: RandomState;
  positions: Float64Array;
  logProb: Float64Array;
  blobs: Float64Array;
  acceptedCounts: Float64Array;
}

/** How the sampler keeps its steps in memory (see ThinnedTrace and EnsembleSampler.releaseStoredSteps). */
export interface SamplerStorageOptions {
  /** Steps each ensemble's diagnostic trace keeps before it halves (an even integer >= 2; default traceCapacitySteps of the sampler's shape). */
  traceCapacitySteps?: number;
}

/** What EnsembleSampler.restore needs besides a snapshot whose chain arrays start after step 0. */
export interface RestoreStorageOptions extends SamplerStorageOptions {
  /**
   * Replays the stored steps the snapshot no longer holds (0 .. chainFirstStep - 1),
   * in step order, calling `visit(step, ensemble, positions)` for every step
   * and ensemble with that ensemble's walkers (walkers x dimension), for
   * example from a chain record on disk. Only the positions are used (they
   * rebuild the diagnostic traces); nothing is kept.
   */
  earlierSteps?: (visit: (step: number, ensemble: number, positions: Float64Array) => void) => void;
}

/** A snapshot's steps do not cover the run: `sampler.snapshot_invalid` at `chainFirstStep`. */
function missingEarlierSteps(expected: string, found: string): CandelaError {
  return new CandelaError({ code: 'sampler.snapshot_invalid', path: 'chainFirstStep', message: 'the steps before the snapshot\'s chain arrays were not given back in order', expected, found, fix: 'pass earlierSteps replaying every stored step before chainFirstStep' });
}

/*
 * Affine-invariant ensemble sampler (Goodman & Weare 2010) with the parallel
 * two-halves update (Foreman-Mackey et al. 2013) and an optional
 * differential-evolution move (ter Braak 2006). Several independent
 * ensembles run in lockstep: the proposals of the same half of EVERY
 * ensemble go to the evaluator in ONE batch, so that parallel workers stay
 * busy even for small ensembles. The random-stream design that makes runs
 * reproducible for any worker count is documented in ensembleStep.ts.
 */

/**
 * Runs several independent affine-invariant ensembles in lockstep and stores
 * their chains. Create with {@link EnsembleSampler.start} or
 * {@link EnsembleSampler.restore}; call {@link EnsembleSampler.advance}
 * repeatedly (diagnostics and checkpoints go between calls).
 *
 * Cost per step: walkers x ensembles model evaluations in two batches, plus
 * O(walkers x ensembles x dimension) arithmetic; no allocation except chain
 * growth, which is done before each `advance`.
 * @example
 * const sampler = await EnsembleSampler.start({ dimension: 2, walkers: 8, seed: '7' }, evaluator, starts);
 * await sampler.advance(1000);
 * sampler.chain(0).positions // 1000 x 8 x 2 numbers
 */
export class EnsembleSampler {
  private steps: number;
  private busy = false;
  private readonly batch: HalfStepBatch;
  /** Each ensemble's state at the start of the step in progress, restored when a step fails half done. */
  private readonly stepStart: StepStartCopy[];

  private constructor(readonly options: ResolvedEnsembleOptions, private readonly evaluator: BatchEvaluator, private readonly states: EnsembleState[], stepCount: number) {
    this.steps = stepCount;
    const largestBatch = options.ensembles * halfSize(options.walkers, 1);
    this.batch = {
      points: new Float64Array(largestBatch * options.dimension),
      logProb: new Float64Array(largestBatch),
      blobs: new Float64Array(largestBatch * evaluator.blobCount),
      correction: new Float64Array(largestBatch),
    };
    this.stepStart = states.map((state) => ({
      randomState: state.rng.state(),
      positions: new Float64Array(state.positions.length),
      logProb: new Float64Array(state.logProb.length),
      blobs: new Float64Array(state.blobs.length),
      acceptedCounts: new Float64Array(state.acceptedCounts.length),
    }));
  }

  /** Copies every ensemble's live state (O(walkers x ensembles x (dimension + blobs)), no allocation but the stream state). */
  private markStepStart(): void {
    this.states.forEach((state, k) => {
      const copy = this.stepStart[k];
      copy.randomState = state.rng.state();
      copy.positions.set(state.positions);
      copy.logProb.set(state.logProb);
      copy.blobs.set(state.blobs);
      copy.acceptedCounts.set(state.acceptedCounts);
    });
  }

  /** Puts every ensemble back to where the step in progress began (its stored chain never saw that step). */
  private restoreStepStart(): void {
    this.states.forEach((state, k) => {
      const copy = this.stepStart[k];
      state.rng = createRandomStream('', { ...copy.randomState });
      state.positions.set(copy.positions);
      state.logProb.set(copy.logProb);
      state.blobs.set(copy.blobs);
      state.acceptedCounts.set(copy.acceptedCounts);
    });
  }

  /**
   * Validates the options, evaluates the initial walkers of every ensemble in
   * one batch and returns a sampler at step 0.
   * `initialPositions[k]` holds ensemble k's walkers, walkers x dimension
   * (for example `initializeWalkers(...).positions`). With
   * `options.ensembleIndices`, held ensemble k draws from the stream of
   * ensemble `ensembleIndices[k]` of the full run (give it that ensemble's
   * initial walkers to reproduce its chain exactly).
   * Throws CandelaError: option problems (see resolveEnsembleOptions) and
   * start problems (see evaluateInitialWalkers).
   */
  static async start(options: EnsembleRunOptions, evaluator: BatchEvaluator, initialPositions: Float64Array[], storage: SamplerStorageOptions = {}): Promise<EnsembleSampler> {
    const settings = resolveEnsembleOptions(options, evaluator.dimension);
    const { walkers, dimension } = settings;
    const capacity = storage.traceCapacitySteps ?? traceCapacitySteps(walkers, settings.ensembles, dimension);
    const blobCount = evaluator.blobCount;
    const { logProb, blobs } = await evaluateInitialWalkers(settings, evaluator, initialPositions);
    const states = initialPositions.map((positions, k): EnsembleState => ({
      rng: createRandomStream(deriveSeed(settings.seed, 'ensemble', settings.ensembleIndices?.[k] ?? k)),
      positions: Float64Array.from(positions),
      logProb: logProb.slice(k * walkers, (k + 1) * walkers),
      blobs: blobs.slice(k * walkers * blobCount, (k + 1) * walkers * blobCount),
      acceptedCounts: new Float64Array(walkers),
      chain: new ChainStorage(walkers, dimension, blobCount),
      trace: new ThinnedTrace(walkers, dimension, capacity),
    }));
    return new EnsembleSampler(settings, evaluator, states, 0);
  }

  /**
   * Continues a run from {@link EnsembleSampler.snapshot} output (typed or
   * plain number arrays). Advancing the restored sampler gives exactly the
   * chains of an uninterrupted run, and its traces (hence its diagnostics)
   * are those of the uninterrupted run too. When the snapshot holds only the
   * steps from `chainFirstStep` on, `storage.earlierSteps` must replay the
   * steps before (they rebuild the traces). Does not call the evaluator.
   * Memory: the held steps plus the traces; the replayed steps are not kept.
   * Throws CandelaError: option problems, `sampler.snapshot_invalid` (also
   * when the replay is missing or gives other steps than 0 .. chainFirstStep - 1 in order).
   */
  static async restore(snapshot: SamplerSnapshot<ArrayLike<number>>, evaluator: BatchEvaluator, storage: RestoreStorageOptions = {}): Promise<EnsembleSampler> {
    const settings = resolveEnsembleOptions(snapshot.options, evaluator.dimension);
    checkSnapshotShape(snapshot, evaluator.blobCount);
    const { walkers, dimension } = settings;
    const first = snapshot.chainFirstStep ?? 0;
    const capacity = storage.traceCapacitySteps ?? traceCapacitySteps(walkers, settings.ensembles, dimension);
    const states = snapshot.ensembles.map((saved): EnsembleState => ({
      rng: createRandomStream('', { ...saved.randomState }),
      positions: Float64Array.from(saved.positions),
      logProb: Float64Array.from(saved.logProb),
      blobs: Float64Array.from(saved.blobs),
      acceptedCounts: Float64Array.from(saved.acceptedCounts),
      chain: ChainStorage.fromArrays(walkers, dimension, evaluator.blobCount, snapshot.stepCount - first, saved.chainPositions, saved.chainLogProb, saved.chainBlobs, first),
      trace: new ThinnedTrace(walkers, dimension, capacity),
    }));
    if (first > 0) {
      if (!storage.earlierSteps) throw missingEarlierSteps(`a replay of steps 0 to ${first - 1}`, 'none');
      storage.earlierSteps((step, ensemble, positions) => {
        const trace = states[ensemble]?.trace;
        if (!trace || trace.stepsSeen !== step || step >= first) throw missingEarlierSteps(`step ${trace?.stepsSeen ?? '?'} of ensemble 0 to ${states.length - 1}, below ${first}`, `step ${step} of ensemble ${ensemble}`);
        trace.append(positions);
      });
      const short = states.findIndex((state) => state.trace.stepsSeen !== first);
      if (short >= 0) throw missingEarlierSteps(`${first} steps of ensemble ${short}`, `${states[short].trace.stepsSeen}`);
    }
    const size = walkers * dimension;
    for (const state of states) {
      const held = state.chain.view();
      for (let j = 0; j < held.steps; j++) state.trace.append(held.positions.subarray(j * size, (j + 1) * size));
    }
    return new EnsembleSampler(settings, evaluator, states, snapshot.stepCount);
  }

  /** Steps taken so far by every ensemble. */
  get stepCount(): number {
    return this.steps;
  }

  /**
   * Runs `steps` more steps of every ensemble, calling `onStep(stepCount)`
   * after each; when `onStep` returns false the run stops after that step
   * (e.g. on an interrupt), with everything stored so far consistent.
   * Throws CandelaError `sampler.invalid_option` for a bad step count,
   * `sampler.busy` when called while another advance runs,
   * `sampler.invalid_log_probability` when the model returns NaN or
   * +Infinity; rejects with whatever the evaluator rejects with. When a step
   * fails half done (an evaluator that rejects on an interrupt, a model
   * error), every ensemble is put back to the state at the start of that
   * step, random streams included, so the sampler holds exactly the steps
   * before it and may be snapshot or advanced again as if the failed step had
   * never begun.
   */
  async advance(steps: number, onStep?: (step: number) => boolean | void): Promise<void> {
    if (!Number.isInteger(steps) || steps < 0) throw new CandelaError({ code: 'sampler.invalid_option', path: 'steps', message: 'the number of steps must be a non-negative integer', found: String(steps) });
    if (this.busy) throw new CandelaError({ code: 'sampler.busy', message: 'advance was called while the sampler was still advancing', fix: 'await each advance before the next' });
    this.busy = true;
    try {
      for (const state of this.states) state.chain.reserve(state.chain.steps + steps);
      for (let step = 0; step < steps; step++) {
        this.markStepStart();
        try {
          for (let half = 0; half < 2; half++) {
            const count = proposeHalf(this.states, this.options, half, this.batch);
            await this.evaluator.evaluate(this.batch.points, count, this.batch.logProb, this.batch.blobs);
            acceptHalf(this.states, this.options, half, this.batch, count, this.evaluator.blobCount);
          }
        } catch (error) {
          this.restoreStepStart();
          throw error;
        }
        for (const state of this.states) {
          state.chain.append(state.positions, state.logProb, state.blobs);
          state.trace.append(state.positions);
        }
        this.steps += 1;
        if (onStep?.(this.steps) === false) break;
      }
    } finally {
      this.busy = false;
    }
  }

  /**
   * Views (no copy) of ensemble `ensemble`'s stored chain: every step, or
   * the steps from `firstStep` on once earlier ones were released. Stored
   * steps are never rewritten, so a view stays correct after later advances;
   * it just does not include their steps. Throws RangeError for a bad index.
   */
  chain(ensemble: number): ChainView {
    return this.state(ensemble).chain.view();
  }

  /**
   * View (valid until the next advance) of ensemble `ensemble`'s diagnostic
   * trace: the positions of every `stride`-th stored step, at most the trace
   * capacity of them (see ThinnedTrace). Throws RangeError for a bad index.
   */
  trace(ensemble: number): TraceView {
    return this.state(ensemble).trace.view();
  }

  /**
   * Frees the stored steps before step `upTo` (0-based among all stored
   * steps) in every ensemble, once the caller has saved them (a chain record
   * on disk): memory then holds only the steps since, and a snapshot holds
   * them from `chainFirstStep` = upTo on (restore then needs the earlier
   * steps replayed). The diagnostic traces are untouched. Cost O(steps still held).
   * Throws CandelaError `sampler.busy` while advancing.
   */
  releaseStoredSteps(upTo: number): void {
    if (this.busy) throw new CandelaError({ code: 'sampler.busy', message: 'stored steps were released while the sampler was advancing', fix: 'await each advance before releasing steps' });
    for (const state of this.states) state.chain.release(upTo);
  }

  /** Accepted fraction of proposals per walker of one ensemble (zeros before the first step). */
  acceptanceFractions(ensemble: number): Float64Array {
    const counts = this.state(ensemble).acceptedCounts;
    return counts.map((count) => (this.steps > 0 ? count / this.steps : 0));
  }

  /** Copies of the current walkers (walkers x dimension) of one ensemble. */
  currentPositions(ensemble: number): Float64Array {
    return this.state(ensemble).positions.slice();
  }

  /**
   * The whole state (see {@link SamplerSnapshot}) for a checkpoint: copies of
   * the current walkers, acceptance counts and random-stream states, and
   * views (no copy) of the append-only stored chains held in memory (from
   * `chainFirstStep` on), which later advances never modify.
   * Cost O(walkers x ensembles x dimension).
   */
  snapshot(): SamplerSnapshot {
    return {
      format: SNAPSHOT_FORMAT,
      version: SNAPSHOT_VERSION,
      options: { ...this.options },
      blobCount: this.evaluator.blobCount,
      stepCount: this.steps,
      chainFirstStep: this.states[0].chain.firstStep,
      ensembles: this.states.map((state) => {
        const view = state.chain.view();
        return {
          randomState: state.rng.state(),
          positions: state.positions.slice(),
          logProb: state.logProb.slice(),
          blobs: state.blobs.slice(),
          acceptedCounts: state.acceptedCounts.slice(),
          chainPositions: view.positions,
          chainLogProb: view.logProb,
          chainBlobs: view.blobs,
        };
      }),
    };
  }

  private state(ensemble: number): EnsembleState {
    const state = this.states[ensemble];
    if (!state) throw new RangeError(`ensemble index ${ensemble} is outside 0..${this.states.length - 1}`);
    return state;
  }
}
