import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError } from '../../errors.js';
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

/**
 * Reads run.json, chains.csv and the Hubble-diagram files of a run folder
 * (ensemble or nested-sampling run).
 * @param dir the run folder.
 * A blinded run (run.json `blinding.state: blinded`) is read as its outputs
 * show it: blinded chains from the chain record, no derived quantity, no
 * Hubble model curve (docs/blinding.md), so no command unblinds it silently.
 * @returns the record, the chains (with weights for nested runs) and the Hubble files (null when absent).
 * @throws CandelaError `run.no_record` without a readable run.json; the errors of readChainsFile and checkChainLayout;
 *   for a blinded run those of blindedChainTable (a missing or damaged key).
 * @example readRunFolder('out/pantheon/flat_lcdm').record.model.label // 'flat_lcdm'
 */
export function readRunFolder(dir: string): RunOnDisk {
  let record: StoredRunRecord;
  try {
    record = JSON.parse(readFileSync(join(dir, RUN_FILES.run), 'utf8')) as StoredRunRecord;
  } catch {
    throw new CandelaError({ code: 'run.no_record', file: join(dir, RUN_FILES.run), message: 'this folder holds no readable run record', fix: 'point to a run folder written by `candela fit`' });
  }
  // A blinded run is shown blinded to every command (docs/blinding.md): chains from the chain record plus the offsets.
  const blinded = blindedParametersOf(record).length > 0;
  const chains = blinded ? blindedChainTable(dir, record) : readRunChains(dir, record);
  const hubble = readCsvColumns(join(dir, RUN_FILES.hubbleData));
  const model = blinded ? null : readCsvColumns(join(dir, RUN_FILES.hubbleModel));
  const hubbleModel = model ? Object.fromEntries(Object.entries(model).map(([name, values]) => [name, Float64Array.from(values, Number)])) : null;
  return { dir, record: blinded ? blindedRecordView(record) : record, chains, hubble: hubble ? { columns: hubble } : null, hubbleModel };
}

/**
 * The chains the summaries use: chains.csv when it holds every step (checked
 * against run.json for ensemble runs), else every step from the chain record.
 */
function readRunChains(dir: string, record: StoredRunRecord): ChainTable {
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
    return chainRecordTable(dir, record);
  }
  const chains = readChainsFile(path);
  checkChainLayout(path, chains, record);
  return chains;
}

/**
 * Checks that an ensemble run's chains are whole: exactly one row per
 * ensemble, step and walker that run.json counts (ensembles x steps x
 * walkers), in file order (ensemble, then step, then walker). A file cut at
 * a row boundary, or missing rows in the middle, is refused here instead of
 * being summarized as if it were the whole run.
 * Cost: O(rows).
 * @param path the chains file (for the message).
 * @param chains the chains as read.
 * @param record run.json of the same folder.
 * @throws CandelaError `run.bad_chains` naming the first row out of place, or the row counts.
 * @example checkChainLayout('out/run/chains.csv', chains, record) // no throw for a whole file
 */
export function checkChainLayout(path: string, chains: ChainTable, record: StoredRunRecord): void {
  const { ensembles, walkers, steps } = record.run;
  const expected = ensembles * walkers * steps;
  const fix = 'the file is incomplete or damaged; rerun `candela fit --resume` in its run folder to rewrite it';
  if (chains.rows !== expected) {
    throw new CandelaError({
      code: 'run.bad_chains', file: path, message: 'the chains file does not hold every stored step of the run',
      expected: `${expected} rows (${ensembles} ensembles x ${steps} steps x ${walkers} walkers, from run.json)`, found: `${chains.rows} rows`, fix,
    });
  }
  for (let r = 0; r < chains.rows; r++) {
    const walker = r % walkers;
    const step = Math.floor(r / walkers) % steps;
    const ensemble = Math.floor(r / (walkers * steps));
    if (chains.ensemble[r] !== ensemble || chains.step[r] !== step || chains.walker[r] !== walker) {
      throw new CandelaError({
        code: 'run.bad_chains', file: path, line: r + 2, message: 'a row is out of place in the chains file',
        expected: `ensemble ${ensemble}, step ${step}, walker ${walker}`, found: `ensemble ${chains.ensemble[r]}, step ${chains.step[r]}, walker ${chains.walker[r]}`, fix,
      });
    }
  }
}
