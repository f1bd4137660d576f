import { escapeLatexText, latexNote, parameterSymbol } from './parameterSymbols.js';
import type { ModelColumn } from './modelColumn.js';
import { parameterRowsOf } from './modelColumn.js';
import { summaryCells } from './summaryCells.js';

/**
 * Several models side by side as a LaTeX tabular (`models.tex`): one row per
 * parameter with the models as columns (median with its equal-tailed 68.27%
 * errors, PDG-rounded, or the one-sided 95% limit of a marginal cut by its
 * prior; `--` where a model lacks the parameter), then the chi-square with its
 * degrees of freedom, AIC and BIC. Notes of the rows (sign conventions,
 * quantities at a fixed H0) follow under the table. Core LaTeX only.
 *
 * Cost: O(parameters x models).
 * @param models the columns, in the configuration's order.
 * @returns LaTeX text ending in a newline.
 * @example modelsLatex(models).split('\n')[1] // '\\begin{tabular}{lcc}' for two models
 */
export function modelsLatex(models: readonly ModelColumn[]): string {
  const names = parameterRowsOf(models);
  const lines = [
    `% ${models.length} models side by side: median with equal-tailed 68.27% errors (PDG rounding), or a one-sided 95% limit where the prior cuts the posterior.`,
    `\\begin{tabular}{l${'c'.repeat(models.length)}}`,
    '\\hline\\hline',
    `Parameter & ${models.map((model) => escapeLatexText(model.label)).join(' & ')} \\\\`,
    '\\hline',
  ];
  const notes = new Map<string, string>();
  for (const name of names) {
    const symbol = parameterSymbol(name);
    const cells = models.map((model) => {
      const parameter = model.parameters.find((p) => p.name === name);
      if (!parameter) return '--';
      if (parameter.note) notes.set(name, parameter.note);
      return `$${summaryCells(parameter, 'latex').median68}$`;
    });
    lines.push(`$${symbol.latex}$${symbol.unitLatex ? ` [${symbol.unitLatex}]` : ''} & ${cells.join(' & ')} \\\\`);
  }
  lines.push('\\hline');
  lines.push(`$\\chi^2$ / dof & ${models.map((m) => (m.chiSquare === null ? '--' : `$${m.chiSquare.toFixed(1)} / ${m.degreesOfFreedom}$`)).join(' & ')} \\\\`);
  lines.push(`AIC & ${models.map((m) => (m.aic === null ? '--' : `$${m.aic.toFixed(1)}$`)).join(' & ')} \\\\`);
  lines.push(`BIC & ${models.map((m) => (m.bic === null ? '--' : `$${m.bic.toFixed(1)}$`)).join(' & ')} \\\\`);
  lines.push('\\hline\\hline');
  for (const [name, note] of notes) {
    lines.push(`\\multicolumn{${models.length + 1}}{l}{\\footnotesize $${parameterSymbol(name).latex}$: ${latexNote(note)}} \\\\`);
  }
  lines.push('\\end{tabular}');
  return lines.join('\n') + '\n';
}
