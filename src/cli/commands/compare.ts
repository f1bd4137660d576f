import { dirname, join } from 'node:path';
import type { Command } from 'commander';
import { compareRuns } from '../../pipeline/index.js';

/** Name of the default output folder, next to the first run folder. */
const DEFAULT_OUT_NAME = 'comparison';

/**
 * `candela compare RUN_DIR... [--base LABEL] [--out DIR] [--force]`: information
 * criteria, evidences and Bayes factors, Savage-Dickey ratios of nested
 * pairs and the dark-energy figures for several fitted models.
 */
export function registerCompareCommand(program: Command): void {
  program
    .command('compare')
    .description('compare fitted models: chi-square, AIC, BIC, DIC, evidences and Bayes factors, Savage-Dickey ratios of nested pairs, and overlaid dark-energy figures')
    .argument('<runDirs...>', 'run folders written by candela fit (ensemble or nested sampling)')
    .option('--base <label>', 'model label every difference and Bayes factor is taken against (default: the first run\'s)')
    .option('--out <dir>', `output folder (default: ${DEFAULT_OUT_NAME}/ next to the first run folder)`)
    .option('--force', 'replace the contents of an existing output folder (an earlier comparison\'s files are removed)')
    .addHelpText('after', '\nExamples:\n  candela compare out/lyra/flat_lcdm out/lyra/flat_wcdm out/lyra/flat_w0wa\n  candela compare out/lyra/flat_lcdm out/lyra/flat_wcdm --base flat_lcdm --out out/lyra/models --force\n')
    .action((runDirs: string[], options: { base?: string; out?: string; force?: boolean }) => {
      const outDir = options.out ?? join(dirname(runDirs[0]), DEFAULT_OUT_NAME);
      const outcome = compareRuns({ runDirs, baseLabel: options.base, outDir, force: Boolean(options.force) });
      for (const warning of outcome.warnings) process.stderr.write(`warning: ${warning}\n`);
      process.stdout.write(`wrote ${outcome.files.join(', ')} into ${outDir}\n`);
    });
}
