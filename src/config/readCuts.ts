/**
 * `supernovae[].cuts`: which rows to keep after reading.
 */
import type { ColumnField, CutOptions, ErrorField, SupernovaKind } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_CUTS } from './defaults.js';

const CUT_KEYS = ['redshift', 'keep_calibrators', 'max_abs_x1', 'max_abs_color', 'max_errors', 'keep_samples', 'drop_ids'] as const;

/** The uncertainty fields a `max_errors` entry may name. */
export const ERROR_FIELDS: readonly ErrorField[] = ['z_err', 'magnitude_err', 'm_b_err', 'x1_err', 'color_err', 'host_log_mass_err'];

/**
 * Reads the cuts of one data set, with defaults for what is absent, and
 * checks them against the mapped columns (a cut on an unmapped field is an
 * error: it could never remove anything).
 * @param reader the document reader.
 * @param at the `cuts` value (absent: no cuts).
 * @param kind the data set's kind (undefined when invalid).
 * @param columns the data set's column mapping.
 * @example readCuts(reader, at, 'light_curves', columns).redshift // [0.01, 2.5]
 */
export function readCuts(
  reader: ConfigReader, at: Located, kind: SupernovaKind | undefined, columns: Partial<Record<ColumnField, string>>,
): CutOptions {
  const cuts: CutOptions = structuredClone(DEFAULT_CUTS);
  const fields = reader.mapping(at, CUT_KEYS);
  if (!fields) return cuts;
  const range = fields.get('redshift');
  if (range) cuts.redshift = readRedshiftRange(reader, range) ?? null;
  cuts.keepCalibrators = reader.boolean(fields.get('keep_calibrators')) ?? cuts.keepCalibrators;
  for (const [key, field] of [['max_abs_x1', 'x1'], ['max_abs_color', 'color']] as const) {
    const value = fields.get(key);
    if (!value) continue;
    const limit = reader.number(value, { min: 0, exclusiveMin: true }) ?? null;
    if (key === 'max_abs_x1') cuts.maxAbsX1 = limit; else cuts.maxAbsColor = limit;
    if (kind === 'magnitudes') {
      reader.report(value, 'config.field_not_for_kind', `${key} does not apply to kind magnitudes (no ${field} column)`, {
        expected: `no ${key} for kind magnitudes`, found: `${key}: ${reader.describe(value.node)}`, fix: `remove ${key}`,
      });
    }
  }
  const maxErrors = fields.get('max_errors');
  const errorFields = maxErrors ? reader.mapping(maxErrors, ERROR_FIELDS) : null;
  for (const [key, value] of errorFields ?? []) {
    const limit = reader.number(value, { min: 0, exclusiveMin: true });
    if (limit !== undefined) cuts.maxErrors[key as ErrorField] = limit;
    if (kind && columns[key as ErrorField] === undefined) {
      reader.report(value, 'config.cut_on_unmapped_field', `cut on ${key}, which is not mapped in columns`, {
        expected: `a field mapped in columns`, found: `"${key}"`, fix: `map ${key} in columns, or remove this cut`,
      });
    }
  }
  const keep = fields.get('keep_samples');
  if (keep) {
    cuts.keepSamples = readWords(reader, keep);
    if (kind && columns.sample === undefined) {
      reader.report(keep, 'config.cut_on_unmapped_field', 'keep_samples needs a sample column', {
        expected: 'columns.sample mapped', found: 'no sample column', fix: 'map sample in columns, or remove keep_samples',
      });
    }
  }
  const drop = fields.get('drop_ids');
  if (drop) cuts.dropIds = readWords(reader, drop);
  return cuts;
}

function readRedshiftRange(reader: ConfigReader, at: Located): [number, number] | undefined {
  const items = reader.list(at);
  if (!items) return undefined;
  if (items.length !== 2) {
    reader.report(at, 'config.wrong_type', 'must be a pair [min, max]', {
      expected: 'two numbers [min, max]', found: `${items.length} item${items.length === 1 ? '' : 's'}`, fix: 'write redshift: [0.01, 2.5]',
    });
    return undefined;
  }
  const low = reader.number(items[0], { min: 0 });
  const high = reader.number(items[1], { min: 0, exclusiveMin: true });
  if (low === undefined || high === undefined) return undefined;
  if (low >= high) {
    reader.report(at, 'config.empty_range', 'the lower redshift must be below the upper one', {
      expected: 'min < max', found: `[${low}, ${high}]`, fix: 'swap the two values or widen the range',
    });
    return undefined;
  }
  return [low, high];
}

/** Identifiers and sample values: text, numbers written as they appear in the file. */
function readWords(reader: ConfigReader, at: Located): string[] {
  return (reader.list(at) ?? [])
    .map((item) => reader.text(item, { numbersAsText: true }))
    .filter((word): word is string => typeof word === 'string');
}
