/**
 * The quantities candela can read from a supernova table, and what each kind
 * of table needs. A configuration maps each field to a column name of the file.
 */

/** A quantity of the supernova table, mapped by the user to a file column. */
export type SupernovaField =
  | 'id' | 'sample' | 'z' | 'z_helio' | 'z_err'
  | 'magnitude' | 'magnitude_err'
  | 'm_b' | 'm_b_err' | 'x1' | 'x1_err' | 'color' | 'color_err'
  | 'cov_m_b_x1' | 'cov_m_b_color' | 'cov_x1_color'
  | 'host_log_mass' | 'host_log_mass_err' | 'bias_correction' | 'calibrator_mu';

/** Every field, in a fixed order (used for messages and validation). */
export const SUPERNOVA_FIELDS: readonly SupernovaField[] = [
  'id', 'sample', 'z', 'z_helio', 'z_err',
  'magnitude', 'magnitude_err',
  'm_b', 'm_b_err', 'x1', 'x1_err', 'color', 'color_err',
  'cov_m_b_x1', 'cov_m_b_color', 'cov_x1_color',
  'host_log_mass', 'host_log_mass_err', 'bias_correction', 'calibrator_mu',
];

/** Fields each kind of table must map. */
export const REQUIRED_FIELDS: Readonly<Record<'light_curves' | 'magnitudes', readonly SupernovaField[]>> = {
  magnitudes: ['z', 'magnitude', 'magnitude_err'],
  light_curves: ['z', 'm_b', 'm_b_err', 'x1', 'x1_err', 'color', 'color_err'],
};

/** Fields read as text rather than numbers. */
export const TEXT_FIELDS: readonly SupernovaField[] = ['id', 'sample'];

/** Fields whose value may be unknown in a row (empty cell, `nan` or a declared missing-value marker -> NaN). */
export const NULLABLE_FIELDS: readonly SupernovaField[] = ['host_log_mass', 'host_log_mass_err', 'calibrator_mu'];

/** Uncertainties that must be strictly positive (a zero error would give infinite weight). */
export const POSITIVE_ERROR_FIELDS: readonly SupernovaField[] = ['magnitude_err', 'm_b_err', 'x1_err', 'color_err'];

/** Uncertainties that may be zero (meaning negligible) but not negative. */
export const NON_NEGATIVE_ERROR_FIELDS: readonly SupernovaField[] = ['z_err', 'host_log_mass_err'];
