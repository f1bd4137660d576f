import { escapeXml } from '../figures/index.js';
import { parameterRowsOf, type ModelColumn } from '../tables/modelColumn.js';
import { summaryCells } from '../tables/summaryCells.js';
import { htmlElement } from './htmlElement.js';
import { REPORT_STYLE } from './reportStyle.js';
import { parameterHeadingHtml } from './summarySection.js';

/** Same policy as the run pages: nothing fetched, no script (W3C CSP Level 3); links to the model pages are navigation, not fetches. */
const CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

/** What {@link modelsIndexHtml} shows. */
export interface ModelsIndexInput {
  /** Title of the configuration. */
  title: string;
  /** candela version, for the footer. */
  version: string;
  models: readonly ModelColumn[];
}

/**
 * The index page of a multi-model fit (`index.html` in the output folder):
 * the models side by side, with a parameter table whose columns are the
 * models (median and 68.27% errors, or the one-sided 95% limit of a marginal
 * cut by its prior), the chi-square with degrees of freedom and p-value, AIC
 * and BIC with their differences to the lowest, the number of warnings, and a
 * link to each model's own report page. Self-contained like the run pages.
 *
 * Cost: O(parameters x models).
 * @param input title, version and the models in order.
 * @returns the HTML document text.
 * @example modelsIndexHtml({ title: 'Kestrel', version: '0.1.0', models }).includes('flat_lcdm/report.html') // true
 */
export function modelsIndexHtml(input: ModelsIndexInput): string {
  const { models } = input;
  const link = (model: ModelColumn) => htmlElement('a', { href: model.link }, escapeXml(model.label));
  const headRow = htmlElement('tr', {}, [htmlElement('th', { scope: 'col' }, 'parameter'), ...models.map((model) => htmlElement('th', { scope: 'col', class: 'number' }, link(model)))]);
  const parameterRows = parameterRowsOf(models).map((name) => htmlElement('tr', {}, [
    htmlElement('th', { scope: 'row' }, parameterHeadingHtml(name)),
    ...models.map((model) => {
      const parameter = model.parameters.find((p) => p.name === name);
      return htmlElement('td', { class: 'number' }, parameter ? escapeXml(summaryCells(parameter, 'plain').median68) : '—');
    }),
  ]));
  const lowest = (values: Array<number | null>) => Math.min(...values.filter((v): v is number => v !== null));
  const aicBest = lowest(models.map((m) => m.aic));
  const bicBest = lowest(models.map((m) => m.bic));
  const fitRow = (label: string, cell: (model: ModelColumn) => string) => htmlElement('tr', {}, [
    htmlElement('th', { scope: 'row' }, escapeXml(label)), ...models.map((model) => htmlElement('td', { class: 'number' }, escapeXml(cell(model)))),
  ]);
  const fitRows = [
    fitRow('chi-square / degrees of freedom', (m) => (m.chiSquare === null ? '—' : `${m.chiSquare.toFixed(2)} / ${m.degreesOfFreedom}`)),
    fitRow('p-value of the chi-square', (m) => (m.pValue === null ? '—' : m.pValue.toPrecision(3))),
    fitRow('AIC (Δ to the lowest)', (m) => (m.aic === null ? '—' : `${m.aic.toFixed(2)} (${(m.aic - aicBest).toFixed(2)})`)),
    fitRow('BIC (Δ to the lowest)', (m) => (m.bic === null ? '—' : `${m.bic.toFixed(2)} (${(m.bic - bicBest).toFixed(2)})`)),
    fitRow('warnings', (m) => String(m.warningCount)),
  ];
  const notes = models.flatMap((model) => model.parameters.filter((p) => p.note).map((p) => `${p.name}: ${p.note}`));
  const body = htmlElement('body', {}, [
    '\n',
    htmlElement('header', {}, htmlElement('h1', {}, escapeXml(input.title))),
    '\n',
    htmlElement('section', { id: 'models' }, [
      htmlElement('h2', {}, 'Models side by side'),
      htmlElement('p', { class: 'note' }, 'Median with equal-tailed 68.27% errors, PDG-rounded; a marginal cut by a hard prior edge shows its one-sided 95% limit. Each model name links to its own report.'),
      htmlElement('table', {}, [htmlElement('thead', {}, headRow), '\n', htmlElement('tbody', {}, [...parameterRows, ...fitRows].join('\n'))]),
      ...[...new Set(notes)].map((note) => htmlElement('p', { class: 'note' }, escapeXml(note))),
    ]),
    '\n',
    htmlElement('nav', { id: 'model-pages' }, [htmlElement('h2', {}, 'Model reports'), htmlElement('ul', {}, models.map((model) => htmlElement('li', {}, link(model))))]),
    '\n',
    htmlElement('footer', {}, escapeXml(`Written by candela ${input.version}. AIC: Akaike (1974); BIC: Schwarz (1978); both from the chi-square at the best fit.`)),
    '\n',
  ]);
  const head = htmlElement('head', {}, [
    '\n',
    htmlElement('meta', { charset: 'utf-8' }),
    htmlElement('meta', { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }),
    htmlElement('meta', { name: 'viewport', content: 'width=device-width, initial-scale=1' }),
    '\n',
    htmlElement('title', {}, escapeXml(`${input.title}: models`)),
    '\n',
    htmlElement('style', {}, REPORT_STYLE),
    '\n',
  ]);
  return `<!DOCTYPE html>\n${htmlElement('html', { lang: 'en' }, ['\n', head, '\n', body, '\n'])}\n`;
}
