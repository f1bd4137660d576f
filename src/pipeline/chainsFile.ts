import { closeSync, fsyncSync, openSync, readFileSync, renameSync, writeSync } from 'node:fs';
import { CandelaError } from '../errors.js';

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
 * Writes chains.csv atomically (temporary file in the same folder, fsync,
 * rename), streaming rows so memory stays O(rows per write).
 * @param path the file to write.
 * @param columns sampled and derived names.
 * @param ensembles the draws, one entry per ensemble.
 * @param burnInSteps steps flagged as burn-in (0 for nested sampling).
 * @param weights optional posterior weight per row, in file order (all ensembles' rows
 *   concatenated); when given, a `weight` column is written before `burn_in`.
 * @throws Error from the file system; CandelaError `run.bad_weights` when the weight count differs from the row count.
 * @example writeChainsFile('out/chains.csv', { parameters: ['omega_m'], derived: [] }, [draws], 0, weights)
 */
export function writeChainsFile(path: string, columns: ChainColumns, ensembles: EnsembleDraws[], burnInSteps: number, weights?: Float64Array): void {
  const rowCount = ensembles.reduce((sum, draws) => sum + draws.steps * draws.walkers, 0);
  if (weights && weights.length !== rowCount) {
    throw new CandelaError({ code: 'run.bad_weights', file: path, message: 'one posterior weight per stored sample is needed', expected: `${rowCount} weights`, found: String(weights.length) });
  }
  let rowIndex = 0;
  const temporary = `${path}.tmp-${process.pid}`;
  const fd = openSync(temporary, 'w');
  try {
    writeSync(fd, `${chainHeader(columns, weights !== undefined).join(',')}\n`);
    const derivedCount = columns.derived.length;
    let buffer: string[] = [];
    ensembles.forEach((draws, ensembleIndex) => {
      const { steps, walkers, dimension, blobCount } = draws;
      for (let step = 0; step < steps; step++) {
        for (let walker = 0; walker < walkers; walker++) {
          const row = step * walkers + walker;
          const parts: string[] = [String(ensembleIndex), String(walker), String(step)];
          for (let d = 0; d < dimension; d++) parts.push(cell(draws.positions[row * dimension + d]));
          const blobBase = row * blobCount;
          for (let k = 0; k < derivedCount; k++) parts.push(cell(draws.blobs[blobBase + 2 + k]));
          parts.push(cell(draws.blobs[blobBase]), cell(draws.blobs[blobBase + 1]), cell(draws.logProb[row]));
          if (weights) parts.push(cell(weights[rowIndex]));
          parts.push(step < burnInSteps ? '1' : '0');
          rowIndex++;
          buffer.push(parts.join(','));
          if (buffer.length >= ROWS_PER_WRITE) {
            writeSync(fd, `${buffer.join('\n')}\n`);
            buffer = [];
          }
        }
      }
    });
    if (buffer.length) writeSync(fd, `${buffer.join('\n')}\n`);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(temporary, path);
}

/**
 * Reads chains.csv back (with or without a weight column).
 * @param path the chains file.
 * @returns the columns, with `weights` set when the file has a weight column.
 * @throws CandelaError `run.no_chains` when unreadable, `run.bad_chains` naming the line of a malformed row or missing columns.
 * @example readChainsFile('out/run/chains.csv').columns.omega_m
 */
export function readChainsFile(path: string): ChainTable {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch {
    throw new CandelaError({ code: 'run.no_chains', file: path, message: 'cannot read the chains file', fix: 'point to a run folder written by `candela fit` (it holds chains.csv)' });
  }
  const lines = text.split('\n');
  if (lines[lines.length - 1] === '') lines.pop();
  const header = (lines[0] ?? '').split(',');
  const required = ['ensemble', 'walker', 'step', 'log_prior', 'log_likelihood', 'log_posterior', 'burn_in'];
  const missing = required.filter((name) => !header.includes(name));
  if (missing.length) {
    throw new CandelaError({ code: 'run.bad_chains', file: path, line: 1, message: `the chains file lacks the columns ${missing.join(', ')}`, fix: 'regenerate the run with `candela fit`' });
  }
  const rows = lines.length - 1;
  const index = (name: string) => header.indexOf(name);
  const valueNames = header.filter((name) => !['ensemble', 'walker', 'step', 'burn_in'].includes(name));
  const table: ChainTable = {
    header,
    ensemble: new Int32Array(rows), walker: new Int32Array(rows), step: new Int32Array(rows), burnIn: new Uint8Array(rows),
    columns: Object.fromEntries(valueNames.map((name) => [name, new Float64Array(rows)])), weights: null, rows,
  };
  const valueIndex = valueNames.map((name) => [index(name), table.columns[name]] as const);
  const [ie, iw, is, ib] = ['ensemble', 'walker', 'step', 'burn_in'].map(index);
  for (let r = 0; r < rows; r++) {
    const parts = lines[r + 1].split(',');
    if (parts.length !== header.length) {
      throw new CandelaError({ code: 'run.bad_chains', file: path, line: r + 2, message: `row has ${parts.length} fields, the header ${header.length}`, fix: 'the file is damaged; rerun `candela fit --resume` to rewrite it' });
    }
    table.ensemble[r] = Number(parts[ie]);
    table.walker[r] = Number(parts[iw]);
    table.step[r] = Number(parts[is]);
    table.burnIn[r] = parts[ib] === '1' ? 1 : 0;
    for (const [i, column] of valueIndex) {
      const text = parts[i];
      column[r] = text === '' ? Number.NaN : text === '-inf' ? -Infinity : Number(text);
    }
  }
  if (header.includes(WEIGHT_COLUMN)) table.weights = table.columns[WEIGHT_COLUMN];
  return table;
}
