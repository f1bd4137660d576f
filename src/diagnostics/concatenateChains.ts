import { compensatedSum } from '../math/index.js';

/** Arithmetic mean with a compensated sum (Neumaier 1974). Cost O(n). */
export function meanOf(values: Float64Array): number {
  return compensatedSum(values) / values.length;
}

/**
 * Sample variance with the n - 1 denominator, two-pass (mean first, then the
 * compensated sum of squared deviations), as R's `var`. Cost O(n).
 */
export function sampleVarianceOf(values: Float64Array, mean = meanOf(values)): number {
  const squares = new Float64Array(values.length);
  for (let index = 0; index < values.length; index++) {
    const deviation = values[index] - mean;
    squares[index] = deviation * deviation;
  }
  return compensatedSum(squares) / (values.length - 1);
}

/** All draws of all chains in one array, chain after chain. */
export function concatenateChains(chains: readonly Float64Array[]): Float64Array {
  let total = 0;
  for (const chain of chains) total += chain.length;
  const pooled = new Float64Array(total);
  let offset = 0;
  for (const chain of chains) {
    pooled.set(chain, offset);
    offset += chain.length;
  }
  return pooled;
}
