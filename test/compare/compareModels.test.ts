import { describe, expect, it } from 'vitest';
import { compareModels } from '../../src/compare/index.js';
import type { ModelFitRecord } from '../../src/compare/index.js';
import { isCandelaError } from '../../src/errors.js';
import { fitPolynomial, polynomialLogEvidence } from './support/polynomialFits.js';

/*
 * Worked example: the 5-point data of informationCriteria.test.ts (sigma = 0.3)
 * fitted by a constant (k = 1), a straight line (k = 2) and a parabola (k = 3),
 * with chi2_min from the normal equations and exact evidences under priors
 * N(0, 10^2) on every coefficient (linear-Gaussian marginal likelihood). The
 * expected table entries follow from the definitions (Akaike 1974; Schwarz 1978;
 * Kass & Raftery 1995). By hand: chi2_min(constant) = 39.708 / 0.09 = 441.2,
 * chi2_min(line) = 0.107 / 0.09.
 */
const x = [1, 2, 3, 4, 5];
const y = [2.1, 3.9, 6.2, 7.8, 10.1];
const sigma = 0.3;
const normalization = 5 * Math.log(2 * Math.PI * sigma * sigma);
const ERROR = 0.1;

function record(label: string, coefficients: number, withEvidence = true): ModelFitRecord {
  const { chiSquareMinimum } = fitPolynomial(x, y, sigma, coefficients);
  return {
    label,
    chiSquareMinimum,
    dataCount: 5,
    freeParameterCount: coefficients,
    logLikelihoodMaximum: -0.5 * (chiSquareMinimum + normalization),
    ...(withEvidence ? { logZ: polynomialLogEvidence(x, y, sigma, coefficients, 10), logZError: ERROR } : {}),
  };
}

const constant = record('constant', 1);
const line = { ...record('line', 2), devianceSamples: Float64Array.of(10, 12, 14), devianceAtPosteriorMean: 10 };
const parabola = { ...record('parabola', 3, false), devianceSamples: Float64Array.of(9, 12, 15), devianceAtPosteriorMean: 10 };

describe('compareModels', () => {
  const report = compareModels([constant, line, parabola], {
    baseLabel: 'line',
    nestedPairs: [
      { base: 'constant', extended: 'line' },
      { base: 'line', extended: 'parabola', savageDickey: { logBayesFactor: 1.2, logBayesFactorError: 0.05 } },
    ],
  });
  const rows = Object.fromEntries(report.comparison.rows.map((row) => [row.label, row]));

  it('computes chi2_min of the worked example by the normal equations (441.2 and 0.107 / 0.09 by hand)', () => {
    expect(rows.constant.chiSquareMinimum).toBeCloseTo(441.2, 9);
    expect(rows.line.chiSquareMinimum).toBeCloseTo(0.107 / 0.09, 9);
    expect(rows.parabola.chiSquareMinimum).toBeLessThan(rows.line.chiSquareMinimum);
  });

  it('gives AIC, BIC and their differences from the base (model minus base)', () => {
    const deltaChiSquare = 441.2 - 0.107 / 0.09;
    expect(rows.line.isBase).toBe(true);
    expect(rows.line.deltaAic).toBe(0);
    expect(rows.constant.aic).toBeCloseTo(441.2 + normalization + 2, 9);
    expect(rows.constant.deltaAic).toBeCloseTo(deltaChiSquare - 2, 9);
    expect(rows.constant.deltaBic).toBeCloseTo(deltaChiSquare - Math.log(5), 9);
    expect(rows.parabola.deltaAic).toBeCloseTo(rows.parabola.chiSquareMinimum - rows.line.chiSquareMinimum + 2, 9);
  });

  it('adds DIC only where deviance draws are given (p_D = D_bar - D(theta_bar): 2 for both, DIC 14)', () => {
    expect(rows.line.dic).toBe(14);
    expect(rows.parabola.effectiveParameters).toBe(2);
    expect(rows.parabola.deltaDic).toBe(0);
    expect(rows.constant.dic).toBeNull();
    expect(rows.constant.deltaDic).toBeNull();
  });

  it('reads ln B from evidences, or from the Savage-Dickey ratio of a nested pair with the base', () => {
    const expected = polynomialLogEvidence(x, y, sigma, 1, 10) - polynomialLogEvidence(x, y, sigma, 2, 10);
    expect(rows.constant.logBayesFactor).toBeCloseTo(expected, 12);
    expect(rows.constant.logBayesFactorError).toBeCloseTo(Math.SQRT2 * ERROR, 14);
    expect(rows.constant.bayesFactorSource).toBe('evidence');
    expect(rows.constant.strength).toBe('very strong');
    expect(rows.constant.favours).toBe('base');
    expect(rows.parabola.logBayesFactor).toBe(-1.2);
    expect(rows.parabola.bayesFactorSource).toBe('savage-dickey');
    expect(rows.parabola.strength).toBe('positive');
    expect(rows.parabola.reading).toBe('positive support for line over parabola (2 ln B = -2.40)');
    expect(rows.line.logBayesFactor).toBe(0);
  });

  it('gives each nested pair its delta chi2 significance (m = 1: sigma = sqrt(delta chi2) exactly)', () => {
    const [first, second] = report.comparison.nested;
    expect(first.extraParameters).toBe(1);
    expect(first.deltaChiSquare).toBeCloseTo(441.2 - 0.107 / 0.09, 9);
    expect(first.sigma).toBeCloseTo(Math.sqrt(first.deltaChiSquare), 8);
    expect(second.savageDickeyLogBayesFactor).toBe(1.2);
    expect(second.savageDickeyReading).toBe('positive support for line over parabola (2 ln B = 2.40)');
    expect(report.comparison.notes.some((note) => /ignores the priors/.test(note))).toBe(true);
  });

  it('is JSON-ready: a JSON round trip changes nothing', () => {
    expect(JSON.parse(JSON.stringify(report.comparison))).toEqual(report.comparison);
  });

  it('renders a Markdown table with one line per model and the nested-pair table', () => {
    const lines = report.markdown.split('\n');
    expect(lines[0]).toBe('| Model | k | chi2_min | Delta AIC | Delta BIC | Delta DIC | ln Z | ln B vs line | Reading |');
    expect(lines[3]).toMatch(/^\| line \(base\) \| 2 \| 1\.19 \| \+0\.00 \| \+0\.00 \| \+0\.00 \| -?\d+\.\d\d ± 0\.10 \| - \| base \|$/);
    expect(lines[4]).toMatch(/^\| parabola \| 3 \| .* \| -1\.20 ± 0\.05 \(Savage-Dickey\) \| positive for line \|$/);
    expect(report.markdown).toContain('| line over constant | 1 | 440.01 |');
    expect(report.markdown).toContain('20.98 sigma');
  });

  it('renders LaTeX with escaped labels and numbers in math mode', () => {
    const odd = compareModels([{ ...line, label: 'w_0 & 50%' }, { ...constant, label: 'flat' }], { baseLabel: 'w_0 & 50%' });
    expect(odd.latex).toContain('w\\_0 \\& 50\\% (base) & 2 & $1.19$');
    expect(odd.latex).toContain('\\begin{tabular}{lrrrrrrrl}');
    expect(report.latex).toContain('$^{\\dagger}$');
    expect(report.latex).toMatch(/\$\d\.\d\d\\times 10\^\{-9\d\}\$/);
  });

  it('reports every input problem at once', () => {
    try {
      compareModels(
        [constant, { ...constant }, { ...line, dataCount: 6 }, { ...parabola, chiSquareMinimum: Number.NaN }],
        { baseLabel: 'cubic', nestedPairs: [{ base: 'parabola', extended: 'line' }] },
      );
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error)).toBe(true);
      const codes = (error as { issues: Array<{ code: string; path: string }> }).issues.map((issue) => `${issue.code} ${issue.path}`);
      expect(codes).toEqual([
        'compare.duplicate_label models[1].label',
        'compare.invalid_record models[3].chiSquareMinimum',
        'compare.different_data models',
        'compare.unknown_model baseLabel',
        'compare.not_nested nestedPairs[0]',
      ]);
    }
  });
});
