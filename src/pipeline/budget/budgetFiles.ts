import { join } from 'node:path';

/** The files `candela budget` writes into a run folder (the report shows the budget when they are present). */
export const BUDGET_FILES = {
  markdown: 'budget.md',
  latex: 'budget.tex',
  json: 'budget.json',
  figure: join('figures', 'budget.svg'),
} as const;
