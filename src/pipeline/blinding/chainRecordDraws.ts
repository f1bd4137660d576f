import { visitChainRecord, type EnsembleDraws } from '../../output/index.js';
import { BLOB_FIRST_DERIVED } from '../run/buildModel.js';
import type { RunRecord } from '../run/runRecord.js';

/**
 * Every stored step of an ensemble run, per ensemble, as the sampler held
 * them (true values), read from the run folder's chain record
 * (chain-record.bin): what the fit wrote its chains and Hubble files from.
 * Cost: O(steps x walkers x ensembles x (dimension + blobs)) time and memory.
 * @param dir the run folder.
 * @param record its run.json (steps, walkers, ensembles, parameter and derived names).
 * @returns one EnsembleDraws per ensemble.
 * @throws CandelaError `run.bad_checkpoint` when the record is missing, of another shape or shorter than the run.
 * @example chainRecordDraws('out/run', record)[0].steps // record.run.steps
 */
export function chainRecordDraws(dir: string, record: RunRecord): EnsembleDraws[] {
  const { steps, walkers, ensembles } = record.run;
  const dimension = record.parameters.sampled.length;
  const blobCount = BLOB_FIRST_DERIVED + record.parameters.derived.length;
  const draws: EnsembleDraws[] = Array.from({ length: ensembles }, () => ({
    steps, walkers, dimension, blobCount,
    positions: new Float64Array(steps * walkers * dimension), logProb: new Float64Array(steps * walkers), blobs: new Float64Array(steps * walkers * blobCount),
  }));
  visitChainRecord(dir, { ensembles, walkers, dimension, blobCount }, steps, (step, ensemble, positions, logProb, blobs) => {
    draws[ensemble].positions.set(positions, step * walkers * dimension);
    draws[ensemble].logProb.set(logProb, step * walkers);
    draws[ensemble].blobs.set(blobs, step * walkers * blobCount);
  });
  return draws;
}

/**
 * The stored draw with the highest log posterior after the burn-in, found
 * in the order the fit searches (ensemble, then step, then walker; the first
 * of equal values), so its values are the fit's best fit bit for bit.
 * Cost: O(stored draws).
 * @param ensembles the draws.
 * @param burnInSteps steps of burn-in.
 * @returns the best draw's parameter values, in theta order.
 * @throws nothing.
 * @example bestDraw(chainRecordDraws(dir, record), record.run.burn_in_steps)
 */
export function bestDraw(ensembles: readonly EnsembleDraws[], burnInSteps: number): Float64Array {
  let best = -Infinity;
  let theta = new Float64Array(ensembles[0]?.dimension ?? 0);
  for (const draws of ensembles) {
    for (let row = burnInSteps * draws.walkers; row < draws.steps * draws.walkers; row++) {
      if (draws.logProb[row] > best) {
        best = draws.logProb[row];
        theta = draws.positions.slice(row * draws.dimension, (row + 1) * draws.dimension);
      }
    }
  }
  return theta;
}
