import { escapeLatexText, parameterSymbol } from '../tables/parameterSymbols.js';
import { budgetPlace, formatBudgetNumber, type BudgetTable } from './budgetTable.js';

/**
 * The systematic budget as a LaTeX tabular (the content of `budget.tex`),
 * ready for \input inside a table environment: one row per systematic, two
 * columns per parameter, the shift of its mean when the systematic is
 * removed ($\Delta$) and its error contribution in quadrature ($\sigma_k$);
 * then the statistical error, the total systematic and the total. Core
 * LaTeX only (\hline, math mode), as summaryLatex. A comment line states
 * the method; a dagger marks a variant whose weights are worth fewer draws
 * than the threshold.
 *
 * Cost O(systematics x parameters).
 * @param table the budget.
 * @returns LaTeX text ending in a newline.
 * @example budgetLatex(table).includes('\\Delta w_0') // true when w0 is a parameter
 */
export function budgetLatex(table: BudgetTable): string {
  const places = table.allSd.map(budgetPlace);
  const number = (value: number | null, j: number, signed = false) => {
    const text = formatBudgetNumber(value, places[j], signed);
    return text === 'n/a' ? '--' : `$${text}$`;
  };
  const columns = table.parameters.length * 2;
  const lines = [
    `% Systematic budget of ${escapeLatexText(table.title.replace(/[\r\n]+/g, ' '))} (${escapeLatexText(table.model)}): ${table.method.replace(/[\r\n]+/g, ' ')}`,
    `\\begin{tabular}{l${'r'.repeat(columns)}}`,
    '\\hline\\hline',
    `Systematic & ${table.parameters.map((name) => `$\\Delta ${parameterSymbol(name).latex}$ & $\\sigma_k(${parameterSymbol(name).latex})$`).join(' & ')} \\\\`,
    '\\hline',
  ];
  for (const row of table.rows) {
    const cells = table.parameters.flatMap((_, j) => [number(row.shift[j], j, true), number(row.contribution[j], j)]);
    lines.push(`${escapeLatexText(row.name)}${row.reliable ? '' : '$^\\dagger$'} & ${cells.join(' & ')} \\\\`);
  }
  lines.push('\\hline');
  const totals: Array<[string, number[]]> = [
    [`Statistical${table.statisticalReliable ? '' : '$^\\dagger$'}`, table.statisticalSd],
    ['Systematic (all)', table.totalSystematic],
    ['Total', table.allSd],
  ];
  for (const [label, values] of totals) lines.push(`${label} & ${values.map((value, j) => `-- & ${number(value, j)}`).join(' & ')} \\\\`);
  lines.push('\\hline\\hline');
  lines.push(`\\multicolumn{${columns + 1}}{l}{\\footnotesize $\\Delta$: mean without the systematic minus mean with all; $\\sigma_k = \\sqrt{\\sigma_{\\rm all}^2 - \\sigma_{\\rm without}^2}$.} \\\\`);
  if (table.rows.some((row) => !row.reliable) || !table.statisticalReliable) {
    lines.push(`\\multicolumn{${columns + 1}}{l}{\\footnotesize $^\\dagger$ importance weights worth fewer than ${table.minEffectiveCount} draws.} \\\\`);
  }
  lines.push('\\end{tabular}');
  return lines.join('\n') + '\n';
}
