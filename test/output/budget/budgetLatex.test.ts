import { describe, expect, it } from 'vitest';
import { budgetLatex } from '../../../src/output/budget/budgetLatex.js';
import { budgetFixture } from './budgetFixture.js';

describe('budgetLatex', () => {
  const text = budgetLatex(budgetFixture());

  it('has a shift and a contribution column per parameter, with symbols', () => {
    expect(text).toContain('\\begin{tabular}{lrrrr}');
    expect(text).toContain('$\\Delta w_0$ & $\\sigma_k(w_0)$');
  });

  it('escapes names and marks a flagged row with a dagger', () => {
    expect(text).toContain('host\\_mass & ');
    expect(text).toContain('drift$^\\dagger$ & $-0.031$ & $0.060$');
  });

  it('ends with the statistical, systematic and total rows, and the method in a comment', () => {
    expect(text).toContain('Statistical & -- & $0.150$ & -- & $0.800$ \\\\');
    expect(text).toMatch(/^% Systematic budget of Kestrel demo survey \(flat\\_w0wa\): importance reweighting/);
    expect(text.trimEnd().endsWith('\\end{tabular}')).toBe(true);
  });
});
