// Test helper (not a test): a project folder as users lay one out, a configuration beside a data folder.
import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { PANTHEON_BINNED_FOLDER } from './pantheonBinnedConfig.js';

/**
 * Copies the Pantheon 2018 binned table (Scolnic et al. 2018) into `<dir>/data/`
 * and writes `<dir>/<name>` naming it by the relative path `data/lcparam_DS17f.txt`.
 * `dataSetLines` adds keys to the data set (indented four spaces, e.g. a
 * covariance or systematic_modes entry naming files under data/); `rest` is
 * the YAML after the supernovae block (models, sampler, output).
 * @returns the configuration's path.
 */
export function writePantheonProject(dir: string, name: string, dataSetLines: string, rest: string): string {
  mkdirSync(join(dir, 'data'), { recursive: true });
  copyFileSync(join(PANTHEON_BINNED_FOLDER, 'lcparam_DS17f.txt'), join(dir, 'data', 'lcparam_DS17f.txt'));
  const path = join(dir, name);
  writeFileSync(path, `seed: 5
supernovae:
  - label: bins
    kind: magnitudes
    table: { file: data/lcparam_DS17f.txt, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
${dataSetLines}standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
${rest}`);
  return path;
}
