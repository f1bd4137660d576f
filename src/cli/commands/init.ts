import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { dirname, relative, resolve } from 'node:path';
import type { Command } from 'commander';
import { CandelaError } from '../../errors.js';
import { STARTER_DATA_FOLDER, starterConfigText } from '../../config/index.js';

/** File written when none is named. */
const DEFAULT_STARTER_FILE = 'candela.yaml';

/**
 * `candela init [FILE]`: writes a commented starter configuration that
 * passes `candela check`. Refuses to replace an existing file without
 * `--force`. The data path in it is written relative to the new file's
 * folder, assuming the command runs from the repository root.
 */
export function registerInitCommand(program: Command): void {
  program
    .command('init')
    .description('write a commented starter configuration')
    .argument('[file]', 'where to write it', DEFAULT_STARTER_FILE)
    .option('--force', 'replace the file if it exists')
    .addHelpText('after', '\nExample:\n  candela init my-run.yaml && candela check my-run.yaml\n')
    .action((file: string, options: { force?: boolean }) => {
      if (existsSync(file) && !options.force) {
        throw new CandelaError({
          code: 'init.file_exists', message: 'the file exists already; it was left unchanged', file,
          fix: 'choose another file name, or add --force to replace it',
        });
      }
      const folder = dirname(resolve(file));
      const dataFolder = relative(folder, resolve(STARTER_DATA_FOLDER)) || '.';
      mkdirSync(folder, { recursive: true });
      writeFileSync(file, starterConfigText({ dataFolder }), 'utf8');
      process.stdout.write(`wrote ${file}; next: candela check ${file}\n`);
    });
}
