import type { Command } from 'commander';
import { formatIssue } from '../../errors.js';
import { checkConfiguration } from '../../pipeline/index.js';

/**
 * `candela check CONFIG`: validates a configuration and prints what would
 * run (exit 0), or every problem with its line and fix (exit 2, via main).
 */
export function registerCheckCommand(program: Command): void {
  program
    .command('check')
    .description('validate a configuration file and summarize what it would run')
    .argument('<config>', 'YAML configuration file')
    .addHelpText('after', '\nExample:\n  candela check configs/pantheon2018-binned.yaml\n')
    .action((configPath: string) => {
      const { summaryLines, warnings } = checkConfiguration(configPath);
      for (const warning of warnings) process.stderr.write(`${formatIssue(warning)}\n`);
      process.stdout.write(`${summaryLines.join('\n')}\n`);
      process.stdout.write(`${configPath}: configuration is valid${warnings.length ? ` (${warnings.length} warning${warnings.length === 1 ? '' : 's'})` : ''}\n`);
    });
}
