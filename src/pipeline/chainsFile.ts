import { closeSync, fsyncSync, openSync, readFileSync, renameSync, writeSync } from 'node:fs';
import { CandelaError } from '../errors.js';

/**
 * chains.csv: one row per stored sample, ensemble-major then step then walker.
 * Columns: ensemble, walker, step, every sampled parameter, every derived
 * quantity, log_prior, log_likelihood, log_posterior, burn_in (1 for steps
 * inside the burn-in, else 0). Numbers are written as the shortest decimal
 * that reads back as the same double (ECMAScript Number#toString), so the file
 * is exact and identical on every machine; a derived quantity that does not
 * exist for a sample (no acceleration epoch) is an empty cell.
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
  rows: number;
}

/** Rows buffered before each write. */
const ROWS_PER_WRITE = 4096;

function cell(value: number): string {
  return Number.isFinite(value) ? String(value) : value === -Infinity ? '-inf' : '';
}

/** Header names of chains.csv for these columns. */
export function chainHeader(columns: ChainColumns): string[] {
  return ['ensemble', 'walker', 'step', ...columns.parameters, ...columns.derived, 'log_prior', 'log_likelihood', 'log_posterior', 'burn_in'];
}

/**
 * Writes chains.csv atomically (temporary file in the same folder, fsync,
 * rename), streaming rows so memory stays O(rows per write).
 */
export function writeChainsFile(path: string, columns: ChainColumns, ensembles: EnsembleDraws[], burnInSteps: number): void {
  const temporary = `${path}.tmp-${process.pid}`;
  const fd = openSync(temporary, 'w');
  try {
    writeSync(fd, `${chainHeader(columns).join(',')}\n`);
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
          parts.push(cell(draws.blobs[blobBase]), cell(draws.blobs[blobBase + 1]), cell(draws.logProb[row]), step < burnInSteps ? '1' : '0');
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

/** Reads chains.csv back; throws a CandelaError naming the line of a malformed row. */
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
    columns: Object.fromEntries(valueNames.map((name) => [name, new Float64Array(rows)])), rows,
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
  return table;
}
