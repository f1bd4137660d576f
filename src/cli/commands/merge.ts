import type { Command } from 'commander';
import { mergeParts } from '../../pipeline/index.js';

/** Exit code of a merge whose merged run misses target_ess or max_rhat (its folder is written; the parts need more steps). */
export const EXIT_NOT_CONVERGED = 3;

/** `candela merge PART_DIR... --out DIR`: one run folder from the finished parts of one model, judged against the targets. */
export function registerMergeCommand(program: Command): void {
  program
    .command('merge')
    .description('combine the finished part folders of one model (candela fit --part) into one run folder with every output')
    .argument('<partDirs...>', 'part folders of one model, e.g. out/demo/parts/flat_lcdm/ensemble-*')
    .requiredOption('--out <dir>', 'the merged run folder (not one of the parts, nor a folder holding them)')
    .option('--force', 'replace an existing output folder')
    .addHelpText('after', `\nExample:\n  candela merge out/demo/parts/flat_lcdm/ensemble-0 out/demo/parts/flat_lcdm/ensemble-1 --out out/demo/flat_lcdm\n\nThe parts must come from one configuration and seed, one ensemble each; longer parts are cut to the shortest.\nThe merged run is checked against sampler.target_ess and sampler.max_rhat: when it misses them the folder is\nstill written, the shortfalls and the steps to continue the parts to are printed, and the exit code is ${EXIT_NOT_CONVERGED}.\n`)
    .action(async (partDirs: string[], options: { out: string; force?: boolean }) => {
      const { runDir, record, verdict } = await mergeParts({ partDirs, outDir: options.out, force: options.force });
      const facts = `${record.merge.parts.length} parts of ${record.model.label} (${record.run.steps} steps each, burn-in ${record.run.burn_in_steps}) into ${runDir}`;
      if (verdict.targetsMet) {
        process.stdout.write(`merged ${facts}: converged (bulk ESS >= ${record.run.target_ess}, R-hat <= ${record.run.max_rhat} for every parameter)\n`);
        for (const note of verdict.shortfalls) process.stderr.write(`note: ${note}\n`);
        return;
      }
      process.stdout.write(`merged ${facts}\n`);
      process.stderr.write([
        `NOT CONVERGED: the merged run of ${record.model.label} misses its targets (target_ess ${record.run.target_ess}, max_rhat ${record.run.max_rhat}):`,
        ...verdict.shortfalls.map((shortfall) => `  - ${shortfall}`),
        `do not use these numbers yet; ${record.merge.remedy}`,
        '',
      ].join('\n'));
      process.exitCode = EXIT_NOT_CONVERGED;
    });
}
