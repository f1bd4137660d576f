import { escapeXml, parameterLabel } from '../figures/index.js';
import type { ParameterSymbol } from '../figures/index.js';
import { htmlElement } from './htmlElement.js';
import type { ReportSummaryTable } from './reportInput.js';
import { richTextToHtml } from './richTextHtml.js';

/**
 * The heading cell content of a parameter: its symbol and unit (with real
 * sub- and superscripts) followed by the parameter's name in small type.
 *
 * @param parameter parameter name, e.g. `omega_m`
 * @param symbols symbol map (default: the output layer's parameterSymbols table)
 * @returns inline HTML
 * @example parameterHeadingHtml('omega_m') // 'Ω<sub>m</sub><span class="name">omega_m</span>'
 */
export function parameterHeadingHtml(parameter: string, symbols?: Readonly<Record<string, ParameterSymbol>>): string {
  return `${richTextToHtml(parameterLabel(parameter, symbols))}${htmlElement('span', { class: 'name' }, escapeXml(parameter))}`;
}

/**
 * The "Parameter summary" section: one row per parameter, the caller's
 * already-rounded text cells right-aligned in tabular figures; a row's note
 * (a sign convention, a quantity at a fixed H0) is printed under its name.
 *
 * @param table column headings, rows and an optional note
 * @param symbols parameter symbols for the first column (default: the output layer's table)
 * @returns a `<section id="summary">` element
 * @example summarySection({ columns: ['median ± 68%'], rows: [{ parameter: 'w0', cells: ['−1.02 ± 0.08'] }] }, symbols)
 */
export function summarySection(table: ReportSummaryTable, symbols?: Readonly<Record<string, ParameterSymbol>>): string {
  const head = htmlElement('thead', {}, htmlElement('tr', {}, [htmlElement('th', { scope: 'col' }, 'parameter'), ...table.columns.map((column) => htmlElement('th', { scope: 'col', class: 'number' }, escapeXml(column)))]));
  const rows = table.rows.map((row) => htmlElement('tr', {}, [
    htmlElement('th', { scope: 'row' }, row.note ? [parameterHeadingHtml(row.parameter, symbols), htmlElement('span', { class: 'qualifier' }, escapeXml(row.note))] : parameterHeadingHtml(row.parameter, symbols)),
    ...table.columns.map((_, index) => htmlElement('td', { class: 'number' }, escapeXml(row.cells[index] ?? ''))),
  ]));
  return htmlElement('section', { id: 'summary' }, [
    htmlElement('h2', {}, 'Parameter summary'),
    '\n',
    htmlElement('table', {}, [head, '\n', htmlElement('tbody', {}, rows.join('\n'))]),
    table.note ? htmlElement('p', { class: 'note' }, escapeXml(table.note)) : '',
    '\n',
  ]);
}
