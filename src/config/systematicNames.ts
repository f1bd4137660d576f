/**
 * Names of the systematic ingredients of a configuration (the entries of
 * `supernovae[].covariances` and `supernovae[].systematic_modes`): the
 * systematic budget, its tables and its figure refer to them by name.
 */
import type { ConfigReader, Located } from './configReader.js';

/** A name: letters, digits, `_` and `-`, starting with a letter or digit (a `.` joins an entry's name to a column's). */
export const SYSTEMATIC_NAME_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_-]*$/;

/** Hands out names that are unique within one configuration. */
export interface SystematicNames {
  /**
   * The name of one entry: the `name` written at `nameAt`, or one derived
   * from the file (its stem, e.g. `calibration` for `data/calibration.csv`,
   * with `_2`, `_3` ... appended when that name is taken). A written name
   * that breaks the pattern or is already taken is reported at `nameAt`.
   */
  claim(nameAt: Located | undefined, entryAt: Located, writtenFile: string): string;
}

/**
 * Starts the register of systematic names of one configuration (one per
 * document, shared by every data set, so names are unique across sets).
 * Cost O(1) per claim plus the suffix search.
 * @param reader the document reader (problems go to it).
 * @example createSystematicNames(reader).claim(undefined, item, '../data/kestrel-drift.csv') // 'kestrel-drift'
 */
export function createSystematicNames(reader: ConfigReader): SystematicNames {
  const taken = new Map<string, { path: string; derived: boolean }>();
  const free = (base: string): string => {
    if (!taken.has(base)) return base;
    let suffix = 2;
    while (taken.has(`${base}_${suffix}`)) suffix++;
    return `${base}_${suffix}`;
  };
  return {
    claim(nameAt, entryAt, writtenFile) {
      const written = reader.text(nameAt, { numbersAsText: true });
      if (typeof written === 'string' && nameAt) {
        if (!SYSTEMATIC_NAME_PATTERN.test(written)) {
          reader.report(nameAt, 'config.bad_name', `systematic name "${written}" cannot name a row of the budget`, {
            expected: 'letters, digits, "_" or "-", starting with a letter or digit', found: `"${written}"`,
            fix: `write e.g. name: ${free(cleanName(written))}`,
          });
        } else if (taken.has(written)) {
          const first = taken.get(written)!;
          reader.report(nameAt, 'config.duplicate_name', `systematic name "${written}" is already used by ${first.path}` +
            (first.derived ? ' (named after its file)' : ''), {
            expected: 'a name used once in the configuration', found: `"${written}"`,
            fix: `give this entry its own name, e.g. name: ${free(written)}${first.derived ? `, or name ${first.path} explicitly` : ''}`,
          });
        }
        taken.set(written, { path: entryAt.path, derived: false });
        return written;
      }
      const name = free(cleanName(stemOf(writtenFile)));
      taken.set(name, { path: entryAt.path, derived: true });
      return name;
    },
  };
}

/** The file name without folders and without its last extension. */
function stemOf(file: string): string {
  const base = file.split(/[\\/]/).pop() ?? file;
  const dot = base.lastIndexOf('.');
  return dot > 0 ? base.slice(0, dot) : base;
}

/** Replaces what the pattern refuses by `_`; `systematic` when nothing is left. */
function cleanName(text: string): string {
  return text.replace(/[^A-Za-z0-9_-]+/g, '_').replace(/^[_-]+/, '') || 'systematic';
}
