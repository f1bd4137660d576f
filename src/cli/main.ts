#!/usr/bin/env node
/**
 * candela command-line entry point. Thin: parse arguments, call one pipeline
 * function, map errors to exit codes (0 ok, 2 bad input, 1 internal error).
 */
import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError } from 'commander';
import { isCandelaError, formatIssues, EXIT_BAD_INPUT, EXIT_INTERNAL } from '../errors.js';
import { registerCommands } from './commands/index.js';
import { VERSION } from './version.js';

export async function main(argv: string[]): Promise<number> {
  const program = new Command();
  program
    .name('candela')
    .description('Type Ia supernova cosmology: standardize, compute FLRW distances, sample, diagnose, compare, report.')
    .version(VERSION)
    .showHelpAfterError('(run with --help for usage)')
    .exitOverride();
  registerCommands(program);
  try {
    await program.parseAsync(argv, { from: 'user' });
    return typeof process.exitCode === 'number' ? process.exitCode : 0;
  } catch (error) {
    if (error instanceof CommanderError) {
      if (error.code === 'commander.helpDisplayed' || error.code === 'commander.version' || error.code === 'commander.help') return 0;
      return EXIT_BAD_INPUT;
    }
    if (isCandelaError(error)) {
      process.stderr.write(`${formatIssues(error.issues)}\n`);
      return EXIT_BAD_INPUT;
    }
    const message = error instanceof Error ? (error.stack ?? error.message) : String(error);
    process.stderr.write(`candela: internal error: ${message}\n`);
    process.stderr.write('candela: this is a bug in candela, not in your input; please report it with the command line and configuration you used.\n');
    return EXIT_INTERNAL;
  }
}

function isEntryPoint(): boolean {
  const script = process.argv[1];
  if (!script) return false;
  try {
    return realpathSync(script) === fileURLToPath(import.meta.url);
  } catch {
    return false;
  }
}

/**
 * A reader that stops early (`candela standardize CONFIG | head`) closes the
 * pipe; the next write then fails with EPIPE. That is the reader's choice,
 * not an error: candela stops quietly with exit code 0, as command-line
 * filters do (common practice). Other stream errors keep their report.
 */
function endQuietlyWhenReaderLeaves(stream: NodeJS.WriteStream): void {
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(0);
    throw error;
  });
}

if (isEntryPoint()) {
  endQuietlyWhenReaderLeaves(process.stdout);
  main(process.argv.slice(2)).then((code) => {
    process.exitCode = code;
  });
}
