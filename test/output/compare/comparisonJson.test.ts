import { describe, expect, it } from 'vitest';
import { COMPARISON_SCHEMA, comparisonJsonText } from '../../../src/output/index.js';
import { handBuiltComparison } from './comparisonDocumentFixture.js';

describe('comparisonJsonText', () => {
  it('indents by two spaces, ends in a line break and reads back to the same document', () => {
    const document = handBuiltComparison();
    const text = comparisonJsonText(document);
    expect(text.startsWith(`{\n  "schema": "${COMPARISON_SCHEMA}",\n  "base": "flat_lcdm",`)).toBe(true);
    expect(text.endsWith('}\n')).toBe(true);
    expect(JSON.parse(text)).toEqual(document);
  });
});
