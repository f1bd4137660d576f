import { CandelaError } from '../errors.js';
import type { SystematicModes } from '../data/index.js';

/**
 * The values of systematic modes U (N x K row major, mag) after checking
 * their shape and entries, shared by the conventional and hierarchical
 * supernova terms (private helper of the likelihood layer).
 * Cost O(N K), no copy.
 * @param systematicModes the modes, or undefined
 * @param n number of supernovae of the table (rows U must have)
 * @returns U's values, or null when there are no modes or K = 0
 * @throws CandelaError `likelihood.modes_mismatch` (rows or value count differ from N x K),
 *   `likelihood.low_rank_mode` (a non-finite entry, with its supernova row)
 * @example checkSystematicModes({ count: 2, modeCount: 1, values: Float64Array.of(0.01, 0.02), sourceFile: 'm.csv' }, 2) // the values
 */
export function checkSystematicModes(systematicModes: SystematicModes | undefined, n: number): Float64Array | null {
  if (!systematicModes || systematicModes.modeCount === 0) return null;
  const { values, modeCount, count, sourceFile } = systematicModes;
  if (count !== n || values.length !== n * modeCount) {
    throw new CandelaError({
      code: 'likelihood.modes_mismatch', file: sourceFile, path: 'systematicModes',
      message: `systematic modes do not match the ${n} supernovae of the table`, expected: `${n} rows x K modes`, found: `${count} rows, ${values.length} values for ${modeCount} modes`,
      fix: 'apply the same cuts to the table and the modes',
    });
  }
  for (let index = 0; index < values.length; index++) {
    if (!Number.isFinite(values[index])) {
      const row = Math.floor(index / modeCount);
      throw new CandelaError({
        code: 'likelihood.low_rank_mode', file: sourceFile, path: 'systematicModes', row: row + 1,
        message: `mode ${(index % modeCount) + 1} of supernova ${row + 1} is not a finite number`, expected: 'finite numbers (mag)', found: String(values[index]),
      });
    }
  }
  return values;
}
