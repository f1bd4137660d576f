import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { CandelaError } from '../../errors.js';
import { blindColumns, blindingRunIdentity, chainHeader, unsealBlindingKey, type ChainTable } from '../../output/index.js';
import { chainRecordTable } from '../run/chainRecordTable.js';
import type { StoredRunRecord } from '../run/runFiles.js';
import { blindedParametersOf, type BlindableRecord } from './runBlinding.js';

/**
 * The chains every command reads from a blinded run folder: every step from
 * the chain record (true values, chain-record.bin), each blinded parameter
 * plus its secret offset, derived quantities left out. Read from the record
 * rather than chains.csv, so that whatever state chains.csv is in (an
 * unblinding stopped half way), a run whose record says `blinded` is shown
 * blinded: nothing unblinds silently.
 * Cost: O(steps x walkers x ensembles x columns) and one key read.
 * @param dir the run folder.
 * @param record its run.json (state blinded).
 * @param stepStride keep every stepStride-th step (readRunFolder's memory budget; default 1).
 * @returns the shown chains, in the layout of readChainsFile.
 * @throws CandelaError `run.bad_checkpoint` (chainRecordTable), `blinding.missing_key`, `blinding.damaged_key` or `blinding.foreign_key` (unsealBlindingKey).
 * @example blindedChainTable('out/demo-blinded', record).columns.w0[0]
 */
export function blindedChainTable(dir: string, record: StoredRunRecord & BlindableRecord, stepStride = 1): ChainTable {
  const parameters = blindedParametersOf(record);
  const keyPath = join(dir, record.blinding!.key_file);
  let text: string;
  try {
    text = readFileSync(keyPath, 'utf8');
  } catch {
    throw new CandelaError({
      code: 'blinding.missing_key', file: keyPath, message: 'this run is blinded and its sealed key is missing: its outputs cannot be built',
      fix: 'restore blinding.key from a backup of the run folder; without it the run can be neither shown nor unblinded (refit to see it)',
    });
  }
  const key = unsealBlindingKey(text, keyPath, blindingRunIdentity(record.run.seed, record.model.label, parameters));
  const table = chainRecordTable(dir, record, stepStride);
  const sampled = record.parameters.sampled.map((entry) => entry.name);
  const kept = [...sampled, 'log_prior', 'log_likelihood', 'log_posterior'];
  const columns = blindColumns(Object.fromEntries(kept.map((name) => [name, table.columns[name]])), key.offsets);
  return { ...table, header: chainHeader({ parameters: sampled, derived: [] }), columns };
}

/**
 * The run record every output of a blinded run is built from: no derived
 * quantity (their columns are not in the blinded chains). The priors stay
 * (they are the configuration's); priorBounds ignores them for blinded
 * parameters, since an edge drawn or reported at the shown values would give
 * the offset away.
 * Cost: O(parameters).
 * @param record run.json of a blinded run.
 * @returns a copy for the outputs.
 * @throws nothing.
 * @example blindedRecordView(record).parameters.derived // []
 */
export function blindedRecordView<T extends StoredRunRecord & BlindableRecord>(record: T): T {
  return { ...record, parameters: { ...record.parameters, derived: [] } };
}
