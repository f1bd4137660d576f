import { describe, expect, it } from 'vitest';
import { nestedChainChecksNote, summaryTableNote } from '../../../src/output/index.js';

// Wording of the report page's notes on the samples (formatting only; the Kish count is a plain input).
describe('summaryTableNote', () => {
  it('says nothing for an ensemble run without one-sided limits', () => {
    expect(summaryTableNote({ kishEffectiveSampleSize: null, oneSidedLimits: false })).toBeUndefined();
  });

  it('names the weighted nested samples with their Kish effective sample size rounded', () => {
    expect(summaryTableNote({ kishEffectiveSampleSize: 774.5, oneSidedLimits: false })).toBe('Weighted nested-sampling samples (Kish effective sample size 775).');
  });

  it('adds the one-sided-limit sentence after the weighting one', () => {
    expect(summaryTableNote({ kishEffectiveSampleSize: 90, oneSidedLimits: true })).toBe(
      'Weighted nested-sampling samples (Kish effective sample size 90). A marginal cut by a hard prior edge is quoted as a one-sided 95% limit instead of mean ± sd (see the warnings).',
    );
    expect(summaryTableNote({ kishEffectiveSampleSize: null, oneSidedLimits: true })).toMatch(/^A marginal cut by a hard prior edge/);
  });
});

describe('nestedChainChecksNote', () => {
  it('says the Markov-chain checks do not apply and gives the Kish effective sample size rounded', () => {
    expect(nestedChainChecksNote(1184.6)).toBe('Nested sampling draws independent weighted samples: R-hat and autocorrelation times do not apply. Kish effective sample size of the weights: 1185.');
  });
});
