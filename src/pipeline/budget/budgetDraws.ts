import type { ChainTable } from '../../output/index.js';

/** Draws of a run kept for the budget: n x p row major in the posterior's parameter order. */
export interface BudgetDraws {
  values: Float64Array;
  count: number;
  /** Rows of the chains table they come from. */
  rows: Int32Array;
}

/**
 * Picks at most `maxDraws` draws after the burn-in, evenly spaced over the
 * kept rows (every k-th row, k = ceil(kept / maxDraws)), so that successive
 * draws are k rows, about k / walkers steps, apart: with k at least the
 * ensemble's autocorrelation time in rows they are close to independent,
 * which the budget's Monte Carlo errors assume. Deterministic.
 *
 * Cost: O(kept rows + n p).
 * @param chains the run's chains (equally weighted ensemble draws).
 * @param names the posterior's parameter names, in theta order (columns of the chains).
 * @param maxDraws the most draws to keep (>= 1).
 * @returns the draws and their rows.
 */
export function budgetDraws(chains: ChainTable, names: readonly string[], maxDraws: number): BudgetDraws {
  const kept: number[] = [];
  for (let r = 0; r < chains.rows; r++) if (chains.burnIn[r] === 0) kept.push(r);
  const stride = Math.max(1, Math.ceil(kept.length / maxDraws));
  const rows = Int32Array.from(kept.filter((_, index) => index % stride === 0));
  const p = names.length;
  const values = new Float64Array(rows.length * p);
  rows.forEach((row, i) => names.forEach((name, j) => { values[i * p + j] = chains.columns[name][row]; }));
  return { values, count: rows.length, rows };
}
