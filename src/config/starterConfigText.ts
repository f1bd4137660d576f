/**
 * The commented starter configuration written by `candela init`.
 */

/** Options of starterConfigText. */
export interface StarterOptions {
  /**
   * Folder holding the Pantheon 2018 binned files (lcparam_DS17f.txt,
   * sys_DS17f.txt), as it should be written in the file: relative to the
   * folder the starter file is written to.
   */
  dataFolder?: string;
}

/** Where the Pantheon 2018 binned release lies relative to the repository root. */
export const STARTER_DATA_FOLDER = '../shared/data-real/pantheon2018/Binned_data';

/**
 * A complete, commented configuration that passes validation: the 40-bin
 * Pantheon (Scolnic et al. 2018) Hubble diagram with its systematic
 * covariance, fitted with flat LambdaCDM and flat wCDM. Every section shows
 * its most used keys; the comments say what each does.
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

title: "Pantheon 2018 binned Hubble diagram: flat LambdaCDM and flat wCDM"
seed: 20261202            # every random stream derives from it: same seed, same chains

supernovae:               # one or more data sets, concatenated
  - label: pantheon_bins
    kind: magnitudes      # standardized magnitudes; light_curves = m_b, x1, color per supernova
    table:
      file: ${folder}/lcparam_DS17f.txt
      delimiter: whitespace
    columns:              # tool field: column name in the file
      id: name
      z: zcmb             # redshift of the Hubble diagram
      z_helio: zhel       # heliocentric redshift, for the (1 + z_helio) factor
      magnitude: mb       # binned standardized magnitude (distance modulus + M)
      magnitude_err: dmb  # its statistical error, intrinsic scatter included
    covariances:          # added to diag(magnitude_err^2)
      - file: ${folder}/sys_DS17f.txt
        applies_to: magnitudes   # N x N on the magnitudes
    cuts:
      redshift: [0.01, 2.5]

standardization:
  scatter:
    intrinsic: off        # dmb already contains the intrinsic scatter
    lensing_per_redshift: 0
    peculiar_velocity_km_s: 0
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
  # h0: { fixed: 70 }     # sampled only with calibrators (a calibrator_mu column)

sampler:
  walkers: 32             # at least twice the number of free parameters
  ensembles: 4            # independent ensembles, compared by R-hat
  target_ess: 2000        # stop when every parameter has this many effective samples
  max_rhat: 1.01          # ... and R-hat below this
  max_steps: 50000

output:
  dir: out/pantheon-bins
  figures: [triangle, hubble, trace]
  png: true
`;
}
