import { quantileOfSortedDraws } from '../math/index.js';
import { concatenateChains } from './concatenateChains.js';

/**
 * Folds draws about their pooled median, |x - median| (Vehtari et al. 2021,
 * sec. 4.2), so that R-hat of the folded draws detects chains that differ in
 * scale or tails while agreeing in location. The median is of all draws of all
 * chains (the mean of the two middle values for an even count).
 *
 * Cost: one sort of a copy, O(S log S).
 * @param chains chains of draws (any units; the result keeps them).
 * @returns new chains of folded draws.
 * @example foldAboutMedian([Float64Array.of(1, 5), Float64Array.of(2, 4)]) // median 3 -> [[2, 2], [1, 1]]
 */
export function foldAboutMedian(chains: readonly Float64Array[]): Float64Array[] {
  const median = quantileOfSortedDraws(concatenateChains(chains).sort(), 0.5);
  return chains.map((chain) => chain.map((value) => Math.abs(value - median)));
}
