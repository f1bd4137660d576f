// Fit configurations of the test survey's mock table (simulateSurveyText.ts): inputs only.

/** Every column `candela simulate` writes, mapped one to one (docs/simulate.md). */
const ALL_COLUMNS = '{ id: id, sample: sample, z: z_cmb, z_helio: z_helio, m_b: m_b, m_b_err: m_b_err, x1: x1, x1_err: x1_err, color: color, ' +
  'color_err: color_err, cov_m_b_x1: cov_m_b_x1, cov_m_b_color: cov_m_b_color, cov_x1_color: cov_x1_color, host_log_mass: host_log_mass, ' +
  'host_log_mass_err: host_log_mass_err }';

/**
 * A run configuration of one mock table with the survey's scatter settings,
 * alpha and beta followed by the covariance, flat w0waCDM.
 * @param table the table path, relative to the configuration.
 * @param systematics YAML lines of the data set's systematics entry (indented by 4), or ''.
 * @param parameters YAML lines of the parameters block (indented by 2).
 */
export function mockFitConfigText(table: string, systematics: string, parameters: string): string {
  return `title: mock fit
seed: 1
supernovae:
  - label: mock
    kind: light_curves
    table: { file: ${table}, delimiter: comma }
    columns: ${ALL_COLUMNS}
${systematics ? `${systematics}\n` : ''}standardization:
  host_mass_step: { enabled: true, split_log_mass: 10 }
  scatter: { intrinsic: global, lensing_per_redshift: 0.055, peculiar_velocity_km_s: 300, redshift_errors: false }
  alpha_beta_covariance: exact
  offset: sample
models:
  - { label: w0wa, dark_energy: cpl, curvature: flat }
parameters:
${parameters}
reference_h0: 70
`;
}
