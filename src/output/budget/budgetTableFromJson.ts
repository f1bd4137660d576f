import type { BudgetTable, BudgetTableRow } from './budgetTable.js';

type Json = Record<string, unknown>;

/** A number of the JSON, or NaN for null or anything else. */
function numberOf(value: unknown): number {
  return typeof value === 'number' ? value : Number.NaN;
}

/**
 * Reads the text of budget.json (budgetJson) back into a BudgetTable, so
 * that a report can show a budget written earlier. Nulls become NaN (shown
 * as n/a) or null where the table allows it.
 *
 * Cost: O(size of the text).
 * @param text the file's text.
 * @returns the table, or null when the text is not a budget of this format.
 * @example budgetTableFromJson(budgetJson(table))?.rows.length // table.rows.length
 */
export function budgetTableFromJson(text: string): BudgetTable | null {
  let document: Json;
  try {
    document = JSON.parse(text) as Json;
  } catch {
    return null;
  }
  const parameters = document.parameters as Record<string, Json> | undefined;
  const systematics = document.systematics as Json[] | undefined;
  const statistical = document.statistical as Json | undefined;
  if (!parameters || !Array.isArray(systematics) || !statistical || typeof document.method !== 'string') return null;
  const names = Object.keys(parameters);
  const column = (key: string) => names.map((name) => numberOf(parameters[name][key]));
  const rows = systematics.map((entry): BudgetTableRow => {
    const per = entry.parameters as Record<string, Json>;
    const values = (key: string) => names.map((name) => numberOf(per[name]?.[key]));
    const optional = (key: string) => names.map((name) => (typeof per[name]?.[key] === 'number' ? per[name][key] as number : null));
    const full = names.every((name) => typeof per[name]?.full_fit_shift === 'number');
    return {
      name: String(entry.name), effectiveCountWithout: numberOf(entry.effective_draws_removed), effectiveCountAlone: numberOf(entry.effective_draws_alone),
      reliable: entry.reliable === true, shift: values('shift_when_removed'), shiftMcError: values('shift_mc_error'),
      contribution: values('contribution_removed'), contributionMcError: values('contribution_removed_mc_error'),
      aloneContribution: values('contribution_alone'), aloneContributionMcError: values('contribution_alone_mc_error'),
      linearShift: optional('linear_shift'), linearContribution: optional('linear_contribution'),
      fullShift: full ? values('full_fit_shift') : null, fullContribution: full ? values('full_fit_contribution') : null,
    };
  });
  return {
    title: String(document.title ?? ''), model: String(document.model ?? ''), method: document.method, parameters: names,
    drawCount: numberOf(document.draws), minEffectiveCount: numberOf(document.min_effective_draws),
    allMean: column('mean'), allSd: column('sd'), statisticalSd: column('statistical_sd'), totalSystematic: column('systematic_sd'),
    statisticalEffectiveCount: numberOf(statistical.effective_draws), statisticalReliable: statistical.reliable === true, rows,
  };
}
