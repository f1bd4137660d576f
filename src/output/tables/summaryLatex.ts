import type { RunSummary } from '../summaries/runSummary.js';
import { escapeLatexText, latexNote, parameterSymbol } from './parameterSymbols.js';
import { summaryCells } from './summaryCells.js';

/** Options of {@link summaryLatex}. */
export interface SummaryLatexOptions {
  /** Add R-hat and ESS columns (default false: paper tables rarely show them). */
  includeDiagnostics?: boolean;
  /** Add the mean ± sd column (default true). */
  includeMean?: boolean;
}

/**
 * The posterior summary as a LaTeX tabular (the content of `table.tex`),
 * ready for \input inside a table environment: one row per parameter with
 * its symbol and unit, mean ± sd, median with asymmetric 68.27% errors
 * ($0.298^{+0.022}_{-0.021}$) and the 95.45% interval; optional R-hat and
 * ESS columns. Uses only core LaTeX (\hline, \rm, math mode). A comment line
 * says what the columns are.
 *
 * Cost: O(p) for p parameters.
 * @param summary a RunSummary.
 * @param options column choices.
 * @returns LaTeX text ending in a newline.
 * @example summaryLatex(summary).includes('\\Omega_{\\rm m}') // true when omega_m is a parameter
 */
export function summaryLatex(summary: RunSummary, options: SummaryLatexOptions = {}): string {
  const includeMean = options.includeMean ?? true;
  const includeDiagnostics = options.includeDiagnostics ?? false;
  const header = ['Parameter'];
  if (includeMean) header.push('Mean $\\pm$ sd');
  header.push('Median and 68.27\\%', '95.45\\% interval');
  if (includeDiagnostics) header.push('$\\hat{R}$', 'ESS bulk', 'ESS tail');
  const lines = [
    `% Posterior summary${summary.title ? ` of ${summary.title.replace(/[\r\n]+/g, ' ')}` : ''}: ${summary.sampleCount} samples; median with equal-tailed 68.27% errors; PDG rounding.`,
    `\\begin{tabular}{l${'c'.repeat(header.length - 1)}}`,
    '\\hline\\hline',
    `${header.join(' & ')} \\\\`,
    '\\hline',
  ];
  for (const parameter of summary.parameters) {
    const cells = summaryCells(parameter, 'latex');
    const symbol = parameterSymbol(parameter.name);
    const name = `$${symbol.latex}$${symbol.unitLatex ? ` [${symbol.unitLatex}]` : ''}`;
    const row = [name];
    if (includeMean) row.push(`$${cells.meanSd}$`);
    row.push(`$${cells.median68}$`, `$${cells.interval95}$`);
    if (includeDiagnostics) row.push(...[cells.rHat, cells.essBulk, cells.essTail].map((text) => (text === '—' ? '--' : escapeLatexText(text))));
    lines.push(`${row.join(' & ')} \\\\`);
  }
  lines.push('\\hline\\hline');
  // Notes (sign conventions, quantities at a fixed parameter) under the table, one row each.
  for (const parameter of summary.parameters.filter((p) => p.note)) {
    lines.push(`\\multicolumn{${header.length}}{l}{\\footnotesize $${parameterSymbol(parameter.name).latex}$: ${latexNote(parameter.note as string)}} \\\\`);
  }
  lines.push('\\end{tabular}');
  return lines.join('\n') + '\n';
}
