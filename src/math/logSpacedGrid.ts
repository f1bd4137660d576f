/**
 * Points spaced evenly in log(x) from `min` to `max` inclusive:
 * x_i = min (max / min)^(i / (points - 1)), i = 0 .. points - 1.
 *
 * Cost: O(points).
 * @param min first point (> 0, any units; the grid has the same).
 * @param max last point (> 0).
 * @param points number of points (an integer >= 2).
 * @returns the grid.
 * @throws nothing (a min or max <= 0 gives NaN or zeros: callers check their range).
 * @example logSpacedGrid(1, 100, 3) // => Float64Array [1, 10, 100]
 */
export function logSpacedGrid(min: number, max: number, points: number): Float64Array {
  return Float64Array.from({ length: points }, (_, i) => min * (max / min) ** (i / (points - 1)));
}
