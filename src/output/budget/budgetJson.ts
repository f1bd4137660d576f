import type { BudgetTable } from './budgetTable.js';

/** JSON numbers: finite values as they are, everything else null (no NaN in files). */
function finite(value: number | null): number | null {
  return value !== null && Number.isFinite(value) ? value : null;
}

/**
 * The systematic budget as JSON (the content of `budget.json`), snake_case
 * keys, every number at full precision, per systematic and per parameter:
 * shift_when_removed with shift_mc_error, contribution_removed and
 * contribution_alone with their *_mc_error, the linear-response linear_shift and
 * linear_contribution, and full_fit_shift / full_fit_contribution when
 * full fits were run (null otherwise). Non-finite numbers are null.
 *
 * Cost O(systematics x parameters).
 * @param table the budget.
 * @returns pretty-printed JSON text ending in a newline.
 * @example JSON.parse(budgetJson(table)).systematics[0].name // 'calibration'
 */
export function budgetJson(table: BudgetTable): string {
  const perParameter = <T>(make: (j: number) => T): Record<string, T> => Object.fromEntries(table.parameters.map((name, j) => [name, make(j)]));
  const document = {
    title: table.title,
    model: table.model,
    method: table.method,
    draws: table.drawCount,
    min_effective_draws: table.minEffectiveCount,
    parameters: perParameter((j) => ({
      mean: finite(table.allMean[j]), sd: finite(table.allSd[j]), statistical_sd: finite(table.statisticalSd[j]),
      systematic_sd: finite(table.totalSystematic[j]),
    })),
    statistical: { effective_draws: table.statisticalEffectiveCount, reliable: table.statisticalReliable },
    systematics: table.rows.map((row) => ({
      name: row.name,
      effective_draws_removed: row.effectiveCountWithout,
      effective_draws_alone: row.effectiveCountAlone,
      reliable: row.reliable,
      parameters: perParameter((j) => ({
        shift_when_removed: finite(row.shift[j]),
        shift_mc_error: finite(row.shiftMcError[j]),
        contribution_removed: finite(row.contribution[j]),
        contribution_removed_mc_error: finite(row.contributionMcError[j]),
        contribution_alone: finite(row.aloneContribution[j]),
        contribution_alone_mc_error: finite(row.aloneContributionMcError[j]),
        linear_shift: finite(row.linearShift[j]),
        linear_contribution: finite(row.linearContribution[j]),
        full_fit_shift: row.fullShift ? finite(row.fullShift[j]) : null,
        full_fit_contribution: row.fullContribution ? finite(row.fullContribution[j]) : null,
      })),
    })),
  };
  return JSON.stringify(document, null, 2) + '\n';
}
