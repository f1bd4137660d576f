/**
 * Smallest and largest sample with positive weight (private to math/density):
 * the default grid range of a kernel estimate. Cost O(n).
 */
export function sampleExtent(values: ArrayLike<number>, weights?: ArrayLike<number>): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (weights && weights[i] === 0) continue;
    if (values[i] < low) low = values[i];
    if (values[i] > high) high = values[i];
  }
  return [low, high];
}
