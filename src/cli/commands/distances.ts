import type { Command } from 'commander';
import { CandelaError, isCandelaError } from '../../errors.js';
import { computeDistanceTable, formatDistanceTableCsv, formatDistanceTableJson, formatDistanceTableText, readRedshiftFile } from '../../pipeline/index.js';
import type { DistanceTableOptions } from '../../pipeline/index.js';
import { DARK_ENERGY_LAW_NAMES, closestWord } from '../../config/index.js';

/** Names people often type for the laws, pointed at the one name candela uses everywhere (messages only). */
const FAMILIAR_NAMES: Record<string, string> = { lcdm: 'lambda', wcdm: 'constant_w', w0wa: 'cpl', w0wacdm: 'cpl', cpl: 'cpl' };

/** Pipeline option fields -> the flag a user types, so messages name the flag. */
const FLAG_FOR_FIELD: Record<string, string> = {
  omegaDarkEnergy: '--omega-de', wa: '--wa', w0: '--w0', darkEnergy: '--dark-energy', redshifts: '--z',
  redshiftFile: '--z-file', redshiftColumn: '--z-column',
};

interface DistanceFlags {
  darkEnergy?: DistanceTableOptions['darkEnergy']; curved?: boolean; omegaM: number; omegaDe?: number; w0?: number; wa?: number;
  h0: number; radiation?: boolean; tcmb?: number; neff?: number; z?: number[]; zFile?: string; zColumn?: string; json?: boolean; csv?: boolean;
}

function badFlag(flag: string, found: string, expected: string, fix: string): CandelaError {
  return new CandelaError({ code: 'cli.bad_option', path: flag, message: `${flag} has an unusable value`, expected, found, fix });
}

function numberFlag(flag: string, check: (value: number) => boolean = Number.isFinite, expected = 'a finite number') {
  return (text: string): number => {
    const value = Number(text);
    if (text.trim() === '' || !check(value)) throw badFlag(flag, text, expected, `write ${flag} as a plain number, e.g. ${flag} 0.3`);
    return value;
  };
}

function parseRedshiftList(text: string): number[] {
  return text.split(',').map((cell) => {
    const value = Number(cell);
    if (cell.trim() === '' || !Number.isFinite(value) || value < 0) {
      throw badFlag('--z', text, 'comma-separated redshifts >= 0', 'write the redshifts as --z 0.1,0.5,1 (no spaces)');
    }
    return value;
  });
}

/**
 * `candela distances`: FLRW distances, distance modulus, times and q(z) for
 * one model at chosen redshifts, as a text table, JSON or CSV.
 */
export function registerDistancesCommand(program: Command): void {
  program
    .command('distances')
    .description('tabulate E(z), comoving/transverse/luminosity/angular-diameter distances, distance modulus, lookback time, age and q(z) for one FLRW model')
    .option('--dark-energy <law>', `dark-energy law, as in the configuration's dark_energy: ${DARK_ENERGY_LAW_NAMES.join(', ')} (default lambda)`, (text: string) => {
      const law = DARK_ENERGY_LAW_NAMES.find((name) => name === text);
      if (law) return law;
      const suggestion = FAMILIAR_NAMES[text.toLowerCase()] ?? closestWord(text, DARK_ENERGY_LAW_NAMES);
      throw badFlag('--dark-energy', text, DARK_ENERGY_LAW_NAMES.join(', '), suggestion ? `did you mean ${suggestion}?` : `choose one of ${DARK_ENERGY_LAW_NAMES.join(', ')}`);
    })
    .option('--curved', 'let curvature be free: Omega_k = 1 - Omega_m - Omega_DE - Omega_r (needs --omega-de); default flat')
    .option('--omega-m <x>', 'matter density today, Omega_m >= 0', numberFlag('--omega-m', (v) => Number.isFinite(v) && v >= 0, 'a number >= 0'), 0.3)
    .option('--omega-de <x>', 'dark-energy density today (curved models; flat models derive it)', numberFlag('--omega-de'))
    .option('--w0 <x>', 'equation of state today (constant_w, cpl)', numberFlag('--w0'))
    .option('--wa <x>', 'CPL slope (cpl)', numberFlag('--wa'))
    .option('--h0 <x>', 'Hubble constant, km/s/Mpc', numberFlag('--h0', (v) => Number.isFinite(v) && v > 0, 'a number > 0'), 70)
    .option('--radiation', 'include CMB photons (T_CMB = 2.7255 K) and massless neutrinos')
    .option('--tcmb <kelvin>', 'CMB temperature today, K (implies --radiation)', numberFlag('--tcmb', (v) => Number.isFinite(v) && v > 0, 'a temperature > 0 K'))
    .option('--neff <n>', 'effective number of massless neutrino species (default 3.046)', numberFlag('--neff', (v) => Number.isFinite(v) && v >= 0, 'a number >= 0'))
    .option('--z <list>', 'redshifts, comma-separated, e.g. 0.1,0.5,1', parseRedshiftList)
    .option('--z-file <file>', 'file with redshifts: one per line, or a table column (header line names it)')
    .option('--z-column <name>', 'column of --z-file holding the redshifts (default: the only column, or one named z or redshift)')
    .option('--json', 'print one JSON object (model, today, rows) instead of the text table')
    .option('--csv', 'print the rows as CSV instead of the text table')
    .addHelpText('after', [
      '',
      'Examples:',
      '  candela distances --z 0.5,1,2',
      '  candela distances --dark-energy cpl --omega-m 0.3 --w0 -0.9 --wa 0.3 --z 0.5,1,2 --json',
      '  candela distances --curved --omega-m 0.3 --omega-de 0.8 --radiation --z-file redshifts.txt --csv',
      '',
    ].join('\n'))
    .action((flags: DistanceFlags) => {
      if (flags.json && flags.csv) throw badFlag('--csv', '--json and --csv', 'one output format', 'give either --json or --csv, not both');
      if (flags.z && flags.zFile) throw badFlag('--z-file', '--z and --z-file', 'one source of redshifts', 'give either --z or --z-file, not both');
      if (!flags.z && !flags.zFile) throw badFlag('--z', '(none)', 'redshifts', 'give --z 0.1,0.5,1 or --z-file FILE');
      if (flags.omegaDe !== undefined && !flags.curved) throw badFlag('--omega-de', String(flags.omegaDe), '--curved with it', 'a flat model derives Omega_DE = 1 - Omega_m - Omega_r: add --curved to set Omega_DE, or drop --omega-de');
      if (flags.zColumn && !flags.zFile) throw badFlag('--z-column', flags.zColumn, 'a column of --z-file', 'give --z-file FILE as well');
      try {
        const table = computeDistanceTable({
          darkEnergy: flags.darkEnergy ?? 'lambda', flat: !flags.curved, omegaMatter: flags.omegaM, omegaDarkEnergy: flags.omegaDe,
          w0: flags.w0, wa: flags.wa, h0KmPerSPerMpc: flags.h0, radiation: Boolean(flags.radiation || flags.tcmb !== undefined),
          cmbTemperatureK: flags.tcmb, effectiveNeutrinoSpecies: flags.neff,
          redshifts: flags.z ?? readRedshiftFile(flags.zFile as string, flags.zColumn),
        });
        const text = flags.json ? formatDistanceTableJson(table) : flags.csv ? formatDistanceTableCsv(table) : formatDistanceTableText(table);
        process.stdout.write(text);
      } catch (error) {
        if (!isCandelaError(error)) throw error;
        throw new CandelaError(error.issues.map((issue) => ({ ...issue, path: issue.path && (FLAG_FOR_FIELD[issue.path] ?? issue.path) })));
      }
    });
}
