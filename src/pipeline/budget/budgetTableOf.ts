import { quadratureDifference, type SystematicBudget } from '../../math/index.js';
import type { BudgetTable } from '../../output/index.js';

/**
 * The budget of the parameters shown, as the output layer's table: the
 * reweighted numbers, the linear response, the full fits when run (their
 * shift from the draws' mean, their contribution against the draws' sd),
 * and every Monte Carlo error multiplied by `inflation` (sqrt(draws / ESS)
 * for autocorrelated draws, 1 for independent ones).
 * Cost O(systematics x parameters).
 */
export function budgetTable(
  budget: SystematicBudget, shown: string[], full: Array<{ mean: number[]; sd: number[] } | null>,
  facts: { title: string; model: string; method: string; minEffective: number; inflation: number },
): BudgetTable {
  const at = shown.map((name) => budget.parameterNames.indexOf(name));
  const pick = <T>(values: readonly T[]): T[] => at.map((j) => values[j]);
  const errors = (values: readonly number[]): number[] => pick(values).map((value) => value * facts.inflation);
  return {
    title: facts.title, model: facts.model, method: facts.method, parameters: shown, drawCount: budget.drawCount, minEffectiveCount: facts.minEffective,
    allMean: pick(budget.allMean), allSd: pick(budget.allSd),
    statisticalSd: pick(budget.statistical.parameters.map((p) => p.sd)), statisticalEffectiveCount: budget.statistical.effectiveCount,
    statisticalReliable: budget.statistical.reliable, totalSystematic: pick(budget.totalSystematic.map((c) => c.reweighted)),
    rows: budget.systematics.map((entry, k) => ({
      name: entry.name, effectiveCountWithout: entry.without.effectiveCount, effectiveCountAlone: entry.alone.effectiveCount,
      reliable: entry.without.reliable && entry.alone.reliable,
      shift: pick(entry.without.parameters.map((p) => p.shift)), shiftMcError: errors(entry.without.parameters.map((p) => p.shiftMcError)),
      contribution: pick(entry.contribution.map((c) => c.reweighted)), contributionMcError: errors(entry.contribution.map((c) => c.mcError)),
      aloneContribution: pick(entry.aloneContribution.map((c) => c.reweighted)), aloneContributionMcError: errors(entry.aloneContribution.map((c) => c.mcError)),
      linearShift: pick(entry.without.parameters.map((p) => p.linearShift)), linearContribution: pick(entry.contribution.map((c) => c.linear)),
      fullShift: full[k] ? at.map((j) => full[k]!.mean[j] - budget.allMean[j]) : null,
      fullContribution: full[k] ? at.map((j) => quadratureDifference(budget.allSd[j], full[k]!.sd[j])) : null,
    })),
  };
}

