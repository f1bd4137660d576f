import { describe, expect, it } from 'vitest';
import { parseNumberCell } from '../../src/data/parseNumberCell.js';

describe('parseNumberCell', () => {
  it('reads decimal numbers with sign, fraction and exponent', () => {
    expect(['1', '-0.5', '.25', '3.', '7.9211E-05', '+2e3'].map((t) => parseNumberCell(t))).toEqual(
      [1, -0.5, 0.25, 3, 7.9211e-5, 2000].map((value) => ({ kind: 'number', value })),
    );
  });
  it('rejects what Number() would accept but a data file should not contain', () => {
    expect(['0x10', '1,5', 'twenty', '1e'].map((t) => parseNumberCell(t).kind)).toEqual(['not_a_number', 'not_a_number', 'not_a_number', 'not_a_number']);
    expect(parseNumberCell('')).toEqual({ kind: 'empty' });
  });
  it('reports nan, inf and overflow as non-finite', () => {
    expect(parseNumberCell('NaN')).toEqual({ kind: 'non_finite', isNaN: true });
    expect(parseNumberCell('-inf')).toEqual({ kind: 'non_finite', isNaN: false });
    expect(parseNumberCell('1e999')).toEqual({ kind: 'non_finite', isNaN: false });
  });
});
