import { describe, expect, it } from 'vitest';
import { budgetJson } from '../../../src/output/budget/budgetJson.js';
import { budgetFixture } from './budgetFixture.js';

describe('budgetJson', () => {
  const document = JSON.parse(budgetJson(budgetFixture()));

  it('uses snake_case keys and full precision', () => {
    expect(document.min_effective_draws).toBe(200);
    expect(document.systematics[0].parameters.w0.shift_when_removed).toBe(0.0123);
    expect(document.systematics[0].parameters.wa.full_fit_contribution).toBe(0.31);
    expect(document.systematics[0].parameters.w0.contribution_removed_mc_error).toBe(0.004);
    expect(document.parameters.w0).toEqual({ mean: -0.95, sd: 0.17, statistical_sd: 0.15, systematic_sd: 0.08 });
  });

  it('writes null, never NaN, where a number is missing', () => {
    expect(document.systematics[2].parameters.w0.linear_shift).toBeNull();
    expect(document.systematics[1].parameters.w0.full_fit_shift).toBeNull();
    expect(budgetJson(budgetFixture())).not.toContain('NaN');
  });
});
