import { describe, expect, it } from 'vitest';
import { comparisonMarkdownDetails, dicMissingNotice } from '../../../src/output/index.js';
import { handBuiltComparison } from './comparisonDocumentFixture.js';

describe('dicMissingNotice', () => {
  it('names each model without a DIC and the reason, as a quoted warning ending in a blank line', () => {
    expect(dicMissingNotice(handBuiltComparison())).toBe('> **Warning: DIC missing** for flat_wcdm: no posterior mean.\n\n');
  });

  it('is empty when every model has its DIC', () => {
    const document = handBuiltComparison();
    document.models[1].dic_missing = null;
    expect(dicMissingNotice(document)).toBe('');
  });
});

describe('comparisonMarkdownDetails', () => {
  const lines = comparisonMarkdownDetails(handBuiltComparison()).split('\n');

  it('lists the absolute criteria per model at two decimals, a missing DIC as MISSING', () => {
    expect(lines.slice(0, 3)).toEqual(['', '## Criteria', '']);
    expect(lines).toContain('| flat_lcdm | 40 | 1 | 39.30 | -154.43 | -152.74 | -154.44 | 0.99 | ensemble |');
    expect(lines).toContain('| flat_wcdm | 40 | 2 | 39.21 | -152.52 | -149.14 | MISSING | - | ensemble |');
  });

  it('gives ln B01 of a nested pair two ways, with their difference over the quadrature sum of the errors', () => {
    // (1.9064 - 1.86) / hypot(0.027, 0.04) = 0.0464 / 0.048260 = 0.96
    expect(lines).toContain('| flat_wcdm over flat_lcdm | w0 = -1 | 1.91 ± 0.03 | 1.86 ± 0.04 | 0.96 |');
  });

  it('ends with the changed input files and the warnings', () => {
    expect(lines.slice(-9)).toEqual(['', '## Changed input files', '', '- flat_wcdm: data/bins.txt has SHA-256 ab12, the fit recorded none', '', '## Warnings', '', '- flat_wcdm: DIC missing', '']);
  });
});
