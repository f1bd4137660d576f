import type { Command } from 'commander';
import { unblindRun } from '../../pipeline/index.js';

/** `candela unblind RUN_DIR`: the one way to see a blinded run's true values (docs/blinding.md). */
export function registerUnblindCommand(program: Command): void {
  program
    .command('unblind')
    .description('show the true values of a blinded run: rewrite every output of the folder with them and record when')
    .argument('<runDir>', 'a run folder written by candela fit with a blinding block')
    .addHelpText('after', '\nExample:\n  candela unblind out/demo-blinded\n')
    .action((runDir: string) => {
      const outcome = unblindRun(runDir);
      process.stdout.write(`unblinded ${outcome.parameters.join(', ')} of ${outcome.runDir} at ${outcome.unblindedAt} (recorded in run.json); every output now shows the true values\n`);
    });
}
