import { parameterSymbol } from '../tables/parameterSymbols.js';
import { budgetPlace, formatBudgetNumber, placeWithError, type BudgetTable, type BudgetTableRow } from './budgetTable.js';

/**
 * The systematic budget as Markdown (the content of `budget.md`): the
 * method, then four tables with one row per systematic and one column per
 * parameter: the shift of each mean when the systematic is removed (with
 * its Monte Carlo error), its error contribution in quadrature removed from
 * all and added alone to the statistical errors, and the Gaussian
 * linear-response cross-check; a fifth compares full fits when they were
 * run. Rows whose weights are worth fewer draws than the threshold are
 * marked with a dagger.
 *
 * Cost O(systematics x parameters).
 * @param table the budget.
 * @returns Markdown text ending in a newline.
 * @example budgetMarkdown(table).startsWith('# Systematic budget') // true
 */
export function budgetMarkdown(table: BudgetTable): string {
  const places = table.allSd.map(budgetPlace);
  const heads = table.parameters.map((name) => parameterSymbol(name).label);
  const header = (first: string[], label: (head: string) => string): string[] => [
    `| ${[...first, ...heads.map(label)].join(' | ')} |`,
    `|${[...first, ...heads].map((_, i) => (i === 0 ? '---' : '---:')).join('|')}|`,
  ];
  const flag = (row: BudgetTableRow) => (row.reliable ? row.name : `${row.name} †`);
  const cells = (values: Array<number | null>, signed = false) => values.map((value, j) => formatBudgetNumber(value, places[j], signed));
  const withErrors = (values: number[], errors: number[], signed = false) => values.map((value, j) => {
    const place = placeWithError(places[j], errors[j]);
    return `${formatBudgetNumber(value, place, signed)} ± ${formatBudgetNumber(errors[j], place)}`;
  });
  const lines = [
    `# Systematic budget: ${table.title} (${table.model})`,
    '',
    `Method: ${table.method}`,
    '',
    `${table.drawCount} draws of the posterior with every systematic; † marks a variant whose weights are worth fewer than ${table.minEffectiveCount} draws (Kish effective count): trust the linear response or a full fit there.`,
    '',
    '## Shift of each mean when the systematic is removed',
    '',
    'Mean with every systematic but this one, minus the mean with all, ± its Monte Carlo error.',
    '',
    ...header(['systematic', 'effective draws'], (head) => `Δ${head}`),
    ...table.rows.map((row) => `| ${[flag(row), String(Math.round(row.effectiveCountWithout)),
      ...withErrors(row.shift, row.shiftMcError, true)].join(' | ')} |`),
    '',
    '## Error contribution in quadrature',
    '',
    'Removed: sqrt(σ_all² − σ_without²); alone: sqrt(σ_stat+k² − σ_stat²); ± the Monte Carlo error. A negative entry is Monte Carlo noise (the sign is kept).',
    '',
    ...header(['systematic', 'removed / alone'], (head) => `σ(${head})`),
    ...table.rows.map((row) => `| ${[flag(row), 'removed', ...withErrors(row.contribution, row.contributionMcError)].join(' | ')} |\n` +
      `| ${[flag(row), 'alone', ...withErrors(row.aloneContribution, row.aloneContributionMcError)].join(' | ')} |`),
    `| all systematics | removed | ${cells(table.totalSystematic).join(' | ')} |`,
    `| statistical only${table.statisticalReliable ? '' : ' †'} | σ | ${cells(table.statisticalSd).join(' | ')} |`,
    `| statistical + systematic | σ | ${cells(table.allSd).join(' | ')} |`,
    '',
    '## Cross-check: Gaussian linear response',
    '',
    'Shift and contribution (removed) predicted from the draws\' mean and covariance and a quadratic fit of the log-likelihood ratio.',
    '',
    ...header(['systematic', 'quantity'], (head) => head),
    ...table.rows.map((row) => `| ${[row.name, 'shift', ...cells(row.linearShift, true)].join(' | ')} |\n| ${[row.name, 'contribution', ...cells(row.linearContribution)].join(' | ')} |`),
  ];
  const full = table.rows.filter((row) => row.fullShift !== null);
  if (full.length > 0) {
    lines.push('', '## Full fits of stat + all but one', '', 'The same shift and contribution from a separate fit of each variant (reweighted in brackets).', '',
      ...header(['systematic', 'quantity'], (head) => head),
      ...full.map((row) => `| ${[row.name, 'shift', ...row.fullShift!.map((value, j) => `${formatBudgetNumber(value, places[j], true)} (${formatBudgetNumber(row.shift[j], places[j], true)})`)].join(' | ')} |\n` +
        `| ${[row.name, 'contribution', ...row.fullContribution!.map((value, j) => `${formatBudgetNumber(value, places[j])} (${formatBudgetNumber(row.contribution[j], places[j])})`)].join(' | ')} |`));
  }
  return lines.join('\n') + '\n';
}
