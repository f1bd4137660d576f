import { describe, expect, it } from 'vitest';
import { budgetMethod } from '../../../src/output/index.js';

// Wording of the budget's method sentence (formatting only: the numbers are plain inputs).
describe('budgetMethod', () => {
  it('says the errors are for independent draws when no ESS inflation applies, without full fits', () => {
    expect(budgetMethod({ draws: 4000, minEffectiveDraws: 400, inflation: null, fullFits: false })).toBe(
      'importance reweighting of 4000 draws of this run (stat + every systematic) by L_variant / L_all, '
      + 'Monte Carlo errors by the delta method for independent draws, a variant flagged when its weights are worth fewer than 400 draws (Kish count); '
      + 'cross-check: the Gaussian linear response of the same draws (mean and covariance, and a quadratic fit of ln L_variant - ln L_all)',
    );
  });

  it('gives the inflation factor to 2 decimals and the smallest bulk ESS rounded, and names the full fits when made', () => {
    const text = budgetMethod({ draws: 3200, minEffectiveDraws: 250, inflation: { factor: 1.23456, smallestBulkEss: 2099.5 }, fullFits: true });
    expect(text).toContain('by the delta method for independent draws, times sqrt(draws / bulk ESS) = 1.23 (smallest bulk ESS of the run 2100), a variant flagged');
    expect(text).toContain('importance reweighting of 3200 draws');
    expect(text).toContain('worth fewer than 250 draws');
    expect(text.endsWith('; full fits of each stat + all-but-one variant for comparison')).toBe(true);
  });
});
