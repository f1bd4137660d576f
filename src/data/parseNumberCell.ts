/**
 * Strict parsing of one numeric cell. `Number()` alone is too lenient for data
 * files (it reads '' as 0, '0x10' as 16 and ' 1 ' as 1), so a decimal-number
 * pattern is matched first.
 */

/** The outcome of reading a numeric cell. */
export type NumberCell =
  | { kind: 'number'; value: number }
  | { kind: 'empty' }
  | { kind: 'not_a_number' }
  | { kind: 'non_finite'; isNaN: boolean };

const DECIMAL_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NON_FINITE_WORD = /^[+-]?(?:nan|inf|infinity)$/i;

/**
 * Reads a decimal number (optional sign, digits, optional fraction and
 * exponent). Words such as `nan`, `inf`, `-Infinity` and overflowing values
 * like `1e999` are reported as non-finite; anything else that is not a
 * number as `not_a_number`. Cost O(text length). Never throws.
 * @param text the trimmed cell text.
 * @example parseNumberCell('-1.5e-3') // { kind: 'number', value: -0.0015 }
 * @example parseNumberCell('NaN') // { kind: 'non_finite', isNaN: true }
 */
export function parseNumberCell(text: string): NumberCell {
  if (text === '') return { kind: 'empty' };
  if (DECIMAL_NUMBER.test(text)) {
    const value = Number(text);
    return Number.isFinite(value) ? { kind: 'number', value } : { kind: 'non_finite', isNaN: false };
  }
  if (NON_FINITE_WORD.test(text)) return { kind: 'non_finite', isNaN: /nan/i.test(text) };
  return { kind: 'not_a_number' };
}
