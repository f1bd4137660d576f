// Survey descriptions for the simulate and forecast tests (inputs only).

/** A small valid survey description: two samples, 90 supernovae, systematic modes on. */
export const SMALL_SURVEY = `title: test survey
seed: 99
truth:
  dark_energy: cpl
  curvature: flat
  omega_m: 0.3
  w0: -0.9
  wa: 0.2
  h0: 70
  alpha: 0.14
  beta: 3.1
  abs_mag: -19.3
  mass_step: 0.05
  sigma_int: 0.1
lensing_per_redshift: 0.055
peculiar_velocity_km_s: 300
redshift_drift_mag: 0.02
samples:
  - label: near
    count: 40
    redshift: { min: 0.02, max: 0.1, shape: volume }
    stretch: { mean: 0.1, sd: 1.0 }
    color: { mean: -0.02, sd: 0.09 }
    host_log_mass: { mean: 10.2, sd: 0.6, error: 0.1 }
    errors:
      m_b: { base: 0.03, per_z: 0.1 }
      x1: { base: 0.1, per_z: 1.0 }
      color: { base: 0.02, per_z: 0.08 }
      correlations: { m_b_x1: 0.1, m_b_color: 0.3, x1_color: -0.1 }
    calibration_offset_mag: 0.01
  - label: far
    count: 50
    redshift: { min: 0.2, max: 1.0 }
    stretch: { mean: 0.0, sd: 1.0 }
    color: { mean: -0.03, sd: 0.08 }
    host_log_mass: { mean: 10.0, sd: 0.7, error: 0.15 }
    errors:
      m_b: { base: 0.02, per_z: 0.06 }
      x1: { base: 0.05, per_z: 0.8 }
      color: { base: 0.015, per_z: 0.06 }
    calibration_offset_mag: 0.015
output:
  dir: mock
  table: sn.csv
  covariance: sys.txt
  truth: truth.json
`;

/** The small survey with one line replaced (the line must occur exactly once). */
export function editSurvey(from: string, to: string): string {
  const count = SMALL_SURVEY.split(from).length - 1;
  if (count !== 1) throw new Error(`"${from}" occurs ${count} times in the test survey`);
  return SMALL_SURVEY.replace(from, to);
}

/** 1-based line of the first line containing `snippet`. */
export function lineOf(text: string, snippet: string): number {
  const index = text.split('\n').findIndex((line) => line.includes(snippet));
  if (index < 0) throw new Error(`snippet not found: ${snippet}`);
  return index + 1;
}
