import { escapeXml } from '../figures/index.js';
import { budgetSection } from './budgetSection.js';
import { convergenceSection } from './convergenceSection.js';
import { convergenceVerdicts } from './convergenceVerdicts.js';
import { figuresSection } from './figuresSection.js';
import { htmlElement } from './htmlElement.js';
import { provenanceSection } from './provenanceSection.js';
import type { ReportInput, ReportWarning } from './reportInput.js';
import { REPORT_STYLE } from './reportStyle.js';
import { runSection } from './runSection.js';
import { summarySection } from './summarySection.js';

/**
 * Content Security Policy of the page (W3C CSP Level 3): nothing may be
 * fetched and no script may run; only the inline style sheet and inline SVG
 * are used. A viewer's browser thus enforces that the report is self-contained.
 */
const CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:";

/**
 * One self-contained HTML page describing a run: title and overall
 * convergence verdict, run facts (seed, steps, stop reason, wall time,
 * version), warnings, the parameter summary table, the convergence checks
 * with pass/fail marks, every figure as inline SVG, the resolved
 * configuration as YAML and the SHA-256 of every input file. The page has
 * inline CSS only, no script and no network access (a Content Security
 * Policy forbids both), prints cleanly, and is also well-formed XML.
 *
 * Cost: linear in the size of the figures and configuration.
 *
 * @param input everything on the page (see ReportInput for units)
 * @returns the HTML document text
 * @example reportHtml({ title: 'Lyra Deep Survey: flat wCDM', facts, summary, diagnostics, figures, configurationYaml, inputFiles })
 */
export function reportHtml(input: ReportInput): string {
  const symbols = input.symbols;
  const verdict = convergenceVerdicts(input.diagnostics);
  const failing = verdict.parameters.filter((parameter) => !parameter.pass).map((parameter) => parameter.parameter);
  const warningCount = input.warnings?.length ?? 0;
  // A passing verdict never stands alone while warnings (a prior edge, a poor fit) qualify the numbers.
  const qualifier = warningCount > 0 ? `; ${warningCount} warning${warningCount === 1 ? '' : 's'} below qualify the results` : '';
  const verdictText = input.diagnostics.notApplicable !== undefined
    ? `Markov-chain convergence checks do not apply to this run${qualifier}`
    : verdict.pass
    ? `\u2713 every convergence check passes${qualifier}`
    : verdict.parameters.length === 0
      ? '\u2717 no convergence numbers were given'
      : `\u2717 convergence checks fail for ${failing.join(', ')}`;
  const header = htmlElement('header', {}, [
    htmlElement('h1', {}, escapeXml(input.title)),
    htmlElement('p', { class: `verdict ${verdict.pass || input.diagnostics.notApplicable !== undefined ? 'pass' : 'fail'}`, role: 'status' }, escapeXml(verdictText)),
  ]);
  const warnings = input.warnings?.length
    ? htmlElement('aside', { class: 'warnings', id: 'warnings' }, [htmlElement('strong', {}, 'Warnings'), htmlElement('ul', {}, input.warnings.map(warningItem))])
    : '';
  const head = htmlElement('head', {}, [
    '\n',
    htmlElement('meta', { charset: 'utf-8' }),
    htmlElement('meta', { 'http-equiv': 'Content-Security-Policy', content: CONTENT_SECURITY_POLICY }),
    htmlElement('meta', { name: 'viewport', content: 'width=device-width, initial-scale=1' }),
    htmlElement('meta', { name: 'generator', content: `candela ${input.facts.version}` }),
    '\n',
    htmlElement('title', {}, escapeXml(input.title)),
    '\n',
    htmlElement('style', {}, REPORT_STYLE),
    '\n',
  ]);
  const footer = htmlElement('footer', {}, escapeXml(`Written by candela ${input.facts.version}. This page is self-contained: it loads no files, fonts or scripts.`));
  const body = htmlElement('body', {}, [
    '\n',
    header,
    '\n',
    warnings,
    runSection(input.facts),
    '\n',
    summarySection(input.summary, symbols),
    '\n',
    convergenceSection(input.diagnostics, symbols),
    '\n',
    figuresSection(input.figures),
    '\n',
    ...(input.budget ? [budgetSection(input.budget, symbols), '\n'] : []),
    provenanceSection(input.configurationYaml, input.inputFiles),
    '\n',
    footer,
    '\n',
  ]);
  return `<!DOCTYPE html>\n${htmlElement('html', { lang: 'en' }, ['\n', head, '\n', body, '\n'])}\n`;
}

/** One warning as a list item: its kind (and parameter) in code type, then the sentence. */
function warningItem(warning: string | ReportWarning): string {
  if (typeof warning === 'string') return htmlElement('li', {}, escapeXml(warning));
  const tag = `${warning.code}${warning.parameter ? ` · ${warning.parameter}` : ''}`;
  return htmlElement('li', { 'data-code': warning.code }, `${htmlElement('code', {}, escapeXml(tag))} ${escapeXml(warning.message)}`);
}
