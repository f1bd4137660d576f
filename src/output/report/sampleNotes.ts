/**
 * The sentence under the report's parameter table, or undefined when there
 * is nothing to say: for nested-sampling runs that the samples are weighted,
 * with their Kish effective sample size (Kish 1965, n_eff = (sum w)^2 /
 * sum w^2) rounded to a whole number; when a marginal is cut by a hard prior
 * edge, that it is quoted as a one-sided 95% limit.
 *
 * Cost: O(1).
 * @param facts the Kish effective sample size of a nested run's weights (null for an ensemble run) and whether any parameter is quoted as a one-sided limit.
 * @returns the sentences joined by a space, or undefined.
 * @throws nothing.
 * @example summaryTableNote({ kishEffectiveSampleSize: 774.4, oneSidedLimits: false }) // 'Weighted nested-sampling samples (Kish effective sample size 774).'
 */
export function summaryTableNote(facts: { kishEffectiveSampleSize: number | null; oneSidedLimits: boolean }): string | undefined {
  const sentences = [
    ...(facts.kishEffectiveSampleSize !== null ? [`Weighted nested-sampling samples (Kish effective sample size ${facts.kishEffectiveSampleSize.toFixed(0)}).`] : []),
    ...(facts.oneSidedLimits ? ['A marginal cut by a hard prior edge is quoted as a one-sided 95% limit instead of mean ± sd (see the warnings).'] : []),
  ];
  return sentences.length ? sentences.join(' ') : undefined;
}

/**
 * The sentence the report's convergence section shows instead of its
 * Markov-chain checks for a nested-sampling run: the samples are independent
 * and weighted, so R-hat and autocorrelation times do not apply; the Kish
 * effective sample size of the weights (rounded) stands instead.
 *
 * Cost: O(1).
 * @param kishEffectiveSampleSize Kish effective sample size of the weights, draws.
 * @returns the sentence.
 * @throws nothing.
 * @example nestedChainChecksNote(774.4) // 'Nested sampling draws independent weighted samples: ... Kish effective sample size of the weights: 774.'
 */
export function nestedChainChecksNote(kishEffectiveSampleSize: number): string {
  return `Nested sampling draws independent weighted samples: R-hat and autocorrelation times do not apply. Kish effective sample size of the weights: ${kishEffectiveSampleSize.toFixed(0)}.`;
}
