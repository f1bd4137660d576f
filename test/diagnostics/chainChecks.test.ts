import { describe, expect, it } from 'vitest';
import { essBulk, essTail, rankNormalizedSplitRhat, splitRhat } from '../../src/diagnostics/index.js';

function issuesOf(run: () => unknown): Array<{ code: string; path?: string; row?: number }> {
  try {
    run();
  } catch (error) {
    return (error as { issues: Array<{ code: string; path?: string; row?: number }> }).issues;
  }
  return [];
}

const six = (offset: number): Float64Array => Float64Array.from({ length: 6 }, (_, index) => Math.sin(index + offset));

describe('input checks of the R-hat and ESS functions', () => {
  it('reject no chains, unequal lengths and too few draws with their codes', () => {
    expect(issuesOf(() => splitRhat([]))[0].code).toBe('diagnostics.no_chains');
    expect(issuesOf(() => essBulk([six(0), Float64Array.of(1, 2, 3, 4, 5, 6, 7)]))[0]).toMatchObject({ code: 'diagnostics.unequal_chains', path: 'chains[1]' });
    expect(issuesOf(() => rankNormalizedSplitRhat([Float64Array.of(1, 2, 3, 4, 5)]))[0].code).toBe('diagnostics.too_few_draws');
  });

  it('reject a non-finite draw, naming chain and 1-based row', () => {
    const bad = six(1);
    bad[3] = Number.POSITIVE_INFINITY;
    expect(issuesOf(() => essTail([six(0), bad]))[0]).toMatchObject({ code: 'diagnostics.non_finite_draw', path: 'chains[1]', row: 4 });
  });

  it('reject constant draws, for which R-hat and ESS are undefined (the reference returns NA)', () => {
    const constant = [new Float64Array(8).fill(1.5), new Float64Array(8).fill(1.5)];
    for (const compute of [splitRhat, rankNormalizedSplitRhat, essBulk, essTail]) {
      expect(issuesOf(() => compute(constant))[0].code).toBe('diagnostics.constant_draws');
    }
  });

  it('give R-hat = +Infinity when every half-chain is constant but they differ (W = 0 in Gelman & Rubin 1992)', () => {
    expect(splitRhat([Float64Array.of(1, 1, 1, 2, 2, 2)])).toBe(Infinity);
  });
});
