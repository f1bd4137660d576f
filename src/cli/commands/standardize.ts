import type { Command } from 'commander';
import { writeFileSync } from 'node:fs';
import { CandelaError } from '../../errors.js';
import { standardizeTable } from '../../pipeline/index.js';

function parseAssignment(text: string, previous: Record<string, number>): Record<string, number> {
  const match = /^([a-z][a-z0-9_]*)=(.+)$/.exec(text.trim());
  const value = match ? Number(match[2]) : Number.NaN;
  if (!match || !Number.isFinite(value)) {
    throw new CandelaError({ code: 'cli.bad_assignment', path: '--at', message: 'a parameter value must be written name=number', found: text, fix: 'for example --at alpha=0.14 --at beta=3.1' });
  }
  return { ...previous, [match[1]]: value };
}

/** `candela standardize CONFIG`: the Hubble-diagram table at given or best-fit parameters. */
export function registerStandardizeCommand(program: Command): void {
  program
    .command('standardize')
    .description('write the Hubble-diagram table (id, sample, z, mu_obs, sigma_mu, mu_model, residual) at given or best-fit parameters')
    .argument('<config>', 'YAML configuration file')
    .option('--at <name=value>', 'hold a sampled parameter at a value (repeatable); the others are fitted', parseAssignment, {})
    .option('--model <label>', 'model of the configuration to use (default: the first)')
    .option('--out <file>', 'write the CSV here instead of standard output')
    .addHelpText('after', '\nExample:\n  candela standardize configs/jla.yaml --at alpha=0.141 --at beta=3.10 --out jla-hubble.csv\n')
    .action(async (configPath: string, options: { at: Record<string, number>; model?: string; out?: string }) => {
      const result = await standardizeTable(configPath, options.at, options.model);
      const facts = Object.entries(result.values).map(([name, value]) => `${name}=${Number(value.toPrecision(6))}`).join(' ');
      process.stderr.write(`model ${result.model}: ${facts}${result.fitted.length ? ` (fitted: ${result.fitted.join(', ')})` : ''}${result.chiSquare !== null ? `; chi^2 = ${result.chiSquare.toFixed(2)}` : ''}\n`);
      if (options.out) {
        writeFileSync(options.out, result.csv);
        process.stderr.write(`wrote ${options.out}\n`);
      } else {
        process.stdout.write(result.csv);
      }
    });
}
