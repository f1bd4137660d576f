import type { Command } from 'commander';
import { buildRunOutputs } from '../../pipeline/index.js';

/** `candela report RUN_DIR...`: rebuild every output from the chains, or overlay several runs. */
export function registerReportCommand(program: Command): void {
  program
    .command('report')
    .description('rebuild the summaries, contours, figures and report page of run folders from their chains, without sampling')
    .argument('<runDirs...>', 'run folders written by candela fit')
    .option('--out <dir>', 'write here instead of into the run folder (required for several runs)')
    .addHelpText('after', '\nExamples:\n  candela report out/demo\n  candela report out/models/flat_lcdm out/models/flat_w0wa --out out/models/overlay\n')
    .action((runDirs: string[], options: { out?: string }) => {
      const outDir = options.out ?? (runDirs.length === 1 ? runDirs[0] : `${runDirs[0]}-overlay`);
      const analyses = buildRunOutputs(runDirs, outDir);
      // A blinded run stays blinded here (only candela unblind shows the truth): say so.
      for (const warning of analyses.flatMap((analysis) => analysis.warnings).filter((w) => w.code === 'blinded')) process.stdout.write(`${warning.message}\n`);
      process.stdout.write(`wrote the outputs of ${runDirs.join(', ')} into ${outDir}\n`);
    });
}
