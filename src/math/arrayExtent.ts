/** Smallest and largest finite value of an array, by a loop (spreading a long array into Math.min overflows the call stack). */
export function arrayExtent(values: ArrayLike<number>): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (value < low) low = value;
    if (value > high) high = value;
  }
  return [low, high];
}
