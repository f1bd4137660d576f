import type { Command } from 'commander';
import { registerCheckCommand } from './check.js';
import { registerDistancesCommand } from './distances.js';
import { registerInitCommand } from './init.js';
import { registerFitCommand } from './fit.js';
import { registerStandardizeCommand } from './standardize.js';
import { registerReportCommand } from './report.js';
import { registerSimulateCommand } from './simulate.js';
import { registerCompareCommand } from './compare.js';
import { registerMergeCommand } from './merge.js';
import { registerBudgetCommand } from './budget.js';
import { registerUnblindCommand } from './unblind.js';

/**
 * Every sub-command registers itself here: one import and one call per
 * command, so a new command is a new file plus one line.
 */
export function registerCommands(program: Command): void {
  void program;
  registerInitCommand(program);
  registerCheckCommand(program);
  registerDistancesCommand(program);
  registerStandardizeCommand(program);
  registerFitCommand(program);
  registerReportCommand(program);
  registerSimulateCommand(program);
  registerCompareCommand(program);
  registerMergeCommand(program);
  registerBudgetCommand(program);
  registerUnblindCommand(program);
}
