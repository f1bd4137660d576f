import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { budgetTableFromJson, type ReportBudget } from '../../output/index.js';
import { BUDGET_FILES } from './budgetFiles.js';

/**
 * The systematic budget a run folder holds (written by `candela budget`):
 * budget.json and figures/budget.svg, for the report page. Absent, unreadable
 * or of another format: undefined (the page then has no budget section).
 * Cost: two file reads.
 * @param runDir the run folder.
 * @example storedBudget('out/demo')?.table.rows.length // 6 after candela budget out/demo
 */
export function storedBudget(runDir: string): ReportBudget | undefined {
  try {
    const table = budgetTableFromJson(readFileSync(join(runDir, BUDGET_FILES.json), 'utf8'));
    const svg = readFileSync(join(runDir, BUDGET_FILES.figure), 'utf8');
    return table ? { table, svg } : undefined;
  } catch {
    return undefined;
  }
}
