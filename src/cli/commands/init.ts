import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Command } from 'commander';
import { CandelaError } from '../../errors.js';
import { STARTER_DATA_FOLDER, STARTER_TABLE_FILE, starterConfigText } from '../../config/index.js';

/** File written when none is named. */
const DEFAULT_STARTER_FILE = 'candela.yaml';

/**
 * The bundled demo table: looked for in `data-demo/` of the folders above
 * this module (the repository or the installed package), so it is found
 * from src/ under the tests and from dist/ once built, whatever the working
 * directory. Null when this installation has no demo data.
 */
function bundledStarterTable(): string | null {
  let folder = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const candidate = join(folder, STARTER_DATA_FOLDER, STARTER_TABLE_FILE);
    if (existsSync(candidate)) return candidate;
    const parent = dirname(folder);
    if (parent === folder) return null;
    folder = parent;
  }
}

/**
 * `candela init [FILE]`: writes a commented starter configuration and, beside
 * it, the table it reads (the invented Kestrel demo survey's light curves),
 * so that `candela check FILE` passes wherever the file is written, from any
 * working directory: a new user gets a complete example to edit, with no
 * path outside its own folder. Refuses to replace an existing file (or a
 * different table of the same name beside it) without `--force`.
 */
export function registerInitCommand(program: Command): void {
  program
    .command('init')
    .description(`write a commented starter configuration and, beside it, the demo table it reads (${STARTER_TABLE_FILE})`)
    .argument('[file]', 'where to write it', DEFAULT_STARTER_FILE)
    .option('--force', 'replace the file (and the demo table beside it) if they exist')
    .addHelpText('after', '\nExample:\n  candela init my-run.yaml && candela check my-run.yaml\n')
    .action((file: string, options: { force?: boolean }) => {
      const source = bundledStarterTable();
      if (!source) {
        throw new CandelaError({
          code: 'init.no_demo_data', message: `this installation of candela has no ${STARTER_DATA_FOLDER}/${STARTER_TABLE_FILE} to start from`,
          fix: 'run candela init from a clone of the candela repository, or write a configuration by hand (docs/configuration.md)',
        });
      }
      const table = join(dirname(resolve(file)), STARTER_TABLE_FILE);
      const tableDiffers = existsSync(table) && !readFileSync(table).equals(readFileSync(source));
      if (!options.force && (existsSync(file) || tableDiffers)) {
        throw new CandelaError({
          code: 'init.file_exists', message: 'the file exists already; nothing was written', file: existsSync(file) ? file : table,
          fix: 'choose another file name or folder, or add --force to replace it',
        });
      }
      mkdirSync(dirname(resolve(file)), { recursive: true });
      copyFileSync(source, table);
      writeFileSync(file, starterConfigText({ dataFolder: '.' }), 'utf8');
      process.stdout.write(`wrote ${file} and ${join(dirname(file), STARTER_TABLE_FILE)}; next: candela check ${file}\n`);
    });
}
