import type { Command } from 'commander';

/**
 * Every sub-command registers itself here: one import and one call per
 * command, so a new command is a new file plus one line.
 */
export function registerCommands(program: Command): void {
  void program;
}
