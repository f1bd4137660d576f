import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { CandelaError } from '../../errors.js';
import { WEIGHT_COLUMN, type ChainTable } from './chainsFile.js';

/** Bytes read from the chains file at a time: the only text held in memory at once (plus one partial row). */
const READ_CHUNK_BYTES = 1 << 20;
/** Headroom over the row count estimated from the first chunk, so that the columns rarely grow. */
const ROW_ESTIMATE_MARGIN = 1.02;
/** Growth factor of the columns when the estimate was short. */
const COLUMN_GROWTH = 1.25;
/** The layout columns of chains.csv (integers), as opposed to its value columns. */
const LAYOUT_COLUMNS = ['ensemble', 'walker', 'step', 'burn_in'];
/** Columns every chains file has. */
const REQUIRED_COLUMNS = ['ensemble', 'walker', 'step', 'log_prior', 'log_likelihood', 'log_posterior', 'burn_in'];

const damaged = (path: string, line: number, message: string): CandelaError => new CandelaError({
  code: 'run.bad_chains', file: path, line, message, fix: 'the file is damaged; rerun `candela fit --resume` in its run folder to rewrite it',
});

/** Column arrays that grow in place while rows stream in. */
class GrowingTable {
  rows = 0;
  ensemble: Int32Array;
  walker: Int32Array;
  step: Int32Array;
  burnIn: Uint8Array;
  values: Float64Array[];

  constructor(valueCount: number, private capacity: number) {
    this.ensemble = new Int32Array(capacity);
    this.walker = new Int32Array(capacity);
    this.step = new Int32Array(capacity);
    this.burnIn = new Uint8Array(capacity);
    this.values = Array.from({ length: valueCount }, () => new Float64Array(capacity));
  }

  /** Makes room for one more row. */
  ensureRoom(): void {
    if (this.rows < this.capacity) return;
    this.capacity = Math.ceil(this.capacity * COLUMN_GROWTH) + 1024;
    const grow = <T extends Int32Array | Uint8Array | Float64Array>(old: T, make: (n: number) => T): T => {
      const next = make(this.capacity);
      next.set(old);
      return next;
    };
    this.ensemble = grow(this.ensemble, (n) => new Int32Array(n));
    this.walker = grow(this.walker, (n) => new Int32Array(n));
    this.step = grow(this.step, (n) => new Int32Array(n));
    this.burnIn = grow(this.burnIn, (n) => new Uint8Array(n));
    this.values = this.values.map((column) => grow(column, (n) => new Float64Array(n)));
  }
}

function parseCell(text: string): number {
  if (text === '') return Number.NaN;
  if (text === '-inf') return -Infinity;
  return Number(text);
}

/** What readChainsFile knows of an ensemble run beforehand (from run.json), to check the layout and keep fewer steps. */
export interface ChainsReadOptions {
  /**
   * The run's layout: every row must then be in place (ensemble, then step, then walker, one row each of
   * ensembles x steps x walkers), the walkers' acceptance is counted over every row (ChainTable.walkerAcceptance),
   * and the message of a short or disordered file says what run.json counts.
   */
  layout?: { ensembles: number; walkers: number; steps: number };
  /** Keep only the rows of every stepStride-th step (0, k, 2k, ...), default 1; every row is still read and checked. */
  stepStride?: number;
}

/**
 * Reads chains.csv back (with or without a weight column), streaming: the
 * file is read in chunks of READ_CHUNK_BYTES and parsed row by row into
 * column arrays, so no string ever holds the whole file (a single string
 * stops at about 512 MB in Node.js) and the memory is the numbers
 * themselves: 8 bytes per value cell and 13 per row for the layout columns,
 * about half the size of the text, divided by `stepStride` when only every
 * stepStride-th step is kept.
 *
 * The file must be whole: every row ends with a newline and has one field
 * per header name, and every cell is a number, empty (an undefined derived
 * quantity) or `-inf`. A file cut inside a row (a crash during a copy, a
 * full disk) is refused naming the line; with `layout`, a file cut at a row
 * boundary, or missing or disordered rows, is refused too (the row counts,
 * or the first row out of place).
 *
 * Cost: O(file size) time; memory O(rows / stepStride x columns) numbers plus one chunk.
 * @param path the chains file.
 * @param options the run's layout and the step stride (see ChainsReadOptions).
 * @returns the columns, with `weights` set when the file has a weight column.
 * @throws CandelaError `run.no_chains` when unreadable, `run.bad_chains` naming the line of a malformed,
 *   incomplete, non-numeric or (with `layout`) misplaced row, the missing columns, or the row counts.
 * @example readChainsFile('out/run/chains.csv').columns.omega_m
 */
export function readChainsFile(path: string, options: ChainsReadOptions = {}): ChainTable {
  let descriptor: number;
  let size: number;
  try {
    descriptor = openSync(path, 'r');
    size = fstatSync(descriptor).size;
  } catch {
    throw new CandelaError({ code: 'run.no_chains', file: path, message: 'cannot read the chains file', fix: 'point to a run folder written by `candela fit` (it holds chains.csv)' });
  }
  try {
    return parseChains(path, descriptor, size, options);
  } finally {
    closeSync(descriptor);
  }
}

/** The layout check and acceptance count of an ensemble run's rows, as they stream by. */
class LayoutTracker {
  dataRows = 0;
  misplaced: { line: number; expected: string; found: string } | null = null;
  readonly moves: Float64Array;
  private readonly previous: Float64Array;

  constructor(private readonly layout: { ensembles: number; walkers: number; steps: number }) {
    this.moves = new Float64Array(layout.ensembles * layout.walkers);
    this.previous = new Float64Array(layout.ensembles * layout.walkers);
  }

  /** Checks one row's place (the first misplaced row is kept) and counts its walker's move. */
  see(line: number, ensemble: number, step: number, walker: number, logPosterior: number): void {
    const { walkers, steps } = this.layout;
    const r = this.dataRows++;
    const expected = { walker: r % walkers, step: Math.floor(r / walkers) % steps, ensemble: Math.floor(r / (walkers * steps)) };
    if (this.misplaced === null && (expected.ensemble !== ensemble || expected.step !== step || expected.walker !== walker)) {
      this.misplaced = { line, expected: `ensemble ${expected.ensemble}, step ${expected.step}, walker ${expected.walker}`, found: `ensemble ${ensemble}, step ${step}, walker ${walker}` };
    }
    if (this.misplaced !== null) return;
    const slot = ensemble * walkers + walker;
    // NaN (an empty cell) compares unequal to itself: counted as a move, as the whole-table count does.
    if (step > 0 && logPosterior !== this.previous[slot]) this.moves[slot] += 1;
    this.previous[slot] = logPosterior;
  }

  /** Throws when the rows do not cover the layout or one was out of place; returns each walker's acceptance fraction. */
  finish(path: string): Float64Array {
    const { ensembles, walkers, steps } = this.layout;
    const fix = 'the file is incomplete or damaged; rerun `candela fit --resume` in its run folder to rewrite it';
    if (this.dataRows !== ensembles * walkers * steps) {
      throw new CandelaError({
        code: 'run.bad_chains', file: path, message: 'the chains file does not hold every stored step of the run',
        expected: `${ensembles * walkers * steps} rows (${ensembles} ensembles x ${steps} steps x ${walkers} walkers, from run.json)`, found: `${this.dataRows} rows`, fix,
      });
    }
    if (this.misplaced) {
      throw new CandelaError({ code: 'run.bad_chains', file: path, line: this.misplaced.line, message: 'a row is out of place in the chains file', expected: this.misplaced.expected, found: this.misplaced.found, fix });
    }
    return this.moves.map((count) => (steps > 1 ? count / (steps - 1) : 0));
  }
}

function parseChains(path: string, descriptor: number, size: number, options: ChainsReadOptions): ChainTable {
  const stride = options.stepStride ?? 1;
  const tracker = options.layout ? new LayoutTracker(options.layout) : null;
  let logPosteriorIndex = -1;
  const chunk = Buffer.allocUnsafe(READ_CHUNK_BYTES);
  let position = 0;
  let carry = '';
  let header: string[] | null = null;
  let table: GrowingTable | null = null;
  let valueNames: string[] = [];
  let valueIndex: number[] = [];
  let layoutIndex: number[] = [];
  let line = 0;
  const addRow = (text: string): void => {
    line++;
    if (header === null) {
      header = text.split(',');
      const names = header;
      const missing = REQUIRED_COLUMNS.filter((name) => !names.includes(name));
      if (missing.length) throw damaged(path, 1, `the chains file lacks the columns ${missing.join(', ')}`);
      valueNames = names.filter((name) => !LAYOUT_COLUMNS.includes(name));
      valueIndex = valueNames.map((name) => names.indexOf(name));
      layoutIndex = LAYOUT_COLUMNS.map((name) => names.indexOf(name));
      logPosteriorIndex = names.indexOf('log_posterior');
      return;
    }
    const parts = text.split(',');
    if (parts.length !== header.length) throw damaged(path, line, `row has ${parts.length} fields, the header ${header.length}`);
    const target = table as GrowingTable;
    target.ensureRoom();
    const r = target.rows;
    const [ie, iw, is, ib] = layoutIndex;
    const ensemble = Number(parts[ie]);
    const walker = Number(parts[iw]);
    const step = Number(parts[is]);
    if (!Number.isInteger(ensemble) || !Number.isInteger(walker) || !Number.isInteger(step) || parts[ie] === '' || parts[iw] === '' || parts[is] === '' || (parts[ib] !== '0' && parts[ib] !== '1')) {
      throw damaged(path, line, 'the ensemble, walker and step cells must be whole numbers and burn_in 0 or 1');
    }
    if (tracker) tracker.see(line, ensemble, step, walker, parseCell(parts[logPosteriorIndex]));
    if (stride > 1 && step % stride !== 0) {
      // A row of a step that is not kept: checked like any other, then dropped.
      for (let k = 0; k < valueIndex.length; k++) {
        const cellText = parts[valueIndex[k]];
        if (Number.isNaN(parseCell(cellText)) && cellText !== '') throw damaged(path, line, `the ${valueNames[k]} cell "${cellText.slice(0, 40)}" is not a number`);
      }
      return;
    }
    target.ensemble[r] = ensemble;
    target.walker[r] = walker;
    target.step[r] = step;
    target.burnIn[r] = parts[ib] === '1' ? 1 : 0;
    for (let k = 0; k < valueIndex.length; k++) {
      const cellText = parts[valueIndex[k]];
      const value = parseCell(cellText);
      if (Number.isNaN(value) && cellText !== '') throw damaged(path, line, `the ${valueNames[k]} cell "${cellText.slice(0, 40)}" is not a number`);
      target.values[k][r] = value;
    }
    target.rows = r + 1;
  };
  for (;;) {
    const read = readSync(descriptor, chunk, 0, READ_CHUNK_BYTES, position);
    if (read === 0) break;
    position += read;
    const lines = (carry + chunk.toString('latin1', 0, read)).split('\n');
    carry = lines.pop() as string;
    for (const text of lines) {
      addRow(text);
      if (table === null && header !== null) {
        // Estimate the rows from the first chunk's average row length, so the columns are allocated about once.
        const rowBytes = Math.max(1, read / Math.max(1, lines.length));
        table = new GrowingTable(valueNames.length, Math.ceil((size / rowBytes / stride) * ROW_ESTIMATE_MARGIN) + 16);
      }
    }
  }
  if (carry !== '') {
    throw damaged(path, line + 1, header === null ? 'the chains file has no complete header line' : 'the chains file ends inside a row (no final newline): it was cut short');
  }
  if (header === null) throw damaged(path, 1, 'the chains file is empty');
  const finalTable = table ?? new GrowingTable(valueNames.length, 0);
  const rows = finalTable.rows;
  const result: ChainTable = {
    header,
    ensemble: finalTable.ensemble.subarray(0, rows), walker: finalTable.walker.subarray(0, rows), step: finalTable.step.subarray(0, rows), burnIn: finalTable.burnIn.subarray(0, rows),
    columns: Object.fromEntries(valueNames.map((name, k) => [name, finalTable.values[k].subarray(0, rows)])), weights: null, rows,
  };
  if ((header as string[]).includes(WEIGHT_COLUMN)) result.weights = result.columns[WEIGHT_COLUMN];
  if (tracker) result.walkerAcceptance = tracker.finish(path);
  if (stride > 1) result.stepStride = stride;
  return result;
}
