/**
 * The commented starter configuration written by `candela init`.
 */

/** Options of starterConfigText. */
export interface StarterOptions {
  /**
   * Folder holding {@link STARTER_TABLE_FILE}, as it should be written in the
   * file: relative to the folder the starter file is written to (`.` when
   * the table lies beside it, as `candela init` arranges).
   */
  dataFolder?: string;
}

/**
 * The table the starter reads: the light curves of the invented Kestrel
 * Telescope demo survey (data-demo/ of the repository, drawn by
 * `candela simulate configs/demo-survey.yaml`). `candela init` copies it
 * beside the starter, so the starter passes `check` wherever it is written.
 */
export const STARTER_TABLE_FILE = 'kestrel-supernovae.csv';

/** Where {@link STARTER_TABLE_FILE} lies relative to the repository root (the default data folder). */
export const STARTER_DATA_FOLDER = 'data-demo';

/**
 * A complete, commented configuration that passes validation: the Kestrel
 * demo survey's 800 light curves (m_B, x1, c), standardized by the Tripp
 * relation (Tripp 1998) with a host-mass step, fitted with flat LambdaCDM
 * and flat wCDM. Every section shows its most used keys; the comments say
 * what each does and how to point it at one's own data.
 * @param options where the data folder is, as written in the file.
 * @returns YAML text ending with a newline.
 * @example starterConfigText().startsWith('# candela configuration') // true
 */
export function starterConfigText(options: StarterOptions = {}): string {
  const folder = (options.dataFolder ?? STARTER_DATA_FOLDER).replace(/\/+$/, '');
  return `# candela configuration: one file describes the whole analysis.
# Validate it with "candela check <this file>". docs/configuration.md explains
# every key and its default; keys left out take their defaults.
# Paths are relative to the folder of this file.
#
# The data: ${STARTER_TABLE_FILE}, the light curves of the invented Kestrel
# Telescope demo survey (800 supernovae in three programmes), copied beside
# this file by "candela init". Replace it with your own table: name the file
# under table.file and map its column names under columns.

title: "Kestrel demo survey: flat LambdaCDM and flat wCDM"
seed: 20261202            # every random stream derives from it: same seed, same chains

supernovae:               # one or more data sets, concatenated
  - label: kestrel
    kind: light_curves    # m_b, x1, color per supernova; magnitudes = already standardized
    table:
      file: ${folder === '.' ? '' : `${folder}/`}${STARTER_TABLE_FILE}
      delimiter: comma
    columns:              # tool field: column name in the file
      id: id
      sample: sample      # the programme each supernova belongs to
      z: z_cmb            # redshift of the Hubble diagram
      z_helio: z_helio    # heliocentric redshift, for the (1 + z_helio) factor
      m_b: m_b            # peak apparent magnitude and its error
      m_b_err: m_b_err
      x1: x1              # light-curve stretch
      x1_err: x1_err
      color: color        # light-curve colour
      color_err: color_err
      cov_m_b_x1: cov_m_b_x1
      cov_m_b_color: cov_m_b_color
      cov_x1_color: cov_x1_color
      host_log_mass: host_log_mass
      host_log_mass_err: host_log_mass_err
    # covariances:        # systematic covariance files, added to the statistical errors
    #   - file: my-systematics.txt
    #     applies_to: magnitudes   # N x N on the standardized magnitudes
    cuts:
      redshift: [0.01, 2.5]

standardization:
  method: conventional    # the Tripp relation: mu = m_b - M + alpha x1 - beta c
  host_mass_step:
    enabled: true         # brighter supernovae in massive hosts
    split_log_mass: 10
  scatter:
    intrinsic: global     # one intrinsic scatter, sampled as sigma_int
    lensing_per_redshift: 0.055
    peculiar_velocity_km_s: 250
    redshift_errors: false
  offset: marginalize     # the magnitude offset M (degenerate with H0) is integrated out analytically

models:                   # each model is fitted into its own folder under output.dir
  - label: flat_lcdm
    dark_energy: lambda   # lambda | constant_w | cpl
    curvature: flat       # flat | free
  - label: flat_wcdm
    dark_energy: constant_w
    curvature: flat

parameters:               # priors; parameters a model does not use are ignored for it
  omega_m: { prior: uniform, min: 0.0, max: 1.0 }
  w0: { prior: uniform, min: -3.0, max: 1.0 }
  alpha: { prior: uniform, min: 0.0, max: 0.5 }
  beta: { prior: uniform, min: 0.0, max: 6.0 }
  # h0: { fixed: 70 }     # sampled only with calibrators (a calibrator_mu column)

sampler:
  walkers: 32             # at least twice the number of free parameters
  ensembles: 4            # independent ensembles, compared by R-hat
  target_ess: 2000        # stop when every parameter has this many effective samples
  max_rhat: 1.01          # ... and R-hat below this
  max_steps: 50000

output:
  dir: out/kestrel-starter
  figures: [triangle, hubble, trace]
  png: true
`;
}
