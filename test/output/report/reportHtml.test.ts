import { describe, expect, it } from 'vitest';
import { convergenceVerdicts, formatWallTime, namespaceSvgIds, reportHtml } from '../../../src/output/report/index.js';
import { findAll, hasClass, parseXml, textContent } from '../figures/xmlTree.js';
import type { XmlNode } from '../figures/xmlTree.js';
import { reportFixture } from './reportFixture.js';

describe('reportHtml', () => {
  const input = reportFixture();
  const html = reportHtml(input);
  const tree = parseXml(html);
  const section = (id: string) => findAll(tree, 'section', (node) => node.attributes.id === id)[0];

  it('is one HTML document that is also well-formed XML, starting with the HTML doctype', () => {
    expect(html.startsWith('<!DOCTYPE html>\n<html lang="en">')).toBe(true);
    expect(tree.name).toBe('html');
    expect(findAll(tree, 'title')[0].text).toBe(input.title);
    expect(findAll(tree, 'h1')[0].text).toBe('Lyra Deep Survey <flat wCDM> & friends');
  });

  it('is self-contained: no script, no external reference, and a policy that forbids fetching', () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/\ssrc=|href="(?!#)|url\((?!#)|@import/i);
    const policy = findAll(tree, 'meta', (node) => node.attributes['http-equiv'] === 'Content-Security-Policy')[0];
    expect(policy.attributes.content).toContain("default-src 'none'");
    expect(findAll(tree, 'style')).toHaveLength(1);
  });

  it('shows the run facts: seed, steps, stop reason, wall time and version', () => {
    const facts = findAll(section('run'), 'dd').map(textContent);
    expect(facts).toEqual(['lyra-2031', '6000', '32', '4', input.facts.stopReason, '12 min 14 s', 'flat wCDM', '2031-04-02T09:15:00Z', '0.1.0']);
  });

  it('shows the caller-rounded summary cells and the parameter symbols', () => {
    const rows = findAll(section('summary'), 'tr').slice(1);
    expect(rows.map((row) => findAll(row, 'td').map(textContent))).toEqual(input.summary.rows.map((row) => row.cells));
    const heading = findAll(rows[0], 'th')[0];
    expect(textContent(heading)).toBe('Ωmomega_m');
    expect(findAll(heading, 'sub')[0].text).toBe('m');
  });

  it('marks each convergence check pass or fail against the thresholds', () => {
    const marks = (row: XmlNode) => findAll(row, 'span', (node) => hasClass(node, 'mark')).map((node) => node.attributes.title);
    const rows = findAll(section('convergence'), 'tr').slice(1);
    // omega_m: all pass (1.003 <= 1.01, 2100 >= 400, 5400 / 48.2 = 112 >= 50).
    expect(marks(rows[0])).toEqual(['pass', 'pass', 'pass']);
    // w0: R-hat 1.012 > 1.01, ESS 380 < 400, 5400 / 130.4 = 41 < 50.
    expect(marks(rows[1])).toEqual(['fail', 'fail', 'fail']);
    // sigma_int: R-hat not finite fails; 5400 / 60 = 90 passes.
    expect(marks(rows[2])).toEqual(['fail', 'pass', 'pass']);
    expect(textContent(rows[2])).toContain('not finite');
    const verdict = findAll(tree, 'p', (node) => hasClass(node, 'verdict'))[0];
    expect(hasClass(verdict, 'fail')).toBe(true);
    expect(verdict.text).toContain('w0, sigma_int_LYRA');
  });

  it('inlines every figure as SVG with ids made unique on the page and every reference resolved', () => {
    const figures = findAll(section('figures'), 'figure');
    expect(figures).toHaveLength(4);
    for (const figure of figures) expect(findAll(figure, 'svg')).toHaveLength(1);
    const ids = findAll(tree, 'clipPath').map((node) => node.attributes.id);
    expect(new Set(ids).size).toBe(ids.length);
    const references = [...html.matchAll(/url\(#([^)]+)\)/g)].map((match) => match[1]);
    expect(references.length).toBeGreaterThan(0);
    for (const reference of references) expect(ids).toContain(reference);
    expect(textContent(figures[0])).toContain('triangle.svg');
  });

  it('shows the resolved configuration escaped in a pre block and the SHA-256 of every input', () => {
    const code = findAll(section('configuration'), 'code')[0];
    expect(code.text).toBe(input.configurationYaml.trimEnd());
    expect(html).toContain('# &lt;b&gt;not bold&lt;/b&gt; &amp; &quot;quoted&quot;');
    const digests = findAll(section('inputs'), 'td', (node) => hasClass(node, 'digest')).map(textContent);
    // SHA-256 of the empty input and of "abc" (FIPS 180-2, appendix B.1), as a caller would compute them.
    expect(digests).toEqual(['e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad']);
  });

  it('lists the warnings', () => {
    expect(findAll(tree, 'li').map(textContent)).toContain('3 supernovae below z = 0.01 were cut');
  });
});

describe('reportHtml with little to show', () => {
  it('omits the figures section, says no inputs were recorded and fails the verdict without numbers', () => {
    const input = { ...reportFixture(), figures: [], inputFiles: [], warnings: [], diagnostics: { ...reportFixture().diagnostics, rows: [] } };
    const tree = parseXml(reportHtml(input));
    expect(findAll(tree, 'section').map((node) => node.attributes.id)).toEqual(['run', 'summary', 'convergence', 'configuration', 'inputs']);
    expect(textContent(findAll(tree, 'section', (node) => node.attributes.id === 'inputs')[0])).toContain('No input files were recorded.');
    expect(findAll(tree, 'aside')).toHaveLength(0);
    expect(findAll(tree, 'p', (node) => hasClass(node, 'verdict'))[0].text).toContain('no convergence numbers');
  });
});

describe('convergenceVerdicts', () => {
  const base = { chainLengthSteps: 5000, rHatMax: 1.01, essMin: 400, tauMultiple: 50 };
  it('passes values exactly at the thresholds (R-hat <= 1.01 and ESS >= 400, Vehtari et al. 2021)', () => {
    const verdicts = convergenceVerdicts({ ...base, rows: [{ parameter: 'w0', rHat: 1.01, ess: 400, autocorrelationTimeSteps: 100 }] });
    expect(verdicts.parameters[0]).toEqual({ parameter: 'w0', rHatPass: true, essPass: true, lengthPass: true, lengthInTaus: 50, pass: true });
    expect(verdicts.pass).toBe(true);
  });
  it('fails non-finite numbers instead of passing them, and an empty list', () => {
    const verdicts = convergenceVerdicts({ ...base, rows: [{ parameter: 'w0', rHat: Number.NaN, ess: Infinity, autocorrelationTimeSteps: Number.NaN }] });
    expect(verdicts.parameters[0]).toMatchObject({ rHatPass: false, essPass: false, lengthPass: false, lengthInTaus: 0, pass: false });
    expect(convergenceVerdicts({ ...base, rows: [] }).pass).toBe(false);
  });
});

describe('formatWallTime', () => {
  it('writes milliseconds, seconds, minutes and hours', () => {
    expect(formatWallTime(0.85)).toBe('850 ms');
    expect(formatWallTime(42.34)).toBe('42.3 s');
    expect(formatWallTime(725)).toBe('12 min 05 s');
    expect(formatWallTime(3 * 3600 + 7 * 60 + 20)).toBe('3 h 07 min');
    expect(formatWallTime(Number.NaN)).toBe('unknown');
  });
});

describe('namespaceSvgIds', () => {
  it('prefixes ids and the url() and href references to them', () => {
    expect(namespaceSvgIds('<clipPath id="c"/><g clip-path="url(#c)"/><use href="#c"/>', 'f1-')).toBe('<clipPath id="f1-c"/><g clip-path="url(#f1-c)"/><use href="#f1-c"/>');
  });
});
