import { describe, expect, it } from 'vitest';
import { DEFAULT_PARAMETER_SYMBOLS, parameterLabel, parseRichText, richTextToPlain, richTextToSvg } from '../../../src/output/figures/index.js';
import { richTextToHtml } from '../../../src/output/report/index.js';
import { findAll, parseXml, textContent } from './xmlTree.js';

describe('parseRichText', () => {
  it('reads Greek letters, roman-font commands and braced subscripts as TeX does', () => {
    expect(parseRichText('\\Omega_{\\rm m}')).toEqual([{ text: 'Ω', shift: 'base' }, { text: 'm', shift: 'sub' }]);
    expect(parseRichText('\\Omega_\\mathrm{DE}')).toEqual([{ text: 'Ω', shift: 'base' }, { text: 'DE', shift: 'sub' }]);
  });
  it('applies an unbraced script to one token only, and writes a minus sign in scripts', () => {
    expect(parseRichText('w_0 + w_a')).toEqual([
      { text: 'w', shift: 'base' }, { text: '0', shift: 'sub' }, { text: ' + w', shift: 'base' }, { text: 'a', shift: 'sub' },
    ]);
    expect(richTextToPlain('km s^{-1} Mpc^-1')).toBe('km s\u22121 Mpc\u22121');
    expect(parseRichText('s^-1 x')[1]).toEqual({ text: '\u22121', shift: 'super' });
  });
  it('passes plain text through and keeps escaped special characters literal', () => {
    expect(richTextToPlain('redshift z')).toBe('redshift z');
    expect(richTextToPlain('sigma\\_int 5\\%')).toBe('sigma_int 5%');
  });
});

describe('richTextToSvg', () => {
  it('draws scripts as smaller tspans with a numeric baseline shift, in well-formed markup', () => {
    const markup = `<text>${richTextToSvg('H_0 [km s^{-1} Mpc^{-1}] & <more>', 12)}</text>`;
    const tree = parseXml(markup);
    expect(textContent(tree)).toBe('H0 [km s\u22121 Mpc\u22121] & <more>');
    const spans = findAll(tree, 'tspan');
    expect(spans.map((span) => span.text)).toEqual(['0', '\u22121', '\u22121']);
    expect(Number(spans[0].attributes['baseline-shift'])).toBeLessThan(0);
    expect(Number(spans[1].attributes['baseline-shift'])).toBeGreaterThan(0);
    expect(Number(spans[0].attributes['font-size'])).toBeLessThan(12);
  });
});

describe('richTextToHtml', () => {
  it('uses sub and sup elements', () => {
    expect(richTextToHtml('\\Omega_{\\rm m} < 1')).toBe('Ω<sub>m</sub> &lt; 1');
    expect(richTextToHtml('s^{-1}')).toBe('s<sup>\u22121</sup>');
  });
});

describe('parameterLabel', () => {
  it('gives the symbol and unit of a known parameter from the output layer table', () => {
    expect(richTextToPlain(parameterLabel('omega_m'))).toBe('Ωm');
    expect(parameterLabel('h0')).toBe('H_0 [km s⁻¹ Mpc⁻¹]');
  });
  it('writes the sample of a per-sample parameter as a superscript and unknown names in roman', () => {
    expect(parseRichText(parameterLabel('sigma_int_LOW_Z'))).toEqual([
      { text: 'σ', shift: 'base' }, { text: 'int', shift: 'sub' }, { text: 'LOW_Z', shift: 'super' }, { text: ' [mag]', shift: 'base' },
    ]);
    expect(richTextToPlain(parameterLabel('my_param'))).toBe('my_param');
  });
  it('takes a caller-given symbol map, naming samples of known bases in parentheses', () => {
    const symbols = { omega_m: { latex: '\\Omega_M', label: 'ΩM' }, sigma_int: { latex: '\\sigma', label: 'σ', unit: 'mag' } };
    expect(parameterLabel('omega_m', symbols)).toBe('\\Omega_M');
    expect(richTextToPlain(parameterLabel('sigma_int_LOW_Z', symbols))).toBe('σ (LOW_Z) [mag]');
    expect(richTextToPlain(parameterLabel('w0', symbols))).toBe('w0');
    expect(DEFAULT_PARAMETER_SYMBOLS.wa.latex).toBe('w_a');
  });
});
