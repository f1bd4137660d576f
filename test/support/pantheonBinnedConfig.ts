import { join, resolve } from 'node:path';

/** The Pantheon 2018 binned Hubble diagram and its systematic matrix (../shared/data-real/pantheon2018, Scolnic et al. 2018). */
export const PANTHEON_BINNED_FOLDER = resolve('../shared/data-real/pantheon2018/Binned_data');

/**
 * A run configuration on the Pantheon 2018 binned data (stat + sys, every
 * error term already in dmb, offset marginalized), for end-to-end tests. The
 * caller gives the models, priors, sampler and output lines as YAML.
 */
export function pantheonBinnedConfig(options: { title?: string; seed: number; models: string; parameters?: string; sampler: string; output: string }): string {
  return `title: "${options.title ?? 'test run'}"
seed: ${options.seed}
supernovae:
  - label: bins
    kind: magnitudes
    table: { file: ${join(PANTHEON_BINNED_FOLDER, 'lcparam_DS17f.txt')}, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
    covariances:
      - { file: ${join(PANTHEON_BINNED_FOLDER, 'sys_DS17f.txt')}, applies_to: magnitudes }
standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
${options.models}
${options.parameters ? `parameters:\n${options.parameters}\n` : ''}sampler: ${options.sampler}
output: ${options.output}
`;
}
