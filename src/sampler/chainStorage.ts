/** Steps preallocated when a chain store is created empty. */
const INITIAL_CAPACITY_STEPS = 64;

/**
 * A read-only view of one ensemble's stored chain, step major: step, then
 * walker, then parameter. It holds the stored steps firstStep ..
 * firstStep + steps - 1 (firstStep is 0 until the caller releases steps it
 * has saved elsewhere, see EnsembleSampler.releaseStoredSteps).
 */
export interface ChainView {
  /** Positions, steps x walkers x dimension. */
  positions: Float64Array;
  /** Log posterior, steps x walkers. */
  logProb: Float64Array;
  /** Blobs, steps x walkers x blobCount. */
  blobs: Float64Array;
  /** Steps in this view. */
  steps: number;
  /** Index of the first step in this view among all the run's stored steps (steps before it were released). */
  firstStep: number;
  walkers: number;
  dimension: number;
  blobCount: number;
}

/**
 * Growable storage of one ensemble's chain: the walkers' state after every
 * step, appended in place. Capacity grows by doubling (or to a requested size
 * via {@link ChainStorage.reserve}), so appending is amortized O(state size)
 * and the sampler reserves room before a run of steps: no growth happens
 * inside the step loop. Steps the caller has saved elsewhere (a chain record
 * on disk) can be released ({@link ChainStorage.release}), so that memory
 * holds only the steps not yet saved, however long the run.
 * @example
 * const store = new ChainStorage(8, 2, 0);
 * store.append(positions, logProb, blobs); store.steps // 1
 */
export class ChainStorage {
  private positionData: Float64Array;
  private logProbData: Float64Array;
  private blobData: Float64Array;
  private stored = 0;
  private first = 0;

  constructor(readonly walkers: number, readonly dimension: number, readonly blobCount: number, capacitySteps = INITIAL_CAPACITY_STEPS) {
    const capacity = Math.max(1, capacitySteps);
    this.positionData = new Float64Array(capacity * walkers * dimension);
    this.logProbData = new Float64Array(capacity * walkers);
    this.blobData = new Float64Array(capacity * walkers * blobCount);
  }

  /** Steps held now (stored and not released). */
  get steps(): number {
    return this.stored;
  }

  /** Index of the first step held: the steps released so far. */
  get firstStep(): number {
    return this.first;
  }

  /**
   * Drops the held steps before step `upTo` (an index among all stored steps,
   * clamped to those held). The kept steps move to new arrays just large
   * enough for them (at least the initial capacity), so views taken earlier
   * stay correct and a long run's early growth is given back. Cost O(kept steps).
   */
  release(upTo: number): void {
    const drop = Math.min(this.stored, Math.max(0, Math.floor(upTo) - this.first));
    if (drop === 0) return;
    const capacity = Math.max(INITIAL_CAPACITY_STEPS, this.stored - drop);
    const keep = (old: Float64Array, perStep: number): Float64Array => {
      const next = new Float64Array(capacity * perStep);
      next.set(old.subarray(drop * perStep, this.stored * perStep));
      return next;
    };
    this.positionData = keep(this.positionData, this.walkers * this.dimension);
    this.logProbData = keep(this.logProbData, this.walkers);
    this.blobData = keep(this.blobData, this.walkers * this.blobCount);
    this.stored -= drop;
    this.first += drop;
  }

  /** Steps that fit without growing. */
  get capacitySteps(): number {
    return this.logProbData.length / this.walkers;
  }

  /** Makes room for `totalSteps` held steps (at least doubling), copying what is held. Cost O(held data). */
  reserve(totalSteps: number): void {
    if (totalSteps <= this.capacitySteps) return;
    const capacity = Math.max(totalSteps, 2 * this.capacitySteps);
    const grow = (old: Float64Array, perStep: number): Float64Array => {
      const next = new Float64Array(capacity * perStep);
      next.set(old.subarray(0, this.stored * perStep));
      return next;
    };
    this.positionData = grow(this.positionData, this.walkers * this.dimension);
    this.logProbData = grow(this.logProbData, this.walkers);
    this.blobData = grow(this.blobData, this.walkers * this.blobCount);
  }

  /** Appends the walkers' current state (walkers x dimension, walkers, walkers x blobCount). */
  append(positions: Float64Array, logProb: Float64Array, blobs: Float64Array): void {
    if (this.stored >= this.capacitySteps) this.reserve(this.stored + 1);
    const step = this.stored;
    this.positionData.set(positions, step * this.walkers * this.dimension);
    this.logProbData.set(logProb, step * this.walkers);
    this.blobData.set(blobs, step * this.walkers * this.blobCount);
    this.stored = step + 1;
  }

  /**
   * Views (not copies) of the held steps. Stored steps are never rewritten
   * (growth and release copy into new buffers and leave the old ones intact), so a view
   * stays correct forever; it only does not see steps appended later.
   */
  view(): ChainView {
    const steps = this.stored;
    return {
      positions: this.positionData.subarray(0, steps * this.walkers * this.dimension),
      logProb: this.logProbData.subarray(0, steps * this.walkers),
      blobs: this.blobData.subarray(0, steps * this.walkers * this.blobCount),
      steps,
      firstStep: this.first,
      walkers: this.walkers,
      dimension: this.dimension,
      blobCount: this.blobCount,
    };
  }

  /** Rebuilds a store from saved arrays holding steps firstStep .. firstStep + steps - 1 (lengths must be whole steps; checked by the caller). */
  static fromArrays(walkers: number, dimension: number, blobCount: number, steps: number, positions: ArrayLike<number>, logProb: ArrayLike<number>, blobs: ArrayLike<number>, firstStep = 0): ChainStorage {
    const store = new ChainStorage(walkers, dimension, blobCount, Math.max(INITIAL_CAPACITY_STEPS, steps));
    store.positionData.set(positions);
    store.logProbData.set(logProb);
    store.blobData.set(blobs);
    store.stored = steps;
    store.first = firstStep;
    return store;
  }
}
