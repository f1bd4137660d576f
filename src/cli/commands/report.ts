import type { Command } from 'commander';
import { buildRunOutputs } from '../../pipeline/index.js';
import { CandelaError } from '../../errors.js';

/** The --chain-memory value, MB: a number of at least 16. */
function chainMemoryOption(text: string): number {
  const value = Number(text);
  if (!Number.isFinite(value) || value < 16) {
    throw new CandelaError({ code: 'cli.bad_option', path: '--chain-memory', message: 'the memory for the chains must be a number of MB, at least 16', expected: '>= 16', found: text, fix: 'write e.g. --chain-memory 1024' });
  }
  return value;
}

/** `candela report RUN_DIR...`: rebuild every output from the chains, or overlay several runs. */
export function registerReportCommand(program: Command): void {
  program
    .command('report')
    .description('rebuild the summaries, contours, figures and report page of run folders from their chains, without sampling')
    .argument('<runDirs...>', 'run folders written by candela fit')
    .option('--out <dir>', 'write here instead of into the run folder (required for several runs)')
    .option('--chain-memory <MB>', 'memory the chains of each run may take, MB (default: the run\'s output.chain_memory_mb, else 1024); longer runs are read every k-th step')
    .addHelpText('after', '\nExamples:\n  candela report out/demo\n  candela report out/models/flat_lcdm out/models/flat_w0wa --out out/models/overlay\n')
    .action((runDirs: string[], options: { out?: string; chainMemory?: string }) => {
      const outDir = options.out ?? (runDirs.length === 1 ? runDirs[0] : `${runDirs[0]}-overlay`);
      const analyses = buildRunOutputs(runDirs, outDir, options.chainMemory === undefined ? {} : { chainMemoryMb: chainMemoryOption(options.chainMemory) });
      // A blinded run stays blinded here (only candela unblind shows the truth): say so.
      for (const warning of analyses.flatMap((analysis) => analysis.warnings).filter((w) => w.code === 'blinded')) process.stdout.write(`${warning.message}\n`);
      process.stdout.write(`wrote the outputs of ${runDirs.join(', ')} into ${outDir}\n`);
    });
}
