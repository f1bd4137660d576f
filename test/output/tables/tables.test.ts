import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createRandomStream, marginalDensity1D } from '../../../src/math/index.js';
import {
  parameterSymbol, parameterSymbols, summaryLatex, summaryMarkdown, summaryTerminal, terminalMarginals,
} from '../../../src/output/index.js';
import { HAND_BUILT_SUMMARY } from './handBuiltSummary.js';

// Golden files: regenerate with CANDELA_UPDATE_GOLDEN=1 after checking the new text by eye.
function expectGolden(text: string, file: string): void {
  const path = `test/golden/${file}`;
  if (process.env.CANDELA_UPDATE_GOLDEN) writeFileSync(path, text);
  expect(existsSync(path), `${path} is missing: run with CANDELA_UPDATE_GOLDEN=1 and check it`).toBe(true);
  expect(text).toBe(readFileSync(path, 'utf8'));
}

/** Terminal columns of a line (code points without combining marks). */
function columns(line: string): number {
  return [...line].filter((character) => !/[\u0300-\u036f]/.test(character)).length;
}

describe('parameterSymbols', () => {
  it('writes the conventional symbols and units', () => {
    // Symbols of the trade (common practice): Omega_m, w0, wa, H0 [km s^-1 Mpc^-1], alpha, beta, M_B, Delta_M, sigma_int.
    expect(parameterSymbols.omega_m).toMatchObject({ latex: '\\Omega_{\\rm m}', label: 'Ωm', labelBase: 'Ω', labelSubscript: 'm' });
    expect(parameterSymbols.h0).toMatchObject({ latex: 'H_0', label: 'H0', unit: 'km s⁻¹ Mpc⁻¹' });
    expect(parameterSymbols.sigma_int.latex).toBe('\\sigma_{\\rm int}');
    expect(parameterSymbols.mass_step.latex).toBe('\\Delta_M');
    expect(parameterSymbols.age_gyr.unit).toBe('Gyr');
  });
  it('adds the sample to per-sample names and falls back to the name in roman type', () => {
    expect(parameterSymbol('sigma_int_LOWZ')).toMatchObject({ latex: '\\sigma_{\\rm int}^{\\rm LOWZ}', label: 'σint[LOWZ]', labelSubscript: 'int[LOWZ]' });
    expect(parameterSymbol('my_nuisance')).toMatchObject({ latex: '\\mathrm{my\\_nuisance}', label: 'my_nuisance' });
  });
});

describe('summaryMarkdown', () => {
  const text = summaryMarkdown(HAND_BUILT_SUMMARY);
  it('rounds each row by the PDG rule', () => {
    // omega_m by hand: errors +0.0219 / -0.0214 -> smaller 0.0214 (digits 214, two digits) -> thousandths.
    expect(text).toContain('| Ωm `omega_m` | 0.298 ± 0.022 | 0.298 +0.022 -0.021 | [0.255, 0.342] | [0.277, 0.320] | 0.297 | 1.002 | 4120 | 3580 |');
    // wa by hand: errors +0.69 / -0.79 -> smaller 0.69 (digits 690, one digit) -> tenths: -0.5 +0.7 -0.8; sd 0.745 -> -0.6 ± 0.7.
    expect(text).toContain('| wa `wa` | -0.6 ± 0.7 | -0.5 +0.7 -0.8 |');
    // h0 has no diagnostics: dashes.
    expect(text).toMatch(/\| H0 `h0` \[km s⁻¹ Mpc⁻¹\] \| 70.1 ± 1.3 \| 70.0 \+1.3 -1.2 \| .* \| — \| — \| — \|/);
  });
  it('matches the golden file', () => expectGolden(text, 'summary.md'));
});

describe('summaryLatex', () => {
  it('writes symbols, units and superscript/subscript errors, and matches the golden file', () => {
    const text = summaryLatex(HAND_BUILT_SUMMARY);
    expect(text).toContain('$\\Omega_{\\rm m}$ & $0.298 \\pm 0.022$ & $0.298^{+0.022}_{-0.021}$ & $[0.255,\\,0.342]$ \\\\');
    expect(text).toContain('$H_0$ [km\\,s$^{-1}$\\,Mpc$^{-1}$]');
    expect(text.match(/\\begin\{tabular\}/g)).toHaveLength(1);
    expectGolden(text, 'table.tex');
  });
  it('adds R-hat and ESS columns on request', () => {
    const text = summaryLatex(HAND_BUILT_SUMMARY, { includeDiagnostics: true, includeMean: false });
    expect(text).toContain('\\begin{tabular}{lccccc}');
    expect(text).toContain('$w_a$ & $-0.5^{+0.7}_{-0.8}$ & $[-2.3,\\,0.7]$ & 1.012 & 388 & 512 \\\\');
  });
});

describe('summaryTerminal', () => {
  it('fits 80 columns, flags values beyond the limits, and matches the golden file', () => {
    const text = summaryTerminal(HAND_BUILT_SUMMARY, { rHatMax: 1.01, essMin: 400 });
    for (const line of text.trimEnd().split('\n')) expect(columns(line)).toBeLessThanOrEqual(80);
    const waLine = text.split('\n').find((line) => line.startsWith('wa'));
    expect(waLine).toMatch(/1\.012!\s+388\/512!$/);
    expect(text).toContain('! beyond the limits R-hat <= 1.01 ESS >= 400');
    expectGolden(text, 'summary-terminal.txt');
  });
  it('cuts the label column when the terminal is narrow', () => {
    const text = summaryTerminal(HAND_BUILT_SUMMARY, { width: 66 });
    for (const line of text.trimEnd().split('\n')) expect(columns(line)).toBeLessThanOrEqual(66);
    expect(text).toContain('…');
  });
});

describe('terminalMarginals', () => {
  it('draws one small chart per parameter, 62 columns wide, peaking near the middle of a centred normal', () => {
    const stream = createRandomStream('terminal-marginal');
    const values = Float64Array.from({ length: 4000 }, () => 0.3 + 0.02 * stream.normal());
    const marginal = marginalDensity1D('omega_m', values, { range: [0.2, 0.4] });
    const text = terminalMarginals([marginal, { ...marginal, parameter: 'h0' }], { captions: { omega_m: '0.300 ± 0.020' } });
    const blocks = text.trimEnd().split('\n\n');
    expect(blocks).toHaveLength(2);
    const lines = blocks[0].split('\n');
    expect(lines[0]).toBe('Ωm (omega_m)  0.300 ± 0.020');
    expect(lines).toHaveLength(1 + 6 + 1); // title, height 5 + baseline, axis
    for (const line of text.split('\n')) expect(columns(line)).toBeLessThanOrEqual(62);
    // The top row holds the peak: its drawn characters sit around column 2 + 30 (the centre 0.3 of [0.2, 0.4]).
    const top = lines[1];
    const drawn = [...top].map((character, k) => (k >= 2 && character !== ' ' ? k : -1)).filter((k) => k >= 0);
    expect(Math.abs((Math.min(...drawn) + Math.max(...drawn)) / 2 - 32)).toBeLessThanOrEqual(2);
    expect(lines[7]).toMatch(/^ {2}0\.200 .* 0\.300 .* 0\.400$/);
  });
});
