import { CandelaError } from '../../errors.js';

/**
 * Density levels whose superlevel sets hold given probability masses on a
 * regular grid: the grid values are sorted from high to low and summed until
 * the running sum reaches mass x total; the level is interpolated linearly
 * between the two grid values around that point (so it moves smoothly with
 * the mass). Every grid point weighs the same (midpoint rule on equal cells),
 * and the total is the mass on the grid. This is the usual way to draw
 * "68% / 95%" regions of a smoothed posterior (common practice).
 *
 * Cost: O(N log N) for N grid values (one sort), O(N) memory.
 * @param density grid values (any positive density unit), e.g. DensityGrid2D.density.
 * @param masses probabilities in (0, 1), e.g. [0.6827, 0.9545].
 * @returns one level per mass, same order, in the unit of the density.
 * @throws CandelaError `output.bad_probability` for a mass outside (0, 1),
 *   `output.empty_density` when the grid holds no positive value.
 * @example credibleThresholds(Float64Array.of(4, 3, 2, 1), [0.7]) // [3] (4 + 3 = 7 of 10)
 */
export function credibleThresholds(density: ArrayLike<number>, masses: readonly number[]): number[] {
  const sorted = Float64Array.from(density).sort().reverse();
  const cumulative = new Float64Array(sorted.length);
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < sorted.length; i++) {
    const value = sorted[i] > 0 ? sorted[i] : 0;
    const next = sum + value;
    compensation += Math.abs(sum) >= value ? sum - next + value : value - next + sum;
    sum = next;
    cumulative[i] = sum + compensation;
  }
  const total = sorted.length ? cumulative[sorted.length - 1] : 0;
  if (!(total > 0)) {
    throw new CandelaError({ code: 'output.empty_density', message: 'the density grid holds no positive value', fix: 'widen the grid range so that it covers the samples' });
  }
  return masses.map((mass) => {
    if (!(mass > 0 && mass < 1)) {
      throw new CandelaError({ code: 'output.bad_probability', message: 'a credible level needs a mass between 0 and 1', expected: '0 < mass < 1', found: String(mass) });
    }
    const target = mass * total;
    let low = 0;
    let high = sorted.length - 1;
    while (low < high) {
      const middle = (low + high) >>> 1;
      if (cumulative[middle] >= target) high = middle;
      else low = middle + 1;
    }
    if (low === 0) return sorted[0];
    const before = cumulative[low - 1];
    const fraction = (target - before) / (cumulative[low] - before);
    return sorted[low - 1] + fraction * (sorted[low] - sorted[low - 1]);
  });
}
