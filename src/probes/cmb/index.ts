import type { ProbeDefinition } from '../probeDefinition.js';
import { createCmbTerm } from './createCmbTerm.js';
import { readCmbPrior, type CmbPrior } from './readCmbPrior.js';

/**
 * Compressed CMB distances: a Gaussian prior on (R, l_A, omega_b h^2) from a
 * file of means and covariance. Configuration block (under `probes:`):
 *   cmb:
 *     prior: ../data-external/planck2018-cmb-distance-prior.yaml
 */
export const CMB_PROBE: ProbeDefinition = {
  key: 'cmb',
  title: 'compressed CMB distances',
  settings: [
    { key: 'prior', kind: 'path', required: true, meaning: 'YAML file with quantities (shift_parameter, acoustic_scale, omega_b_h2), mean and covariance' },
  ],
  requires: () => ['h0', 'omega_b_h2'],
  load(block) {
    const prior = readCmbPrior(String(block.settings.prior), block.writtenPaths.prior ?? String(block.settings.prior));
    return { key: 'cmb', data: prior, dataCount: prior.quantities.length, describe: [`cmb: Gaussian prior on ${prior.quantities.join(', ')} (z* from Hu & Sugiyama 1996; r_s integrated)`] };
  },
  createTerm: (loaded, _settings, model) => createCmbTerm(loaded.data as CmbPrior, model, 'cmb'),
};
