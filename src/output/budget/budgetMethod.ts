/** What the method sentence of a systematic budget says. */
export interface BudgetMethodFacts {
  /** Draws of the run that were reweighted. */
  draws: number;
  /** Kish count below which a variant is flagged. */
  minEffectiveDraws: number;
  /** How the Monte Carlo errors were scaled: by sqrt(draws / ESS) with the run's smallest bulk ESS, or null for independent draws. */
  inflation: { factor: number; smallestBulkEss: number } | null;
  /** Whether full fits of each stat + all-but-one variant were made too. */
  fullFits: boolean;
}

/**
 * The sentence saying how a systematic budget was computed (shown under its
 * tables and in budget.json): importance reweighting of the run's draws by
 * L_variant / L_all, Monte Carlo errors by the delta method (times the ESS
 * inflation when the draws outnumber the run's smallest bulk ESS, factor to
 * 2 decimals, ESS rounded), the Kish-count flag, the Gaussian linear-response
 * cross-check and, when made, the full fits.
 *
 * Cost: O(1).
 * @param facts draws, flag threshold, inflation and full fits.
 * @returns one sentence (no final full stop).
 * @throws nothing.
 * @example budgetMethod({ draws: 4000, minEffectiveDraws: 400, inflation: null, fullFits: false })
 *   // 'importance reweighting of 4000 draws of this run (stat + every systematic) by L_variant / L_all, ...'
 */
export function budgetMethod(facts: BudgetMethodFacts): string {
  const errorBasis = facts.inflation === null
    ? 'for independent draws'
    : `for independent draws, times sqrt(draws / bulk ESS) = ${facts.inflation.factor.toFixed(2)} (smallest bulk ESS of the run ${Math.round(facts.inflation.smallestBulkEss)})`;
  return `importance reweighting of ${facts.draws} draws of this run (stat + every systematic) by L_variant / L_all, ` +
    `Monte Carlo errors by the delta method ${errorBasis}, a variant flagged when its weights are worth fewer than ${facts.minEffectiveDraws} draws (Kish count); ` +
    'cross-check: the Gaussian linear response of the same draws (mean and covariance, and a quadratic fit of ln L_variant - ln L_all)' +
    (facts.fullFits ? '; full fits of each stat + all-but-one variant for comparison' : '');
}
