import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError } from '../../errors.js';
import { plainConfiguration } from '../../config/index.js';
import { readChainsFile, type ChainTable } from '../../output/index.js';
import { chainRecordTable } from './chainRecordTable.js';
import type { ChainsSelection } from '../../output/index.js';
import { RUN_FILES } from '../../output/index.js';
import type { NestedRunFacts } from './nestedRunRecord.js';
import type { RunRecord } from './runRecord.js';
import { blindedParametersOf, type BlindableRecord } from '../blinding/runBlinding.js';
import { blindedChainTable, blindedRecordView } from '../blinding/blindedRunView.js';

/**
 * run.json as read back: the ensemble sampler's record, or a nested-sampling
 * record, which adds `sampler` (method and settings) and `evidence`. Records
 * without `sampler` come from the ensemble sampler.
 */
export type StoredRunRecord = RunRecord & Partial<NestedRunFacts> & BlindableRecord & {
  /** The steps chains.csv holds (absent: every step, as runs before this field wrote). */
  chains_csv?: ChainsSelection;
};

/**
 * The sampler that wrote a run: `nested` when run.json says so, else `ensemble`.
 * Cost: O(1).
 * @param record run.json as read back.
 * @returns the method.
 * @throws nothing.
 * @example samplerMethodOf({ ...record, sampler: { method: 'nested', ... } }) // 'nested'
 */
export function samplerMethodOf(record: StoredRunRecord): 'ensemble' | 'nested' {
  return record.sampler?.method === 'nested' ? 'nested' : 'ensemble';
}

/** A finished run folder read back: what `candela report` works from. */
export interface RunOnDisk {
  dir: string;
  record: StoredRunRecord;
  chains: ChainTable;
  hubble: { columns: Record<string, string[]> } | null;
  hubbleModel: Record<string, Float64Array> | null;
}

function readCsvColumns(path: string): Record<string, string[]> | null {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch {
    return null;
  }
  const lines = text.trim().split('\n');
  const header = lines[0].split(',');
  const columns: Record<string, string[]> = Object.fromEntries(header.map((name) => [name, [] as string[]]));
  for (let i = 1; i < lines.length; i++) {
    const parts = lines[i].split(',');
    header.forEach((name, k) => columns[name].push(parts[k] ?? ''));
  }
  return columns;
}

/** What readRunFolder may be told. */
export interface RunReadOptions {
  /**
   * Memory the chains may take as numbers, MB (default: the run's `output.chain_memory_mb`, else
   * DEFAULT_CHAIN_MEMORY_MB). An ensemble run whose every step would take more is read keeping every k-th step
   * (the smallest k that fits; chainStepStride).
   */
  chainMemoryMb?: number;
  /** The budget is shared by this many runs read and held together (`compare`, an overlay): each gets its share (default 1). */
  sharedBy?: number;
}

/** Memory budget of a run's chains as read back, MB, when neither the command nor the configuration sets one (fits a laptop; common practice). */
export const DEFAULT_CHAIN_MEMORY_MB = 1024;
/** Bytes per row of the chain table beside its value columns: ensemble, walker and step (int32) and burn_in (uint8). */
const LAYOUT_BYTES_PER_ROW = 13;

/**
 * The step stride that fits an ensemble run's chains into `memoryMb`: 1 when
 * every step fits, else the smallest k such that every k-th step does
 * (8 bytes per value, 13 per row for the layout columns).
 * Cost: O(1).
 * @param record run.json of the run.
 * @param memoryMb the budget, MB (> 0).
 * @returns the stride (1 for nested-sampling runs, whose weighted rows are never thinned).
 * @throws nothing.
 * @example chainStepStride(record, 1024) // 1 for the demo's 3,000 steps x 32 walkers
 */
export function chainStepStride(record: StoredRunRecord, memoryMb: number): number {
  if (samplerMethodOf(record) !== 'ensemble') return 1;
  const { ensembles, walkers, steps } = record.run;
  const values = record.parameters.sampled.length + record.parameters.derived.length + 3;
  const bytes = ensembles * walkers * steps * (values * 8 + LAYOUT_BYTES_PER_ROW);
  return Math.max(1, Math.ceil(bytes / (memoryMb * 2 ** 20)));
}

/** The chain memory budget of a run, MB: the command's, else the stored configuration's `output.chain_memory_mb`, else the default; divided among the runs read together. */
function chainMemoryOf(record: StoredRunRecord, options: RunReadOptions): number {
  const stored = plainConfiguration(record.configuration).output?.chain_memory_mb;
  const budget = options.chainMemoryMb ?? (typeof stored === 'number' && stored > 0 ? stored : DEFAULT_CHAIN_MEMORY_MB);
  return budget / Math.max(1, options.sharedBy ?? 1);
}

/**
 * run.json of a run folder, parsed: the one reader of the record, for every
 * command that needs a run's facts without its chains (merge, unblind) and
 * for readRunFolder.
 * Cost: one small file read.
 * @param dir the run folder.
 * @returns the record as stored (blinded runs' values as written, blinded).
 * @throws CandelaError `run.no_record` naming run.json when it is missing or not JSON.
 * @example readRunRecord('out/demo').run.steps // 3000
 */
export function readRunRecord<T extends StoredRunRecord = StoredRunRecord>(dir: string): T {
  const path = join(dir, RUN_FILES.run);
  try {
    return JSON.parse(readFileSync(path, 'utf8')) as T;
  } catch {
    throw new CandelaError({ code: 'run.no_record', file: path, message: 'this folder holds no readable run record', fix: 'point to a run folder written by `candela fit`' });
  }
}

/**
 * Reads run.json, chains.csv and the Hubble-diagram files of a run folder
 * (ensemble or nested-sampling run).
 * An ensemble run whose chains would take more than the memory budget
 * (RunReadOptions.chainMemoryMb) is read keeping every k-th step
 * (chains.stepStride = k; the walkers' acceptance is still counted over
 * every step): the summaries then say so, and no run length exhausts the
 * memory.
 * A blinded run (run.json `blinding.state: blinded`) is read as its outputs
 * show it: blinded chains from the chain record, no derived quantity, no
 * Hubble model curve (docs/blinding.md), so no command unblinds it silently.
 * @param dir the run folder.
 * @param options the memory budget of the chains.
 * @returns the record, the chains (with weights for nested runs) and the Hubble files (null when absent).
 * @throws CandelaError `run.no_record` without a readable run.json; the errors of readChainsFile (a damaged, short or
 *   disordered file); for a blinded run those of blindedChainTable (a missing or damaged key).
 * @example readRunFolder('out/pantheon/flat_lcdm').record.model.label // 'flat_lcdm'
 */
export function readRunFolder(dir: string, options: RunReadOptions = {}): RunOnDisk {
  const record = readRunRecord(dir);
  const stride = chainStepStride(record, chainMemoryOf(record, options));
  // A blinded run is shown blinded to every command (docs/blinding.md): chains from the chain record plus the offsets.
  const blinded = blindedParametersOf(record).length > 0;
  const chains = blinded ? blindedChainTable(dir, record, stride) : readRunChains(dir, record, stride);
  const hubble = readCsvColumns(join(dir, RUN_FILES.hubbleData));
  const model = blinded ? null : readCsvColumns(join(dir, RUN_FILES.hubbleModel));
  const hubbleModel = model ? Object.fromEntries(Object.entries(model).map(([name, values]) => [name, Float64Array.from(values, Number)])) : null;
  return { dir, record: blinded ? blindedRecordView(record) : record, chains, hubble: hubble ? { columns: hubble } : null, hubbleModel };
}

/**
 * The chains the summaries use: chains.csv when it holds every step (its
 * layout checked against run.json for ensemble runs), else every step from
 * the chain record; every `stride`-th step kept.
 */
function readRunChains(dir: string, record: StoredRunRecord, stride: number): ChainTable {
  const path = join(dir, RUN_FILES.chains);
  if (samplerMethodOf(record) !== 'ensemble') return readChainsFile(path);
  if (record.chains_csv && record.chains_csv.keep !== 'all') {
    if (!existsSync(join(dir, RUN_FILES.chainRecord))) {
      throw new CandelaError({
        code: 'run.no_chain_record', file: join(dir, RUN_FILES.chainRecord),
        message: `chains.csv of this run holds only every ${record.chains_csv.every_steps}th step after the burn-in; the summaries and diagnostics need every step, from chain-record.bin, which is missing`,
        fix: 'restore chain-record.bin from the run folder as `candela fit` wrote it',
      });
    }
    return chainRecordTable(dir, record, stride);
  }
  const { ensembles, walkers, steps } = record.run;
  return readChainsFile(path, { layout: { ensembles, walkers, steps }, stepStride: stride });
}
