import { describe, expect, it } from 'vitest';
import { budgetMarkdown } from '../../../src/output/budget/budgetMarkdown.js';
import { budgetFixture } from './budgetFixture.js';

describe('budgetMarkdown', () => {
  const text = budgetMarkdown(budgetFixture());

  it('states the method and the threshold', () => {
    expect(text).toContain('Method: importance reweighting of one set of chains');
    expect(text).toContain('fewer than 200 draws');
  });

  it('prints each shift with its Monte Carlo error at two digits below the sd (w0 sd 0.17: thousandths)', () => {
    expect(text).toContain('| calibration.nearby | 3500 | +0.012 ± 0.002 | −0.05'.replace('−', '-'));
  });

  it('marks a variant whose weights are worth too few draws with a dagger', () => {
    expect(text).toContain('| drift † | 150 |');
  });

  it('keeps the sign of a negative contribution and prints n/a where the linear response failed', () => {
    expect(text).toContain('| host_mass | removed | -0.003 ± 0.010 |');
    expect(text).toContain('| host_mass | shift | n/a | n/a |');
  });

  it('adds the full-fit comparison only for systematics that have one', () => {
    expect(text).toContain('## Full fits of stat + all but one');
    expect(text).toContain('| calibration.nearby | shift | +0.013 (+0.012) |');
    expect(text).not.toMatch(/\| drift \| shift \| .*\(/);
  });
});
