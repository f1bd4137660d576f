import { describe, expect, it } from 'vitest';
import { detectDelimiter, splitFields } from '../../src/data/splitFields.js';

describe('splitFields', () => {
  it('splits on runs of whitespace and reports 1-based columns', () => {
    expect(splitFields('  a  bb\tc ', 'whitespace')).toEqual([{ text: 'a', column: 3 }, { text: 'bb', column: 6 }, { text: 'c', column: 9 }]);
  });
  it('keeps empty tab-separated fields', () => {
    expect(splitFields('a\t\tc', 'tab').map((f) => f.text)).toEqual(['a', '', 'c']);
  });
  it('unquotes CSV fields: commas inside quotes and "" for one quote (RFC 4180, section 2)', () => {
    expect(splitFields('"x, y",2,"say ""hi""",', 'comma').map((f) => f.text)).toEqual(['x, y', '2', 'say "hi"', '']);
  });
});

describe('detectDelimiter', () => {
  it('prefers tab, then comma, then whitespace', () => {
    expect([detectDelimiter('a\tb,c'), detectDelimiter('a,b c'), detectDelimiter('a b')]).toEqual(['tab', 'comma', 'whitespace']);
  });
});
