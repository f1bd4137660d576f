import type { ProbeDefinition } from '../probeDefinition.js';
import { createBaoTerm, type BaoRuler } from './createBaoTerm.js';
import { baoDiagram } from './baoDiagram.js';
import { readBaoTable, type BaoTable } from './readBaoTable.js';

/**
 * Baryon acoustic oscillation distances: a table of D_M/r_d, D_H/r_d, D_V/r_d
 * or D_A/r_d at effective redshifts with their covariance.
 * Configuration block (under `probes:`):
 *   bao:
 *     table: desi-dr2/measurements.csv     # z_eff, quantity, value[, sigma][, tracer]
 *     covariance: desi-dr2/covariance.txt  # optional; else the sigma column
 *     ruler: free                          # free (samples h_ruler) | computed (h0, omega_b_h2)
 */
export const BAO_PROBE: ProbeDefinition = {
  key: 'bao',
  title: 'BAO distances',
  settings: [
    { key: 'table', kind: 'path', required: true, meaning: 'CSV table of BAO measurements: z_eff, quantity (DM_over_rd, DH_over_rd, DV_over_rd, DA_over_rd), value, and sigma or a covariance file' },
    { key: 'covariance', kind: 'path', meaning: 'covariance of the values, rows in table order (without it: the sigma column as independent errors)' },
    { key: 'ruler', kind: 'choice', choices: ['free', 'computed'], default: 'free', meaning: 'sound horizon r_d: free (sample h_ruler = h r_d) or computed from omega_b_h2 and Omega_m h^2 (needs h0)' },
  ],
  requires: (settings) => (settings.ruler === 'computed' ? ['h0', 'omega_b_h2'] : ['h_ruler']),
  load(block) {
    const table = readBaoTable(
      String(block.settings.table), block.writtenPaths.table ?? String(block.settings.table),
      block.settings.covariance === undefined ? undefined : String(block.settings.covariance), block.writtenPaths.covariance,
    );
    const redshifts = [...new Set(table.redshifts)];
    return {
      key: 'bao', data: table, dataCount: table.values.length,
      describe: [`bao: ${table.values.length} measurements at ${redshifts.length} redshifts (${Math.min(...redshifts)} to ${Math.max(...redshifts)}), ${block.settings.covariance === undefined ? 'independent errors' : 'full covariance'}, ruler ${String(block.settings.ruler)}`],
    };
  },
  createTerm: (loaded, settings, model) => createBaoTerm(loaded.data as BaoTable, settings.ruler as BaoRuler, model, 'bao'),
  diagram: (loaded, settings, model, best, draws) => baoDiagram(loaded.data as BaoTable, settings.ruler as BaoRuler, model, best, draws),
};
