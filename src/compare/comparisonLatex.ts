import { fixedText, pValueText, shortReading, signedText, valueAndError } from './formatComparisonCells.js';
import type { ModelComparison } from './modelComparison.js';

const DASH = '--';
const SPECIAL = /[\\&%$#_{}~^]/g;
const REPLACEMENT: Record<string, string> = {
  '\\': '\\textbackslash{}', '&': '\\&', '%': '\\%', '$': '\\$', '#': '\\#', '_': '\\_', '{': '\\{', '}': '\\}', '~': '\\textasciitilde{}', '^': '\\textasciicircum{}',
};

/** Text with LaTeX's special characters escaped. */
function escapeLatex(text: string): string {
  return text.replace(SPECIAL, (character) => REPLACEMENT[character]);
}

function math(text: string | null): string {
  return text === null ? DASH : `$${text}$`;
}

function rowLine(cells: string[]): string {
  return `${cells.join(' & ')} \\\\`;
}

/**
 * A model comparison as LaTeX `tabular` environments using only \hline
 * (no extra packages): the model table (same columns as the Markdown form),
 * then the nested-pair table when there are pairs; the notes follow as
 * comment lines for the author's caption. Labels are escaped; numbers are
 * set in math mode so minus signs typeset correctly. Layout is candela's own.
 *
 * Cost: O(models + pairs).
 * @param comparison From compareModels.
 * @returns LaTeX source ending in a newline.
 * @example comparisonLatex(report.comparison).startsWith('% Model comparison') // true
 */
export function comparisonLatex(comparison: ModelComparison): string {
  const base = escapeLatex(comparison.baseLabel);
  const lines = [
    `% Model comparison against ${base}`,
    '\\begin{tabular}{lrrrrrrrl}',
    '\\hline',
    rowLine(['Model', '$k$', '$\\chi^2_{\\min}$', '$\\Delta$AIC', '$\\Delta$BIC', '$\\Delta$DIC', '$\\ln Z$', `$\\ln B$ vs ${base}`, 'Reading']),
    '\\hline',
  ];
  let savageDickeyMarked = false;
  for (const row of comparison.rows) {
    const evidence = valueAndError(row.logZ, row.logZError);
    const factor = row.isBase ? null : valueAndError(row.logBayesFactor, row.logBayesFactorError);
    const marker = row.bayesFactorSource === 'savage-dickey' ? '$^{\\dagger}$' : '';
    if (marker) savageDickeyMarked = true;
    lines.push(
      rowLine([
        escapeLatex(row.isBase ? `${row.label} (base)` : row.label),
        String(row.freeParameterCount),
        math(fixedText(row.chiSquareMinimum)),
        math(signedText(row.deltaAic)),
        math(signedText(row.deltaBic)),
        math(signedText(row.deltaDic)),
        evidence ? math(`${evidence[0]} \\pm ${evidence[1]}`) : DASH,
        factor ? `${math(`${signedText(row.logBayesFactor)} \\pm ${factor[1]}`)}${marker}` : DASH,
        escapeLatex(shortReading(row, comparison.baseLabel) ?? DASH),
      ]),
    );
  }
  lines.push('\\hline', '\\end{tabular}');
  if (comparison.nested.length > 0) {
    lines.push('', '\\begin{tabular}{lrrrrr}', '\\hline');
    lines.push(rowLine(['Nested pair', '$m$', '$\\Delta\\chi^2$', '$p$', 'Gaussian equivalent', 'Savage--Dickey $\\ln B_{01}$']), '\\hline');
    for (const pair of comparison.nested) {
      lines.push(
        rowLine([
          escapeLatex(`${pair.extended} over ${pair.base}`),
          String(pair.extraParameters),
          math(pair.deltaChiSquare.toFixed(2)),
          math(pValueText(pair.pValue).replace(/e([+-]\d+)$/, (_, exponent: string) => `\\times 10^{${Number(exponent)}}`)),
          math(`${pair.sigma.toFixed(2)}\\sigma`),
          pair.savageDickeyLogBayesFactor === null ? DASH : math(`${signedText(pair.savageDickeyLogBayesFactor)} \\pm ${(pair.savageDickeyError ?? 0).toFixed(2)}`),
        ]),
      );
    }
    lines.push('\\hline', '\\end{tabular}');
  }
  if (savageDickeyMarked) lines.push('% $^{\\dagger}$ Savage--Dickey density ratio at the nested point.');
  lines.push(...comparison.notes.map((note) => `% ${note}`));
  return `${lines.join('\n')}\n`;
}
