/** A series reduced for drawing: the kept positions (0-based indices into the original) and their values. */
export interface DecimatedSeries {
  /** Positions kept, as 0-based indices into the original series, increasing. */
  index: Float64Array;
  /** The values at those positions. */
  value: Float64Array;
}

/**
 * Shortens a long series for drawing by keeping, in each of maxPoints / 2
 * equal buckets, its smallest and its largest value (in their original
 * order). The drawn envelope then matches the full trace, which plain
 * thinning would not (it misses the excursions that reveal a stuck walker).
 * Non-finite values are dropped. Series of at most maxPoints values are
 * returned whole.
 *
 * Cost: O(n).
 *
 * @param values the series
 * @param maxPoints largest number of points to keep (>= 2)
 * @returns kept indices and values
 * @example decimateMinMax(Float64Array.of(0, 5, 1, 2, -3, 4), 4) // index [0, 1, 4, 5], value [0, 5, -3, 4]
 */
export function decimateMinMax(values: ArrayLike<number>, maxPoints: number): DecimatedSeries {
  const length = values.length;
  const keptIndex: number[] = [];
  if (length <= maxPoints) {
    for (let position = 0; position < length; position++) if (Number.isFinite(values[position])) keptIndex.push(position);
  } else {
    const buckets = Math.max(1, Math.floor(maxPoints / 2));
    for (let bucket = 0; bucket < buckets; bucket++) {
      const start = Math.floor((bucket * length) / buckets);
      const end = Math.floor(((bucket + 1) * length) / buckets);
      let lowest = -1;
      let highest = -1;
      for (let position = start; position < end; position++) {
        const value = values[position];
        if (!Number.isFinite(value)) continue;
        if (lowest < 0 || value < values[lowest]) lowest = position;
        if (highest < 0 || value > values[highest]) highest = position;
      }
      if (lowest < 0) continue;
      if (lowest === highest) keptIndex.push(lowest);
      else keptIndex.push(Math.min(lowest, highest), Math.max(lowest, highest));
    }
  }
  return { index: Float64Array.from(keptIndex), value: Float64Array.from(keptIndex, (position) => values[position]) };
}
