/** Steps a trace has room for when created; its buffer doubles from there up to its capacity. */
const INITIAL_TRACE_STEPS = 64;
/** Fewest steps a thinned trace keeps before it halves (so that the diagnostics always see some hundreds of draws per walker). */
export const MINIMUM_TRACE_STEPS = 512;
/**
 * Numbers (8 bytes each) a sampler's traces may hold together by default,
 * all ensembles: 2^22, 32 MiB. The capacity in steps is this divided by
 * walkers x ensembles x dimension (at least MINIMUM_TRACE_STEPS), rounded
 * down to an even number.
 */
export const TRACE_VALUE_BUDGET = 2 ** 22;

/** A read-only view of one ensemble's thinned trace. */
export interface TraceView {
  /** Positions of the kept steps, kept steps x walkers x dimension (step major). */
  positions: Float64Array;
  /** Kept steps: the stored steps 0, stride, 2 x stride, ... below the sampler's step count. */
  steps: number;
  /** Stored steps between two kept steps, a power of two (1 until the trace first fills). */
  stride: number;
  walkers: number;
  dimension: number;
}

/**
 * The capacity in steps of every ensemble's trace for a sampler of this shape under `valueBudget` numbers.
 * Cost O(1).
 * @param walkers walkers per ensemble. @param ensembles ensembles. @param dimension parameters.
 * @param valueBudget numbers all traces may hold together (default TRACE_VALUE_BUDGET).
 * @returns an even number of steps >= MINIMUM_TRACE_STEPS.
 * @throws nothing.
 * @example traceCapacitySteps(32, 4, 3) // 10922
 */
export function traceCapacitySteps(walkers: number, ensembles: number, dimension: number, valueBudget = TRACE_VALUE_BUDGET): number {
  const steps = Math.floor(valueBudget / Math.max(1, walkers * ensembles * dimension));
  return Math.max(MINIMUM_TRACE_STEPS, steps - (steps % 2));
}

/**
 * A bounded trace of one ensemble's walker positions for the convergence
 * diagnostics: it keeps stored step s (0-based, the state after step s + 1)
 * exactly when s is a multiple of `stride`, where the stride is the smallest
 * power of two that fits every such step of the run into `capacitySteps`.
 * When the trace is full and another step is due, every second kept step is
 * dropped and the stride doubles (the usual thinning-by-halving of a bounded
 * chain store; common practice). Its content therefore depends only on the
 * steps seen, not on when it was built: a trace rebuilt from a saved chain
 * equals the one kept while sampling, value for value.
 *
 * Until the run exceeds `capacitySteps` steps the stride is 1 and the trace
 * holds every step, so diagnostics computed from it equal those of the whole
 * chain. Beyond, they see draws `stride` steps apart; while the stride is
 * below the autocorrelation time / 5 (the thinning the diagnostics apply
 * anyway) they barely change, and beyond it the ESS they report is that of
 * the thinned draws, an underestimate (conservative for a stopping rule).
 *
 * Memory: at most capacitySteps x walkers x dimension numbers; the buffer
 * starts small and doubles as steps arrive, so a short run holds little.
 * Cost of `append`: O(walkers x dimension) amortized, plus O(capacity) once per halving.
 * @example
 * const trace = new ThinnedTrace(8, 2, 4);
 * for (let s = 0; s < 9; s++) trace.append(walkerPositions); // keeps steps 0..3, then 0, 2, 4, 6, then 0, 4, 8
 * trace.view().stride // 4
 */
export class ThinnedTrace {
  private data: Float64Array;
  private kept = 0;
  private stride = 1;
  private seen = 0;

  constructor(readonly walkers: number, readonly dimension: number, readonly capacitySteps: number) {
    if (!Number.isInteger(capacitySteps) || capacitySteps < 2 || capacitySteps % 2 !== 0) throw new RangeError(`trace capacity must be an even integer >= 2, got ${capacitySteps}`);
    this.data = new Float64Array(Math.min(capacitySteps, INITIAL_TRACE_STEPS) * walkers * dimension);
  }

  /** Steps offered to the trace so far (the sampler's stored steps). */
  get stepsSeen(): number {
    return this.seen;
  }

  /** Offers the next stored step (walkers x dimension positions); kept when its index is a multiple of the stride. */
  append(positions: Float64Array): void {
    const step = this.seen;
    this.seen = step + 1;
    if (step % this.stride !== 0) return;
    if (this.kept === this.capacitySteps) this.halve();
    if (step % this.stride !== 0) return;
    const size = this.walkers * this.dimension;
    if ((this.kept + 1) * size > this.data.length) {
      const grown = new Float64Array(Math.min(this.capacitySteps, 2 * (this.data.length / size)) * size);
      grown.set(this.data.subarray(0, this.kept * size));
      this.data = grown;
    }
    this.data.set(positions.subarray(0, size), this.kept * size);
    this.kept += 1;
  }

  /** Keeps every second kept step (those at multiples of twice the stride) and doubles the stride. */
  private halve(): void {
    const size = this.walkers * this.dimension;
    for (let j = 0; 2 * j < this.kept; j++) this.data.copyWithin(j * size, 2 * j * size, (2 * j + 1) * size);
    this.kept = Math.ceil(this.kept / 2);
    this.stride *= 2;
  }

  /** A view (valid until the next append) of the kept steps. */
  view(): TraceView {
    return {
      positions: this.data.subarray(0, this.kept * this.walkers * this.dimension),
      steps: this.kept,
      stride: this.stride,
      walkers: this.walkers,
      dimension: this.dimension,
    };
  }
}
