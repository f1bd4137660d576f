/** Initial row capacity of the dead-point arrays; they double when full. */
const INITIAL_CAPACITY = 1024;

/**
 * Growable row-major storage of dead points: parameter vector, ln L and
 * ln(prior-mass width). Appends are amortized O(D) without per-point allocation.
 */
export class DeadPointStore {
  count = 0;
  private capacity = INITIAL_CAPACITY;
  private theta: Float64Array;
  private logL: Float64Array;
  private logWidth: Float64Array;

  constructor(private readonly dimension: number) {
    this.theta = new Float64Array(INITIAL_CAPACITY * dimension);
    this.logL = new Float64Array(INITIAL_CAPACITY);
    this.logWidth = new Float64Array(INITIAL_CAPACITY);
  }

  /** Appends row `row` of the row-major `source` with its ln L and ln width. */
  push(source: Float64Array, row: number, logLikelihood: number, logWidth: number): void {
    if (this.count === this.capacity) this.grow();
    const dimension = this.dimension;
    this.theta.set(source.subarray(row * dimension, (row + 1) * dimension), this.count * dimension);
    this.logL[this.count] = logLikelihood;
    this.logWidth[this.count] = logWidth;
    this.count++;
  }

  /** Trimmed copies of the stored rows. */
  finish(): { samples: Float64Array; logLikelihoods: Float64Array; logWidths: Float64Array } {
    return {
      samples: this.theta.slice(0, this.count * this.dimension),
      logLikelihoods: this.logL.slice(0, this.count),
      logWidths: this.logWidth.slice(0, this.count),
    };
  }

  private grow(): void {
    this.capacity *= 2;
    const theta = new Float64Array(this.capacity * this.dimension);
    theta.set(this.theta);
    const logL = new Float64Array(this.capacity);
    logL.set(this.logL);
    const logWidth = new Float64Array(this.capacity);
    logWidth.set(this.logWidth);
    this.theta = theta;
    this.logL = logL;
    this.logWidth = logWidth;
  }
}
