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

/**
 * Reads chains.csv back (with or without a weight column), streaming: the
 * file is read in chunks of READ_CHUNK_BYTES and parsed row by row into
 * column arrays, so no string ever holds the whole file (a single string
 * stops at about 512 MB in Node.js) and the memory is the numbers
 * themselves: 8 bytes per value cell and 13 per row for the layout columns,
 * about half the size of the text.
 *
 * The file must be whole: every row ends with a newline and has one field
 * per header name, and every cell is a number, empty (an undefined derived
 * quantity) or `-inf`. A file cut inside a row (a crash during a copy, a
 * full disk) is refused naming the line; a file cut at a row boundary is
 * caught by the layout check of readRunFolder against run.json.
 *
 * Cost: O(file size) time; memory O(rows x columns) numbers plus one chunk.
 * @param path the chains file.
 * @returns the columns, with `weights` set when the file has a weight column.
 * @throws CandelaError `run.no_chains` when unreadable, `run.bad_chains` naming the line of a malformed,
 *   incomplete or non-numeric row or the missing columns.
 * @example readChainsFile('out/run/chains.csv').columns.omega_m
 */
export function readChainsFile(path: string): ChainTable {
  let descriptor: number;
  let size: number;
  try {
    descriptor = openSync(path, 'r');
    size = fstatSync(descriptor).size;
  } catch {
    throw new CandelaError({ code: 'run.no_chains', file: path, message: 'cannot read the chains file', fix: 'point to a run folder written by `candela fit` (it holds chains.csv)' });
  }
  try {
    return parseChains(path, descriptor, size);
  } finally {
    closeSync(descriptor);
  }
}

function parseChains(path: string, descriptor: number, size: number): ChainTable {
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
        table = new GrowingTable(valueNames.length, Math.ceil((size / rowBytes) * ROW_ESTIMATE_MARGIN) + 16);
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
  return result;
}
