import type { Command } from 'commander';
import { mergeParts } from '../../pipeline/index.js';

/** `candela merge PART_DIR... --out DIR`: one run folder from the finished parts of one model. */
export function registerMergeCommand(program: Command): void {
  program
    .command('merge')
    .description('combine the finished part folders of one model (candela fit --part) into one run folder with every output')
    .argument('<partDirs...>', 'part folders of one model, e.g. out/demo/parts/flat_lcdm/ensemble-*')
    .requiredOption('--out <dir>', 'the merged run folder (not one of the parts, nor a folder holding them)')
    .option('--force', 'replace an existing output folder')
    .addHelpText('after', '\nExample:\n  candela merge out/demo/parts/flat_lcdm/ensemble-0 out/demo/parts/flat_lcdm/ensemble-1 --out out/demo/flat_lcdm\n\nThe parts must come from one configuration and seed, one ensemble each; longer parts are cut to the shortest.\n')
    .action(async (partDirs: string[], options: { out: string; force?: boolean }) => {
      const { runDir, record } = await mergeParts({ partDirs, outDir: options.out, force: options.force });
      process.stdout.write(`merged ${record.merge.parts.length} parts of ${record.model.label} (${record.run.steps} steps each, burn-in ${record.run.burn_in_steps}) into ${runDir}\n`);
    });
}
