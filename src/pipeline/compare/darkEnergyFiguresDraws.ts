import { weightedQuantiles } from '../../math/index.js';
import type { AnalyzedRun } from './compareInputs.js';
import { resampleRowsByWeight } from '../../math/index.js';

/**
 * Equally weighted posterior draws of a run, as row indices of its chains:
 * for ensemble runs `count` rows evenly spaced through the kept rows (all of
 * them when there are fewer), for nested runs a systematic resample of the
 * weighted rows (see resampleRowsByWeight). Deterministic for a seed.
 *
 * Cost: O(kept rows + count).
 * @param analyzed the run and its analysis.
 * @param count draws wanted (an integer >= 1).
 * @param seed seed of the resampling (nested runs).
 * @returns row indices into the run's chains.
 * @throws CandelaError from resampleRowsByWeight for unusable weights.
 * @example equalWeightRows(analyzed, 400, 'figures').length // 400
 */
export function equalWeightRows(analyzed: AnalyzedRun, count: number, seed: string): Int32Array {
  const kept = analyzed.analysis.keptRows;
  const weights = analyzed.analysis.keptWeights;
  if (weights) return Int32Array.from(resampleRowsByWeight(weights, count, seed), (k) => kept[k]);
  const picks = Math.min(count, kept.length);
  return Int32Array.from({ length: picks }, (_, k) => kept[Math.floor(((k + 0.5) * kept.length) / picks)]);
}

/** Cumulative probabilities of the median and the 68.27% and 95.45% equal-tailed bands. */
export const BAND_PROBABILITIES = [0.5, 0.158655, 0.841345, 0.02275, 0.97725] as const;

/**
 * Median and 68% / 95% band of curves sampled at the same abscissae
 * (posterior draws of a function of redshift). Non-finite values at an
 * abscissa are left out there; an abscissa with none left gets NaN.
 *
 * Cost: O(points x curves log curves).
 * @param curves one Float64Array per draw, all of the same length.
 * @param points number of abscissae.
 * @returns median, low68, high68, low95, high95, each of length `points`.
 * @throws nothing.
 * @example curveBands([Float64Array.of(1, 2), Float64Array.of(3, 4)], 2).median // Float64Array [2, 3]
 */
export function curveBands(curves: readonly Float64Array[], points: number) {
  const bands = { median: new Float64Array(points), low68: new Float64Array(points), high68: new Float64Array(points), low95: new Float64Array(points), high95: new Float64Array(points) };
  for (let i = 0; i < points; i++) {
    const column = curves.map((curve) => curve[i]).filter(Number.isFinite);
    const [median, low68, high68, low95, high95] = column.length ? weightedQuantiles(column, BAND_PROBABILITIES) : [NaN, NaN, NaN, NaN, NaN];
    bands.median[i] = median;
    bands.low68[i] = low68;
    bands.high68[i] = high68;
    bands.low95[i] = low95;
    bands.high95[i] = high95;
  }
  return bands;
}
