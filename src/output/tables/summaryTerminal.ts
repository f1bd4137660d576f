import type { RunSummary } from '../summaries/runSummary.js';
import { displayWidth, fitWidth } from './displayWidth.js';
import { parameterSymbol } from './parameterSymbols.js';
import { MISSING_CELL, summaryCells } from './summaryCells.js';

/** Options of {@link summaryTerminal}. */
export interface SummaryTerminalOptions {
  /** Total width in columns; default 80. */
  width?: number;
  /** Flag R-hat above this value with '!' (e.g. 1.01). */
  rHatMax?: number;
  /** Flag a bulk or tail ESS below this value with '!' (e.g. 400). */
  essMin?: number;
}

/** Columns between table columns. */
const GAP = '  ';

/**
 * A compact summary table for the terminal, readable in 80 columns:
 * parameter label (with unit), mean ± sd, equal-tailed 68.27% interval,
 * R-hat and bulk/tail ESS (when any parameter has diagnostics), numbers
 * PDG-rounded. Values beyond the given R-hat / ESS limits end in '!', with a
 * note under the table. The label column is cut (with '…') when the table
 * would be wider than `width`. No colours, so it can go to a log file.
 *
 * Cost: O(p) for p parameters.
 * @param summary a RunSummary.
 * @param options width in columns and diagnostic limits.
 * @returns lines joined by newlines, ending in a newline.
 * @example summaryTerminal(summary).split('\n')[0].startsWith('parameter') // true
 */
export function summaryTerminal(summary: RunSummary, options: SummaryTerminalOptions = {}): string {
  const width = options.width ?? 80;
  const withDiagnostics = summary.parameters.some((parameter) => parameter.diagnostics !== undefined);
  let flagged = false;
  const body = summary.parameters.map((parameter) => {
    const cells = summaryCells(parameter, 'plain');
    const symbol = parameterSymbol(parameter.name);
    const row = [`${symbol.label}${symbol.unit ? ` [${symbol.unit}]` : ''}`, cells.meanSd, cells.interval68];
    if (withDiagnostics) {
      const rHat = parameter.diagnostics?.rHat;
      const badRHat = options.rHatMax !== undefined && rHat !== undefined && !(rHat <= options.rHatMax);
      const lowEss = (value: number | undefined): boolean => options.essMin !== undefined && value !== undefined && !(value >= options.essMin);
      const badEss = lowEss(parameter.diagnostics?.essBulk) || lowEss(parameter.diagnostics?.essTail);
      flagged ||= badRHat || badEss;
      const ess = cells.essBulk === MISSING_CELL && cells.essTail === MISSING_CELL ? MISSING_CELL : `${cells.essBulk}/${cells.essTail}`;
      row.push(cells.rHat + (badRHat ? '!' : ''), ess + (badEss ? '!' : ''));
    }
    return row;
  });
  const header = ['parameter', 'mean ± sd', '68.27% interval'];
  if (withDiagnostics) header.push('R-hat', 'ESS bulk/tail');
  const widths = header.map((title, column) => Math.max(displayWidth(title), ...body.map((row) => displayWidth(row[column]))));
  const total = widths.reduce((sum, w) => sum + w, 0) + GAP.length * (widths.length - 1);
  if (total > width) widths[0] = Math.max(displayWidth(header[0]), widths[0] - (total - width));
  const line = (row: string[]): string => row.map((text, column) => fitWidth(text, widths[column], column > 0 && column !== 2)).join(GAP).trimEnd();
  const rule = '─'.repeat(Math.min(width, widths.reduce((sum, w) => sum + w, 0) + GAP.length * (widths.length - 1)));
  const lines = [line(header), rule, ...body.map(line)];
  for (const parameter of summary.parameters.filter((p) => p.note)) lines.push(`${parameter.name}: ${parameter.note}`);
  if (flagged) lines.push(`! beyond the limits${options.rHatMax !== undefined ? ` R-hat <= ${options.rHatMax}` : ''}${options.essMin !== undefined ? ` ESS >= ${options.essMin}` : ''}`);
  return lines.join('\n') + '\n';
}
