import { describe, expect, it } from 'vitest';
import { budgetFigure } from '../../../src/output/budget/budgetFigure.js';
import { SERIES_COLORS } from '../../../src/output/figures/palette.js';
import { budgetFixture } from './budgetFixture.js';

describe('budgetFigure', () => {
  const svg = budgetFigure(budgetFixture());

  it('draws one bar per parameter and systematic in each of the two panels, in the series colours', () => {
    expect(svg.match(/class="budget-bar"/g)).toHaveLength(2 * 3 * 2);
    expect(svg).toContain(`fill="${SERIES_COLORS[0]}"`);
    expect(svg).toContain(`fill="${SERIES_COLORS[1]}"`);
  });

  it('draws a Monte Carlo error bar on each shift and each contribution', () => {
    expect(svg.match(/class="budget-error"/g)).toHaveLength(12);
  });

  it('labels the rows by name, the flagged one with a dagger', () => {
    expect(svg).toContain('host_mass');
    expect(svg).toContain('drift †');
  });

  it('refuses a budget without systematics', () => {
    expect(() => budgetFigure({ ...budgetFixture(), rows: [] })).toThrow(/at least one systematic/);
  });
});
