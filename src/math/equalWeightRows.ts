import { resampleRowsByWeight } from './nestedResampleRows.js';

/**
 * Equally weighted posterior draws as row indices of a chain: with no
 * weights (ensemble runs) `count` rows evenly spaced through the kept rows
 * (the middle of each of `count` equal shares; all of them when there are
 * fewer), with weights (nested runs) a systematic resample of the weighted
 * rows (resampleRowsByWeight). Deterministic for a seed.
 *
 * Cost: O(kept rows + count).
 * @param keptRows the chain rows to draw from.
 * @param keptWeights posterior weight of each kept row, or null for equal weights.
 * @param count draws wanted (an integer >= 1).
 * @param seed seed of the resampling (weighted rows only).
 * @returns row indices into the chain (entries of keptRows).
 * @throws CandelaError from resampleRowsByWeight for unusable weights or a bad count.
 * @example equalWeightRows(Int32Array.of(10, 11, 12, 13), null, 2, 'figures') // Int32Array [11, 13]
 */
export function equalWeightRows(keptRows: Int32Array, keptWeights: Float64Array | null, count: number, seed: string): Int32Array {
  if (keptWeights) return Int32Array.from(resampleRowsByWeight(keptWeights, count, seed), (k) => keptRows[k]);
  const picks = Math.min(count, keptRows.length);
  return Int32Array.from({ length: picks }, (_, k) => keptRows[Math.floor(((k + 0.5) * keptRows.length) / picks)]);
}
