import type { RunSummary } from '../summaries/runSummary.js';
import { parameterSymbol } from './parameterSymbols.js';
import { summaryCells } from './summaryCells.js';

/** Decimals of correlation coefficients in the Markdown table. */
const CORRELATION_DECIMALS = 2;

/** A Markdown table cell: pipes escaped, line breaks removed. */
function cell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/[\r\n]+/g, ' ');
}

/**
 * The posterior summary as Markdown (the content of `summary.md`): a heading,
 * one sentence on what the columns mean, one table row per parameter
 * (symbol, name and unit; mean ± sd; median with asymmetric 68.27% errors;
 * 95.45% interval; 68.27% HDI; MAP when known; R-hat and bulk/tail ESS when
 * any parameter has diagnostics), then the correlation matrix when there are
 * two or more parameters. Numbers are PDG-rounded (see summaryCells).
 *
 * Cost: O(p^2) for p parameters.
 * @param summary a RunSummary (summarizePosterior plus diagnostics).
 * @returns Markdown text ending in a newline.
 * @example summaryMarkdown(summary).startsWith('# Posterior summary') // true
 */
export function summaryMarkdown(summary: RunSummary): string {
  const rows = summary.parameters.map((parameter) => ({ parameter, cells: summaryCells(parameter, 'plain'), symbol: parameterSymbol(parameter.name) }));
  const withMap = rows.some((row) => row.parameter.stats.map !== undefined);
  const withDiagnostics = rows.some((row) => row.parameter.diagnostics !== undefined);
  const header = ['Parameter', 'Mean ± sd', 'Median, 68.27% errors', '95.45% interval', '68.27% HDI'];
  if (withMap) header.push('MAP');
  if (withDiagnostics) header.push('R-hat', 'ESS bulk', 'ESS tail');
  const lines: string[] = [`# Posterior summary${summary.title ? `: ${summary.title}` : ''}`, ''];
  lines.push(
    `${summary.sampleCount} samples. Mean ± standard deviation; median with the equal-tailed 68.27% interval as errors; ` +
    'equal-tailed 95.45% interval; shortest 68.27% interval (HDI). Rounded by the Particle Data Group rule.' +
    (rows.some((row) => row.parameter.oneSidedLimit) ? ' A marginal cut by a hard prior edge is quoted as a one-sided 95% limit instead of mean ± sd and median ± errors.' : ''), '',
  );
  lines.push(`| ${header.join(' | ')} |`);
  lines.push(`|${header.map((_, k) => (k === 0 ? ':--' : '--:')).join('|')}|`);
  for (const { parameter, cells, symbol } of rows) {
    const qualifiers = [...(parameter.derived ? ['derived'] : []), ...(parameter.note ? [parameter.note] : [])];
    const name = `${symbol.label} \`${parameter.name}\`${symbol.unit ? ` [${symbol.unit}]` : ''}${qualifiers.length ? ` (${qualifiers.join('; ')})` : ''}`;
    const row = [name, cells.meanSd, cells.median68, cells.interval95, cells.hdi68];
    if (withMap) row.push(cells.map);
    if (withDiagnostics) row.push(cells.rHat, cells.essBulk, cells.essTail);
    lines.push(`| ${row.map(cell).join(' | ')} |`);
  }
  const names = summary.correlationNames;
  if (summary.correlation && names && names.length > 1) {
    const labels = names.map((name) => parameterSymbol(name).label);
    lines.push('', '## Correlations', '', `| | ${labels.map(cell).join(' | ')} |`, `|:--|${labels.map(() => '--:').join('|')}|`);
    names.forEach((_, i) => {
      const values = names.map((__, j) => summary.correlation![i * names.length + j].toFixed(CORRELATION_DECIMALS));
      lines.push(`| ${cell(labels[i])} | ${values.join(' | ')} |`);
    });
  }
  return lines.join('\n') + '\n';
}
