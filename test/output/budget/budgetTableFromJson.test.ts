import { describe, expect, it } from 'vitest';
import { budgetJson } from '../../../src/output/budget/budgetJson.js';
import { budgetTableFromJson } from '../../../src/output/budget/budgetTableFromJson.js';
import { budgetFixture } from './budgetFixture.js';

describe('budgetTableFromJson', () => {
  it('reads budgetJson back to the same table (nulls of the linear response stay null)', () => {
    const table = budgetFixture();
    expect(budgetTableFromJson(budgetJson(table))).toEqual(table);
  });

  it('gives null for text that is not a budget', () => {
    expect(budgetTableFromJson('not json')).toBeNull();
    expect(budgetTableFromJson('{"title": "x"}')).toBeNull();
  });
});
