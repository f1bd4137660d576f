/**
 * Linear interpolation in ln(x) of values tabulated on a log-spaced grid
 * (the grid of {@link logSpacedGrid}: x_i = min (max / min)^(i / (n - 1))).
 * The position of x on the grid is found in closed form,
 * p = ln(x / min) / ln(max / min) (n - 1), with no search; between nodes i
 * and i + 1 the result is v_i + (p - i)(v_{i+1} - v_i). Points outside
 * [min, max] take the end values (constant extrapolation). A quantity linear
 * in ln x, as a distance modulus is at low redshift (5 log10(cz/H0) + 25,
 * the Hubble law; common practice), is reproduced exactly.
 *
 * Cost: O(1) per point, O(points) in all.
 * @param values the tabulated values at the grid's n >= 2 points (any units; the result has the same).
 * @param min first grid point (> 0, the units of `at`).
 * @param max last grid point (> min).
 * @param at the points to interpolate at (> 0 to be inside; anything <= min takes the first value).
 * @returns the interpolated value at each point.
 * @throws nothing (a NaN point gives NaN; fewer than 2 values give NaN).
 * @example interpolateLogSpaced(Float64Array.of(0, 1, 2), 1, 100, Float64Array.of(10, 1000)) // => Float64Array [1, 2]
 */
export function interpolateLogSpaced(values: ArrayLike<number>, min: number, max: number, at: ArrayLike<number>): Float64Array {
  const intervals = values.length - 1;
  const logSpan = Math.log(max / min);
  const result = new Float64Array(at.length);
  for (let k = 0; k < at.length; k++) {
    const position = Math.log(Math.max(at[k], min) / min) / logSpan * intervals;
    const low = Math.max(0, Math.min(intervals - 1, Math.floor(position)));
    const fraction = Math.min(1, Math.max(0, position - low));
    result[k] = values[low] + fraction * (values[low + 1] - values[low]);
  }
  return result;
}
