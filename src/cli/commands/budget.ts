import type { Command } from 'commander';
import { CandelaError } from '../../errors.js';
import { runBudget } from '../../pipeline/index.js';

interface BudgetFlags {
  draws?: string;
  minEffective?: string;
  parameters?: string;
  full?: boolean;
  report?: boolean;
}

/** A whole number from an option, or a CandelaError naming the option. */
function wholeNumber(flag: string, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  if (!Number.isInteger(value)) {
    throw new CandelaError({ code: 'cli.bad_option', path: flag, message: `${flag} takes a whole number`, expected: 'a whole number', found: text, fix: `e.g. ${flag} 4000` });
  }
  return value;
}

/**
 * `candela budget RUN_DIR`: the systematic-uncertainty budget of a finished
 * run (docs/budget.md), by importance reweighting of its chains, written
 * into the run folder as budget.md, budget.tex, budget.json and
 * figures/budget.svg.
 */
export function registerBudgetCommand(program: Command): void {
  program
    .command('budget')
    .description('weigh each named systematic of a run: the shift of every mean when it is removed and its error contribution, by reweighting the run\'s chains')
    .argument('<runDir>', 'a run folder written by candela fit (ensemble sampler)')
    .option('--draws <n>', 'most draws of the chains to reweight (default 4000)')
    .option('--min-effective <n>', 'flag a variant whose weights are worth fewer draws than this (default 400)')
    .option('--parameters <names>', 'comma-separated parameters for the tables and figure (default: every sampled parameter)')
    .option('--full', 'also fit every stat + all-but-one variant in full, to check the reweighting (slow)')
    .option('--no-report', 'do not rebuild report.html and the other outputs of the run afterwards')
    .addHelpText('after', '\nExamples:\n  candela budget out/demo\n  candela budget out/demo --parameters w0,wa --full\n')
    .action(async (runDir: string, flags: BudgetFlags) => {
      const outcome = await runBudget({
        runDir, maxDraws: wholeNumber('--draws', flags.draws), minEffectiveDraws: wholeNumber('--min-effective', flags.minEffective),
        parameters: flags.parameters?.split(',').map((name) => name.trim()).filter((name) => name !== ''), full: flags.full, report: flags.report,
        onProgress: (line) => process.stderr.write(`${line}\n`),
      });
      for (const path of outcome.changedInputs) process.stderr.write(`warning: ${path} changed since the fit; the reweighted numbers assume the draws follow today's likelihood\n`);
      const flagged = outcome.table.rows.filter((row) => !row.reliable).map((row) => row.name);
      const lines = [
        `weighed ${outcome.table.rows.length} systematics of ${runDir} with ${outcome.table.drawCount} draws in ${outcome.wallSeconds.toFixed(1)} s`,
        ...(flagged.length > 0 ? [`reweighting worth fewer than ${outcome.table.minEffectiveCount} draws for ${flagged.join(', ')}: trust the linear response there, or run --full`] : []),
        ...outcome.files.map((path) => `  wrote ${path}`),
      ];
      process.stdout.write(`${lines.join('\n')}\n`);
    });
}
