import type { RandomStream } from '../math/index.js';
import type { ChainStorage } from './chainStorage.js';
import type { ThinnedTrace } from './thinnedTrace.js';
import { proposeDifferentialEvolution, proposeStretch } from './ensembleMoves.js';
import type { ResolvedEnsembleOptions } from './ensembleOptions.js';
import { invalidLogProbabilityError } from './evaluateBatchChecked.js';

/*
 * One half-step of every ensemble: the update of Goodman & Weare (2010,
 * Comm. App. Math. Comp. Sci. 5, 65) done for a whole half of the walkers at
 * once against the other half, held fixed (Foreman-Mackey et al. 2013,
 * PASP 125, 306, algorithm 3). Walkers 0 .. floor(W/2)-1 form the first
 * half, the rest the second; a step is the first half, then the second
 * against the updated first.
 *
 * Random-stream design (what makes chains identical for any worker count and
 * across checkpoint/restore): ensemble k owns one stream, seeded
 * deriveSeed(seed, 'ensemble', k); its state is saved in snapshots. Every
 * random number is drawn here, in the main thread, never in a worker, in
 * this order for each half of each step:
 *   1. proposeHalf, before the batch evaluation, for each walker of the half
 *      in index order: the move choice (one uniform, only when
 *      0 < differentialEvolutionWeight < 1), then the move's own draws
 *      (stretch: partner, z; differential evolution: two partners, one
 *      normal; see ensembleMoves.ts);
 *   2. acceptHalf, after the batch, for each walker of the half in index
 *      order: one acceptance uniform, drawn even when the proposal has
 *      log posterior -Infinity.
 * No other code draws from these streams. Evaluations are pure functions of
 * the point, so how a batch is split among workers cannot change anything.
 */

/** The live state of one ensemble (internal to the sampler). */
export interface EnsembleState {
  rng: RandomStream;
  /** Current walkers, walkers x dimension. */
  positions: Float64Array;
  /** Current log posterior per walker. */
  logProb: Float64Array;
  /** Current blobs, walkers x blobCount. */
  blobs: Float64Array;
  /** Accepted proposals per walker. */
  acceptedCounts: Float64Array;
  chain: ChainStorage;
  /** Bounded, thinned copy of the stored positions for the convergence diagnostics. */
  trace: ThinnedTrace;
}

/** Reusable buffers of one batch: every ensemble's proposals for one half, ensemble after ensemble. */
export interface HalfStepBatch {
  points: Float64Array;
  logProb: Float64Array;
  blobs: Float64Array;
  /** Log acceptance correction per proposal ((d - 1) ln z for a stretch, 0 for differential evolution). */
  correction: Float64Array;
}

/** First walker of half 0 or 1 of `walkers` walkers: 0, or floor(walkers / 2). @example halfStart(9, 1) // 4 */
export function halfStart(walkers: number, half: number): number {
  return half === 0 ? 0 : Math.floor(walkers / 2);
}

/** Number of walkers in half 0 (floor(walkers / 2)) or half 1 (the rest). @example halfSize(9, 1) // 5 */
export function halfSize(walkers: number, half: number): number {
  return half === 0 ? Math.floor(walkers / 2) : walkers - Math.floor(walkers / 2);
}

/**
 * Draws the proposals of half `half` of every ensemble into `batch`
 * (random draws step 1 above). Returns the number of proposals.
 * Cost O(ensembles x walkers/2 x dimension); allocates nothing; never throws.
 * @example const count = proposeHalf(states, options, 0, batch); // then evaluate batch.points[0 .. count x dimension)
 */
export function proposeHalf(states: EnsembleState[], options: ResolvedEnsembleOptions, half: number, batch: HalfStepBatch): number {
  const { dimension, walkers, stretchScale, differentialEvolutionWeight: weight } = options;
  const start = halfStart(walkers, half);
  const end = start + halfSize(walkers, half);
  const complementStart = halfStart(walkers, 1 - half);
  const complementSize = halfSize(walkers, 1 - half);
  const drawChoice = weight > 0 && weight < 1;
  let row = 0;
  for (const state of states) {
    const rng = state.rng;
    for (let walker = start; walker < end; walker++, row++) {
      const differential = weight === 1 || (drawChoice && rng.uniform() < weight);
      batch.correction[row] = differential
        ? proposeDifferentialEvolution(rng, state.positions, walker, complementStart, complementSize, dimension, batch.points, row * dimension)
        : proposeStretch(rng, state.positions, walker, complementStart, complementSize, dimension, stretchScale, batch.points, row * dimension);
    }
  }
  return row;
}

/**
 * Metropolis acceptance of the evaluated proposals of half `half` (random
 * draws step 2 above): accept when ln u < correction + ln p(proposal) - ln p(current).
 * First checks the whole batch, so a model that returned NaN or +Infinity
 * leaves every walker untouched. Cost O(count + accepted x dimension), no
 * allocation. Throws CandelaError `sampler.invalid_log_probability`.
 * @example acceptHalf(states, options, 0, batch, count, evaluator.blobCount)
 */
export function acceptHalf(states: EnsembleState[], options: ResolvedEnsembleOptions, half: number, batch: HalfStepBatch, count: number, blobCount: number): void {
  const { dimension, walkers } = options;
  for (let row = 0; row < count; row++) {
    if (!(batch.logProb[row] < Infinity)) throw invalidLogProbabilityError(batch.points, row, dimension, batch.logProb[row]);
  }
  const start = halfStart(walkers, half);
  const end = start + halfSize(walkers, half);
  let row = 0;
  for (const state of states) {
    for (let walker = start; walker < end; walker++, row++) {
      const proposed = batch.logProb[row];
      if (Math.log(state.rng.uniform()) < batch.correction[row] + proposed - state.logProb[walker]) {
        for (let k = 0; k < dimension; k++) state.positions[walker * dimension + k] = batch.points[row * dimension + k];
        for (let b = 0; b < blobCount; b++) state.blobs[walker * blobCount + b] = batch.blobs[row * blobCount + b];
        state.logProb[walker] = proposed;
        state.acceptedCounts[walker] += 1;
      }
    }
  }
}
