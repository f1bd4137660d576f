import type { ParameterSymbol } from '../figures/index.js';
import { convergenceVerdicts } from './convergenceVerdicts.js';
import { htmlElement } from './htmlElement.js';
import { escapeXml } from '../figures/index.js';
import type { ReportDiagnostics } from './reportInput.js';
import { parameterHeadingHtml } from './summarySection.js';

/** Pass and fail marks: check mark U+2713 and ballot X U+2717, with the word for readers that do not see colour. */
const PASS_MARK = '\u2713';
const FAIL_MARK = '\u2717';

function markedCell(text: string, pass: boolean): string {
  return htmlElement('td', { class: 'number' }, [htmlElement('span', { class: `mark ${pass ? 'pass' : 'fail'}`, title: pass ? 'pass' : 'fail' }, pass ? PASS_MARK : FAIL_MARK), text]);
}

function shown(value: number, digits: number): string {
  return Number.isFinite(value) ? value.toFixed(digits) : 'not finite';
}

/**
 * The "Convergence checks" section: R-hat, ESS, autocorrelation time and
 * chain length in autocorrelation times per parameter, each with a pass or
 * fail mark (see convergenceVerdicts), then the thresholds used.
 *
 * @param diagnostics numbers and thresholds (R-hat dimensionless, ESS in draws, tau and length in steps)
 * @param symbols parameter symbols for the first column (default: the output layer's table)
 * @returns a `<section id="convergence">` element
 * @example convergenceSection(diagnostics, symbols)
 */
export function convergenceSection(diagnostics: ReportDiagnostics, symbols?: Readonly<Record<string, ParameterSymbol>>): string {
  if (diagnostics.notApplicable !== undefined) {
    return htmlElement('section', { id: 'convergence' }, [htmlElement('h2', {}, 'Convergence checks'), '\n', htmlElement('p', { class: 'note' }, escapeXml(diagnostics.notApplicable)), '\n']);
  }
  const verdicts = convergenceVerdicts(diagnostics);
  const columns = ['R-hat', 'ESS', '\u03c4 (steps)', 'chain length / \u03c4'];
  const head = htmlElement('thead', {}, htmlElement('tr', {}, [htmlElement('th', { scope: 'col' }, 'parameter'), ...columns.map((text) => htmlElement('th', { scope: 'col', class: 'number' }, text))]));
  const rows = diagnostics.rows.map((row, index) => {
    const verdict = verdicts.parameters[index];
    return htmlElement('tr', { class: verdict.pass ? 'pass' : 'fail' }, [
      htmlElement('th', { scope: 'row' }, parameterHeadingHtml(row.parameter, symbols)),
      markedCell(shown(row.rHat, 3), verdict.rHatPass),
      markedCell(Number.isFinite(row.ess) ? String(Math.round(row.ess)) : 'not finite', verdict.essPass),
      htmlElement('td', { class: 'number' }, shown(row.autocorrelationTimeSteps, 1)),
      markedCell(verdict.lengthInTaus > 0 ? verdict.lengthInTaus.toFixed(0) : 'not finite', verdict.lengthPass),
    ]);
  });
  let criteria = `\u03c4 is the integrated autocorrelation time. Checks: R-hat at most ${diagnostics.rHatMax}, ESS at least ${diagnostics.essMin}, chain of ${diagnostics.chainLengthSteps} steps at least ${diagnostics.tauMultiple} autocorrelation times long.`;
  if (diagnostics.acceptanceFraction !== undefined && Number.isFinite(diagnostics.acceptanceFraction)) criteria += ` Mean acceptance fraction ${diagnostics.acceptanceFraction.toFixed(3)}.`;
  return htmlElement('section', { id: 'convergence' }, [
    htmlElement('h2', {}, 'Convergence checks'),
    '\n',
    htmlElement('table', {}, [head, '\n', htmlElement('tbody', {}, rows.join('\n'))]),
    htmlElement('p', { class: 'note' }, criteria),
    '\n',
  ]);
}
