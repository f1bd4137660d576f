import { escapeXml } from '../figures/index.js';
import { budgetPlace, formatBudgetNumber, placeWithError, type BudgetTable } from '../budget/budgetTable.js';
import type { ParameterSymbol } from '../figures/index.js';
import { parameterSymbol } from '../tables/parameterSymbols.js';
import { htmlElement } from './htmlElement.js';
import { namespaceSvgIds } from './namespaceSvgIds.js';

/** A systematic budget on the report page: its table and its figure (budget.json and figures/budget.svg of the run folder). */
export interface ReportBudget {
  table: BudgetTable;
  svg: string;
}

/**
 * The "Systematic budget" section: the method in words, one table row per
 * systematic with, per parameter, the shift of the mean when it is removed
 * and its error contribution in quadrature (each ± its Monte Carlo error),
 * then the statistical, systematic and total errors; the bar figure below,
 * inlined with its ids prefixed (`budget-`). A dagger marks a variant
 * whose weights are worth too few draws.
 *
 * @param budget the table and figure, or undefined when the run has no budget.
 * @param symbols parameter symbols (plain labels), by name.
 * @returns a `<section id="budget">` element, or '' without a budget.
 * @example budgetSection({ table, svg: budgetFigure(table) }).includes('Systematic budget') // true
 */
export function budgetSection(budget: ReportBudget | undefined, symbols?: Readonly<Record<string, ParameterSymbol>>): string {
  if (!budget) return '';
  const { table } = budget;
  const places = table.allSd.map(budgetPlace);
  const label = (name: string) => escapeXml(symbols?.[name]?.label ?? parameterSymbol(name).label);
  const cell = (value: number, error: number, j: number, signed: boolean) => {
    const place = placeWithError(places[j], error);
    return htmlElement('td', {}, escapeXml(`${formatBudgetNumber(value, place, signed)} ± ${formatBudgetNumber(error, place)}`));
  };
  const head = htmlElement('tr', {}, [
    htmlElement('th', {}, 'systematic'),
    ...table.parameters.flatMap((name) => [htmlElement('th', {}, `Δ${label(name)}`), htmlElement('th', {}, `σ<sub>k</sub>(${label(name)})`)]),
  ]);
  const rows = table.rows.map((row) => htmlElement('tr', {}, [
    htmlElement('th', { scope: 'row' }, escapeXml(row.reliable ? row.name : `${row.name} †`)),
    ...table.parameters.flatMap((_, j) => [cell(row.shift[j], row.shiftMcError[j], j, true), cell(row.contribution[j], row.contributionMcError[j], j, false)]),
  ]));
  const totals = ([['statistical', table.statisticalSd], ['systematic (all)', table.totalSystematic], ['total', table.allSd]] as Array<[string, number[]]>)
    .map(([name, values]) => htmlElement('tr', { class: 'total' }, [
      htmlElement('th', { scope: 'row' }, name),
      ...values.flatMap((value, j) => [htmlElement('td', {}, ''), htmlElement('td', {}, escapeXml(formatBudgetNumber(value, places[j])))]),
    ]));
  const svg = namespaceSvgIds(budget.svg.replace(/<\?xml[^>]*\?>|<!DOCTYPE[^>]*>/gi, '').trim(), 'budget-');
  return htmlElement('section', { id: 'budget' }, [
    htmlElement('h2', {}, 'Systematic budget'),
    '\n',
    htmlElement('p', {}, escapeXml(`Δ: mean without the systematic minus mean with all; σk = sqrt(σall² − σwithout²). Method: ${table.method}.`)),
    '\n',
    htmlElement('table', {}, [htmlElement('thead', {}, head), htmlElement('tbody', {}, [...rows, ...totals].join('\n'))]),
    '\n',
    htmlElement('figure', { id: 'figure-budget' }, ['\n', svg, '\n', htmlElement('figcaption', {}, [
      htmlElement('strong', {}, 'Systematic budget.'), ' Left: shift of each mean when the systematic is removed; right: its error contribution; both in units of the total standard deviation, with Monte Carlo error bars (file ',
      htmlElement('code', {}, 'figures/budget.svg'), ').',
    ]), '\n']),
    '\n',
  ]);
}
