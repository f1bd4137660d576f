import type { Command } from 'commander';
import { CandelaError, formatIssue } from '../../errors.js';
import { forecastSurvey, formatForecastJson, formatForecastText, simulateSurvey } from '../../pipeline/index.js';

interface SimulateFlags {
  out?: string;
  force?: boolean;
  seed?: string;
  forecast?: boolean;
  fitConfig?: string;
  json?: boolean;
}

function badFlag(flag: string, found: string, expected: string, fix: string): CandelaError {
  return new CandelaError({ code: 'cli.bad_option', path: flag, message: `${flag} cannot be used here`, expected, found, fix });
}

/**
 * `candela simulate SURVEY`: draws a mock survey into a table, a file of
 * systematics (a covariance matrix or modes) and truth.json, or
 * (--forecast) prints the Fisher forecast of the survey without writing
 * anything.
 */
export function registerSimulateCommand(program: Command): void {
  program
    .command('simulate')
    .description('draw a mock supernova survey from a survey description (table, systematic covariance or modes, truth.json), or forecast its constraints')
    .argument('<survey>', 'YAML survey description (see docs/simulate.md)')
    .option('--out <dir>', 'output folder (default: output.dir of the survey file)')
    .option('--force', 'replace existing output files')
    .option('--seed <seed>', 'seed of the random stream (default: seed of the survey file)')
    .option('--forecast', 'print the Fisher-matrix forecast of the survey instead of writing files')
    .option('--fit-config <file>', 'with --forecast: take models, free parameters, priors and standardization from this run configuration')
    .option('--json', 'with --forecast: print one JSON object')
    .addHelpText('after', [
      '',
      'Examples:',
      '  candela simulate configs/demo-survey.yaml --force',
      '  candela simulate my-survey.yaml --out mock-42 --seed 42',
      '  candela simulate configs/demo-survey.yaml --forecast --fit-config configs/demo.yaml',
      '',
    ].join('\n'))
    .action((surveyPath: string, flags: SimulateFlags) => {
      if (!flags.forecast) {
        if (flags.fitConfig) throw badFlag('--fit-config', flags.fitConfig, 'only together with --forecast', 'add --forecast, or drop --fit-config');
        if (flags.json) throw badFlag('--json', '--json', 'only together with --forecast', 'add --forecast, or drop --json');
        const outcome = simulateSurvey({ surveyPath, outDir: flags.out, force: flags.force, seed: flags.seed });
        for (const warning of outcome.warnings) process.stderr.write(`${formatIssue(warning)}\n`);
        const counts = Object.entries(outcome.samples).map(([label, count]) => `${label} ${count}`).join(', ');
        const lines = [`drew ${outcome.supernovae} supernovae (${counts}) with seed ${outcome.seed} in ${outcome.wallSeconds.toFixed(2)} s`];
        for (const file of outcome.files) lines.push(`  wrote ${file.path} (${file.bytes} bytes)`);
        const entry = outcome.systematicsEntry;
        if (entry) {
          const options = entry.key === 'covariances' ? ', applies_to: magnitudes' : '';
          lines.push(`  to fit it, give its data set ${entry.key}: [{ file: ${entry.file}${options} }] (the path relative to the fit configuration)`);
        }
        process.stdout.write(`${lines.join('\n')}\n`);
        return;
      }
      if (flags.out || flags.force) throw badFlag(flags.out ? '--out' : '--force', flags.out ?? '--force', 'no output options with --forecast (it writes nothing)', 'drop --out and --force, or drop --forecast');
      const result = forecastSurvey({ surveyPath, fitConfigPath: flags.fitConfig, seed: flags.seed });
      for (const warning of result.warnings) process.stderr.write(`${formatIssue(warning)}\n`);
      process.stdout.write(flags.json ? formatForecastJson(result) : formatForecastText(result));
    });
}
