/** Bits per radix digit: four passes over the 64-bit keys, with 65536 counters each. */
const RADIX_BITS = 16;
const RADIX_SIZE = 1 << RADIX_BITS;
const DIGIT_MASK = RADIX_SIZE - 1;
/** Word order of a Float64 in memory on this machine (index of the high 32-bit word). */
const HIGH_WORD = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1 ? 1 : 0;

/**
 * The permutation that sorts `values` ascending: values[order[0]] <= values[order[1]] <= ...
 * Equal values keep their original order (stable).
 *
 * Method: least-significant-digit radix sort (Knuth, The Art of Computer
 * Programming vol. 3, sec. 5.2.5) on an order-preserving 64-bit key of each
 * double: the sign bit is flipped for non-negative numbers and all bits for
 * negative ones, so that unsigned comparison of the keys orders the numbers
 * (-0 sorts just before +0). Digits on which all keys agree are skipped.
 * Written because a comparator sort of indices is several times slower for the
 * millions of draws a long ensemble run produces.
 *
 * Cost: O(n) time in at most 4 passes, 5 arrays of n 32-bit words.
 * @param values finite numbers (NaN is not ordered).
 * @example ascendingOrder(Float64Array.of(0.5, -2, 3, -2)) // => Uint32Array [1, 3, 0, 2]
 */
export function ascendingOrder(values: Float64Array): Uint32Array {
  const count = values.length;
  const words = new Uint32Array(Float64Array.from(values).buffer);
  let high = new Uint32Array(count);
  let low = new Uint32Array(count);
  let order = new Uint32Array(count);
  for (let index = 0; index < count; index++) {
    const highWord = words[2 * index + HIGH_WORD];
    const lowWord = words[2 * index + 1 - HIGH_WORD];
    const negative = highWord >>> 31 === 1;
    high[index] = negative ? ~highWord >>> 0 : (highWord ^ 0x80000000) >>> 0;
    low[index] = negative ? ~lowWord >>> 0 : lowWord;
    order[index] = index;
  }
  let nextHigh = new Uint32Array(count);
  let nextLow = new Uint32Array(count);
  let nextOrder = new Uint32Array(count);
  const counts = new Uint32Array(RADIX_SIZE);
  for (let pass = 0; pass < 4; pass++) {
    const source = pass < 2 ? low : high;
    const shift = (pass % 2) * RADIX_BITS;
    counts.fill(0);
    for (let index = 0; index < count; index++) counts[(source[index] >>> shift) & DIGIT_MASK]++;
    if (count === 0 || counts[(source[0] >>> shift) & DIGIT_MASK] === count) continue;
    let start = 0;
    for (let digit = 0; digit < RADIX_SIZE; digit++) {
      const size = counts[digit];
      counts[digit] = start;
      start += size;
    }
    for (let index = 0; index < count; index++) {
      const target = counts[(source[index] >>> shift) & DIGIT_MASK]++;
      nextHigh[target] = high[index];
      nextLow[target] = low[index];
      nextOrder[target] = order[index];
    }
    [high, nextHigh] = [nextHigh, high];
    [low, nextLow] = [nextLow, low];
    [order, nextOrder] = [nextOrder, order];
  }
  return order;
}
