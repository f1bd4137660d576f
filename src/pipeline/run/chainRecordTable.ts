import { chainHeader, type ChainTable } from '../../output/index.js';
import { visitChainRecord } from '../../output/index.js';
import type { RunRecord } from './runRecord.js';
import { BLOB_FIRST_DERIVED, BLOB_LOG_LIKELIHOOD, BLOB_LOG_PRIOR } from './buildModel.js';

/** A value as chains.csv gives it back: +Infinity and NaN are empty cells there (read as NaN), -Infinity stays. */
const asInCsv = (value: number): number => (Number.isFinite(value) || value === -Infinity ? value : Number.NaN);

/**
 * The steps of an ensemble run read from its chain record
 * (chain-record.bin, see checkpointFile.ts), as the rows and columns that
 * chains.csv holds when it keeps every step: same names, same order
 * (ensemble, then step, then walker), the burn-in flagged from run.json,
 * the same numbers bit for bit. The summaries read this when chains.csv
 * holds only the thinned steps after the burn-in.
 *
 * With `stepStride` k > 1 only every k-th step (0, k, 2k, ...) is kept, so
 * that a run of any length fits a memory budget (readRunFolder); the
 * acceptance of each walker is still counted over every step
 * (`walkerAcceptance`), as the record streams by.
 * Cost: O(steps x walkers x ensembles x columns) time; memory O(steps / k x walkers x ensembles x columns), one block of the record at a time.
 * @param dir the run folder.
 * @param record run.json of the folder (steps, walkers, ensembles, burn-in, parameter names).
 * @param stepStride keep every stepStride-th step (default 1: every step).
 * @returns the chains in the layout of readChainsFile (with stepStride and walkerAcceptance set).
 * @throws CandelaError `run.bad_checkpoint` when the record is missing, of another shape, or shorter than the run.
 * @example chainRecordTable('out/run', record).columns.omega_m.length // ensembles x steps x walkers
 */
export function chainRecordTable(dir: string, record: RunRecord, stepStride = 1): ChainTable {
  const { steps, walkers, ensembles, burn_in_steps: burnInSteps } = record.run;
  const parameters = record.parameters.sampled.map((entry) => entry.name);
  const derived = record.parameters.derived;
  const dimension = parameters.length;
  const blobCount = BLOB_FIRST_DERIVED + derived.length;
  const keptSteps = Math.ceil(steps / stepStride);
  const rows = ensembles * keptSteps * walkers;
  const columns: Record<string, Float64Array> = {};
  for (const name of [...parameters, ...derived, 'log_prior', 'log_likelihood', 'log_posterior']) columns[name] = new Float64Array(rows);
  const moves = new Float64Array(ensembles * walkers);
  const previous = new Float64Array(ensembles * walkers);
  const table: ChainTable = {
    header: chainHeader({ parameters, derived }),
    ensemble: new Int32Array(rows), walker: new Int32Array(rows), step: new Int32Array(rows), burnIn: new Uint8Array(rows), columns, weights: null, rows,
    stepStride, walkerAcceptance: moves,
  };
  const parameterColumns = parameters.map((name) => columns[name]);
  const derivedColumns = derived.map((name) => columns[name]);
  visitChainRecord(dir, { ensembles, walkers, dimension, blobCount }, steps, (step, ensemble, positions, logProb, blobs) => {
    for (let walker = 0; walker < walkers; walker++) {
      const slot = ensemble * walkers + walker;
      if (step > 0 && logProb[walker] !== previous[slot]) moves[slot] += 1;
      previous[slot] = logProb[walker];
    }
    if (step % stepStride !== 0) return;
    for (let walker = 0; walker < walkers; walker++) {
      const row = (ensemble * keptSteps + step / stepStride) * walkers + walker;
      table.ensemble[row] = ensemble;
      table.walker[row] = walker;
      table.step[row] = step;
      table.burnIn[row] = step < burnInSteps ? 1 : 0;
      for (let d = 0; d < dimension; d++) parameterColumns[d][row] = asInCsv(positions[walker * dimension + d]);
      const base = walker * blobCount;
      for (let k = 0; k < derived.length; k++) derivedColumns[k][row] = asInCsv(blobs[base + BLOB_FIRST_DERIVED + k]);
      columns.log_prior[row] = asInCsv(blobs[base + BLOB_LOG_PRIOR]);
      columns.log_likelihood[row] = asInCsv(blobs[base + BLOB_LOG_LIKELIHOOD]);
      columns.log_posterior[row] = asInCsv(logProb[walker]);
    }
  });
  for (let slot = 0; slot < moves.length; slot++) moves[slot] = steps > 1 ? moves[slot] / (steps - 1) : 0;
  return table;
}
