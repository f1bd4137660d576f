import { weightedQuantiles } from './weightedQuantile.js';

/** Cumulative probabilities of the median and the 68.27% and 95.45% equal-tailed bands. */
export const CURVE_BAND_PROBABILITIES = [0.5, 0.158655, 0.841345, 0.02275, 0.97725] as const;

/**
 * Median and 68% / 95% equal-tailed band of curves sampled at the same
 * abscissae (posterior draws of a function of redshift, e.g. w(z) or a
 * distance modulus), each the type-2 sample quantile of weightedQuantiles
 * (Hyndman & Fan 1996, definition 2) of the curves' values there.
 * Non-finite values at an abscissa are left out there; an abscissa with none
 * left gets NaN.
 *
 * Cost: O(points x curves log curves).
 * @param curves one Float64Array per draw, each of length >= `points` (any units; the bands have the same).
 * @param points number of abscissae.
 * @returns median, low68, high68, low95, high95, each of length `points`.
 * @throws nothing.
 * @example curveBands([Float64Array.of(1, 2), Float64Array.of(3, 4)], 2).median // Float64Array [2, 3]
 */
export function curveBands(curves: readonly Float64Array[], points: number) {
  const bands = { median: new Float64Array(points), low68: new Float64Array(points), high68: new Float64Array(points), low95: new Float64Array(points), high95: new Float64Array(points) };
  for (let i = 0; i < points; i++) {
    const column = curves.map((curve) => curve[i]).filter(Number.isFinite);
    const [median, low68, high68, low95, high95] = column.length ? weightedQuantiles(column, CURVE_BAND_PROBABILITIES) : [NaN, NaN, NaN, NaN, NaN];
    bands.median[i] = median;
    bands.low68[i] = low68;
    bands.high68[i] = high68;
    bands.low95[i] = low95;
    bands.high95[i] = high95;
  }
  return bands;
}
