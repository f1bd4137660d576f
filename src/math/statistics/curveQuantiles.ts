import { quantileOfSortedDraws } from './quantileOfDraws.js';

/**
 * Pointwise type-7 quantiles (Hyndman & Fan 1996, definition 7; see
 * quantileOfSortedDraws) of curves sampled at the same abscissae, e.g.
 * posterior draws of a distance-modulus curve: at each abscissa the values of
 * all curves are sorted and each probability read off. A NaN sorts last (as
 * in Float64Array.prototype.sort), so it can reach only the upper quantiles;
 * no curves give NaN everywhere.
 *
 * Cost: O(points x curves log curves).
 * @param curves one Float64Array per draw, each of length >= `points` (any units; quantiles have the same).
 * @param points number of abscissae.
 * @param probabilities cumulative probabilities in [0, 1].
 * @returns one Float64Array of length `points` per probability, in the order given.
 * @throws nothing.
 * @example curveQuantiles([Float64Array.of(1, 10), Float64Array.of(3, 30)], 2, [0.5])[0] // => Float64Array [2, 20]
 */
export function curveQuantiles(curves: readonly Float64Array[], points: number, probabilities: readonly number[]): Float64Array[] {
  const out = probabilities.map(() => new Float64Array(points));
  const column = new Float64Array(curves.length);
  for (let i = 0; i < points; i++) {
    curves.forEach((curve, k) => { column[k] = curve[i]; });
    column.sort();
    probabilities.forEach((p, j) => { out[j][i] = quantileOfSortedDraws(column, p); });
  }
  return out;
}
