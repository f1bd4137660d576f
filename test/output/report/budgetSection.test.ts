import { describe, expect, it } from 'vitest';
import { budgetFigure } from '../../../src/output/budget/budgetFigure.js';
import { budgetSection } from '../../../src/output/report/budgetSection.js';
import { budgetFixture } from '../budget/budgetFixture.js';

describe('budgetSection', () => {
  const table = budgetFixture();
  const html = budgetSection({ table, svg: budgetFigure(table) });

  it('is empty without a budget', () => {
    expect(budgetSection(undefined)).toBe('');
  });

  it('states the method and has one row per systematic plus three totals', () => {
    expect(html).toContain('<h2>Systematic budget</h2>');
    expect(html).toContain(`Method: ${table.method}`);
    expect(html.match(/<tr>/g)).toHaveLength(1 + table.rows.length);
    expect(html.match(/<tr class="total">/g)).toHaveLength(3);
  });

  it('shows each shift and contribution with its Monte Carlo error, a dagger on a flagged row', () => {
    expect(html).toContain('<td>+0.012 ± 0.002</td><td>0.050 ± 0.004</td>');
    expect(html).toContain('drift †');
  });

  it('inlines the figure with its ids prefixed, so they stay unique on the page', () => {
    expect(html).toContain('<svg');
    expect(html).toContain('id="budget-budget-clip-0"');
  });
});
