/**
 * `supernovae[].columns` and `supernovae[].missing_values`: which column of
 * the table feeds which field, and which values mean "unknown".
 */
import type { ColumnField, SupernovaKind } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';

/** Fields every data set needs. */
const ALWAYS_REQUIRED: readonly ColumnField[] = ['id', 'z'];

/** Fields required, and the only kind-specific fields allowed, per kind. */
const KIND_FIELDS: Readonly<Record<SupernovaKind, { required: readonly ColumnField[]; optional: readonly ColumnField[] }>> = {
  magnitudes: { required: ['magnitude', 'magnitude_err'], optional: [] },
  light_curves: {
    required: ['m_b', 'm_b_err', 'x1', 'x1_err', 'color', 'color_err'],
    optional: ['cov_m_b_x1', 'cov_m_b_color', 'cov_x1_color'],
  },
};

/** Fields any kind may map. */
const SHARED_OPTIONAL: readonly ColumnField[] = [
  'sample', 'z_helio', 'z_err', 'host_log_mass', 'host_log_mass_err', 'bias_correction', 'calibrator_mu',
];

/** Every column field, in documentation order. */
export const COLUMN_FIELDS: readonly ColumnField[] = [
  ...ALWAYS_REQUIRED, ...SHARED_OPTIONAL.slice(0, 3), ...KIND_FIELDS.magnitudes.required,
  ...KIND_FIELDS.light_curves.required, ...KIND_FIELDS.light_curves.optional, ...SHARED_OPTIONAL.slice(3),
];

/**
 * Reads the column mapping of one data set. When `kind` is known, checks
 * that its required fields are mapped and that fields of the other kind are
 * not. Problems go to the reader; returns what could be read.
 * @param reader the document reader.
 * @param at the `columns` value.
 * @param kind the data set's kind, or undefined when it is itself invalid.
 * @example readColumns(reader, at, 'magnitudes') // { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' }
 */
export function readColumns(reader: ConfigReader, at: Located, kind: SupernovaKind | undefined): Partial<Record<ColumnField, string>> {
  const required = kind ? [...ALWAYS_REQUIRED, ...KIND_FIELDS[kind].required] : [];
  const fields = reader.mapping(at, COLUMN_FIELDS, required);
  const columns: Partial<Record<ColumnField, string>> = {};
  if (!fields) return columns;
  for (const [key, value] of fields) {
    const field = key as ColumnField;
    const other = kind === 'magnitudes' ? 'light_curves' : 'magnitudes';
    const otherFields = [...KIND_FIELDS[other].required, ...KIND_FIELDS[other].optional];
    if (kind && otherFields.includes(field)) {
      reader.report(value, 'config.field_not_for_kind', `column field "${field}" does not apply to kind ${kind}`, {
        expected: `fields of kind ${kind}: ${[...ALWAYS_REQUIRED, ...SHARED_OPTIONAL, ...KIND_FIELDS[kind].required, ...KIND_FIELDS[kind].optional].join(', ')}`,
        found: `"${field}"`,
        fix: kind === 'magnitudes'
          ? `remove "${field}", or set kind: light_curves if the table holds raw light-curve fit parameters`
          : `remove "${field}", or set kind: magnitudes if the table holds standardized magnitudes`,
      });
      continue;
    }
    const column = reader.text(value, { numbersAsText: true });
    if (typeof column === 'string') columns[field] = column;
  }
  return columns;
}

/**
 * Reads `missing_values`: per field, one number or a list of numbers that
 * mean "unknown" (e.g. -9). A field that is not mapped in `columns` gets a
 * warning.
 * @example readMissingValues(reader, at, { host_log_mass: '3rdvar' }) // { host_log_mass: [-9] }
 */
export function readMissingValues(
  reader: ConfigReader, at: Located, columns: Partial<Record<ColumnField, string>>,
): Partial<Record<ColumnField, number[]>> {
  const fields = reader.mapping(at, COLUMN_FIELDS);
  const sentinels: Partial<Record<ColumnField, number[]>> = {};
  if (!fields) return sentinels;
  for (const [key, value] of fields) {
    const field = key as ColumnField;
    const items = reader.list(value) ?? [];
    const numbers = items.map((item) => reader.number(item)).filter((n): n is number => n !== undefined);
    if (numbers.length === items.length && items.length > 0) sentinels[field] = numbers;
    if (columns[field] === undefined && !reader.failedAt(value.path)) {
      reader.report(value, 'config.unused_setting', `missing values are given for "${field}", which is not mapped in columns`, {
        severity: 'warning', fix: `map ${field} in columns, or remove this entry`,
      });
    }
  }
  return sentinels;
}
