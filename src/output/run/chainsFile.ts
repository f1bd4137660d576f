import { CandelaError } from '../../errors.js';
import { writeFileAtomicBy } from '../writeFileAtomic.js';
import { asStoredDraws, STORED_DRAWS_BLOCK_STEPS, type StoredDraws } from './storedDraws.js';

export { readChainsFile } from './readChainsFile.js';

/**
 * chains.csv: one row per stored sample, ensemble-major then step then walker.
 * Columns: ensemble, walker, step, every sampled parameter, every derived
 * quantity, log_prior, log_likelihood, log_posterior, [weight,] burn_in (1 for
 * steps inside the burn-in, else 0). Numbers are written as the shortest
 * decimal that reads back as the same double (ECMAScript Number#toString), so
 * the file is exact and identical on every machine; a derived quantity that
 * does not exist for a sample (no acceleration epoch) is an empty cell.
 *
 * The `weight` column exists only for weighted samples (nested sampling: one
 * row per dead or final live point, ensemble 0, walker 0, step = iteration,
 * weight = normalized posterior weight, the weights summing to 1, burn_in 0).
 * Ensemble-sampler chains are equally weighted and have no weight column, so
 * their files are unchanged by this option.
 */
export interface ChainColumns {
  /** Sampled parameter names, in theta order. */
  parameters: readonly string[];
  /** Derived quantity names, in blob order after log prior and log likelihood. */
  derived: readonly string[];
}

/** The stored draws of one ensemble, as the sampler keeps them. */
export interface EnsembleDraws {
  steps: number;
  walkers: number;
  dimension: number;
  /** steps x walkers x dimension */
  positions: Float64Array;
  /** steps x walkers */
  logProb: Float64Array;
  /** steps x walkers x blobCount: [log prior, log likelihood, derived...] */
  blobs: Float64Array;
  blobCount: number;
}

/** Chains read back from chains.csv, column-major per variable. */
export interface ChainTable {
  header: string[];
  ensemble: Int32Array;
  walker: Int32Array;
  step: Int32Array;
  burnIn: Uint8Array;
  /** Column values by name (NaN for empty cells). */
  columns: Record<string, Float64Array>;
  /** Posterior weight per row (the `weight` column of a nested-sampling run), or null for equally weighted chains. */
  weights: Float64Array | null;
  rows: number;
  /**
   * The table keeps every stepStride-th step of an ensemble run (0, k, 2k, ...; absent or 1: every step), when the
   * whole chain would exceed the memory budget of the reader; the rows keep their true step numbers.
   */
  stepStride?: number;
  /**
   * Acceptance fraction of each walker over every step of the run (ensemble-major: k x walkers + w), counted while
   * reading, so that it is exact when the table keeps fewer steps; absent when the reader did not count it.
   */
  walkerAcceptance?: Float64Array;
}

/** Rows buffered before each write. */
const ROWS_PER_WRITE = 4096;

function cell(value: number): string {
  return Number.isFinite(value) ? String(value) : value === -Infinity ? '-inf' : '';
}

/** Name of the optional posterior-weight column (nested-sampling runs). */
export const WEIGHT_COLUMN = 'weight';

/**
 * Header names of chains.csv for these columns (with the weight column when `weighted`).
 * Cost: O(columns).
 * @param columns sampled and derived names.
 * @param weighted whether a weight column is written.
 * @returns the header fields in file order.
 * @throws nothing.
 * @example chainHeader({ parameters: ['omega_m'], derived: [] }) // ['ensemble', 'walker', 'step', 'omega_m', 'log_prior', 'log_likelihood', 'log_posterior', 'burn_in']
 */
export function chainHeader(columns: ChainColumns, weighted = false): string[] {
  return ['ensemble', 'walker', 'step', ...columns.parameters, ...columns.derived, 'log_prior', 'log_likelihood', 'log_posterior', ...(weighted ? [WEIGHT_COLUMN] : []), 'burn_in'];
}

/**
 * Writes chains.csv atomically (writeFileAtomicBy: temporary file in the
 * same folder, fsync, rename), streaming rows so memory stays O(rows per
 * write plus one block of draws); a failed write (full disk) leaves no temporary file and the
 * previous chains.csv, if any, untouched.
 * @param path the file to write.
 * @param columns sampled and derived names.
 * @param draws the draws: a StoredDraws source (read a block at a time) or one EnsembleDraws per ensemble.
 * @param burnInSteps steps flagged as burn-in (0 for nested sampling).
 * @param weights optional posterior weight per row, in file order (all ensembles' rows
 *   concatenated); when given, a `weight` column is written before `burn_in`.
 * @param selection the steps written (see chainsSelection; default every step); rows keep their true step numbers.
 * @throws CandelaError `output.write_failed` when the file system refuses (full disk, read-only), after removing the
 *   temporary file; `run.bad_weights` when the weight count differs from the row count.
 * @example writeChainsFile('out/chains.csv', { parameters: ['omega_m'], derived: [] }, [draws], 0, weights)
 */
export function writeChainsFile(path: string, columns: ChainColumns, draws: StoredDraws | readonly EnsembleDraws[], burnInSteps: number, weights?: Float64Array, selection?: { first_step: number; every_steps: number; steps: number }): void {
  const source = asStoredDraws(draws);
  const rowCount = source.ensembles * (selection ? selection.steps : source.steps) * source.walkers;
  if (weights && weights.length !== rowCount) {
    throw new CandelaError({ code: 'run.bad_weights', file: path, message: 'one posterior weight per stored sample is needed', expected: `${rowCount} weights`, found: String(weights.length) });
  }
  let rowIndex = 0;
  writeFileAtomicBy(path, (write) => {
    write(`${chainHeader(columns, weights !== undefined).join(',')}\n`);
    const derivedCount = columns.derived.length;
    const { walkers, dimension, blobCount } = source;
    const { first_step: first, every_steps: every, steps: count } = selection ?? { first_step: 0, every_steps: 1, steps: source.steps };
    // Selected steps per read: a block spans at most STORED_DRAWS_BLOCK_STEPS steps (one step when thinned wider).
    const span = Math.max(1, Math.floor(STORED_DRAWS_BLOCK_STEPS / every));
    let buffer: string[] = [];
    for (let ensembleIndex = 0; ensembleIndex < source.ensembles; ensembleIndex++) {
      for (let j = 0; j < count; j += span) {
        const from = first + j * every;
        const last = first + (Math.min(count, j + span) - 1) * every;
        const block = source.block(ensembleIndex, from, last + 1);
        for (let step = from; step <= last; step += every) {
          for (let walker = 0; walker < walkers; walker++) {
            const row = (step - from) * walkers + walker;
            const parts: string[] = [String(ensembleIndex), String(walker), String(step)];
            for (let d = 0; d < dimension; d++) parts.push(cell(block.positions[row * dimension + d]));
            const blobBase = row * blobCount;
            for (let k = 0; k < derivedCount; k++) parts.push(cell(block.blobs[blobBase + 2 + k]));
            parts.push(cell(block.blobs[blobBase]), cell(block.blobs[blobBase + 1]), cell(block.logProb[row]));
            if (weights) parts.push(cell(weights[rowIndex]));
            parts.push(step < burnInSteps ? '1' : '0');
            rowIndex++;
            buffer.push(parts.join(','));
            if (buffer.length >= ROWS_PER_WRITE) {
              write(`${buffer.join('\n')}\n`);
              buffer = [];
            }
          }
        }
      }
    }
    if (buffer.length) write(`${buffer.join('\n')}\n`);
  });
}
