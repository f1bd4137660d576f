import { statSync } from 'node:fs';
import { isAbsolute, normalize, sep } from 'node:path';
import type { ReportInputFile } from '../../output/index.js';
import type { RunOnDisk } from '../run/runFiles.js';
import { plainConfiguration } from '../../config/index.js';

/**
 * The report's input-file table: every input of run.json with its path as
 * the user wrote it, the same path resolved (from the run's stored
 * configuration, whose paths are resolved), its role (configuration,
 * supernova table, covariance, systematic modes, probe data) and its size in
 * bytes when the file is still there.
 * Cost: one stat per input file.
 * @param run the run folder read back.
 * @returns one row per input, in run.json's order.
 * @throws nothing.
 * @example reportInputFiles(run)[0].role // 'configuration'
 */
export function reportInputFiles(run: RunOnDisk): ReportInputFile[] {
  const configuration = plainConfiguration(run.record.configuration);
  const known: Array<{ resolved: string; role: string }> = [];
  for (const set of configuration.supernovae ?? []) {
    const label = set.label ? ` (${set.label})` : '';
    if (set.table?.file) known.push({ resolved: set.table.file, role: `supernova table${label}` });
    for (const covariance of set.covariances ?? []) {
      if (covariance.file) known.push({ resolved: covariance.file, role: `covariance on ${covariance.applies_to === 'light_curve_parameters' ? 'm_B, x1, c' : 'magnitudes'}${label}` });
    }
    for (const modes of set.systematic_modes ?? []) if (modes.file) known.push({ resolved: modes.file, role: `systematic modes${label}` });
  }
  for (const [key, settings] of Object.entries(configuration.probes ?? {})) {
    for (const value of Object.values(settings)) if (typeof value === 'string' && isAbsolute(value)) known.push({ resolved: value, role: `${key} data` });
  }
  return run.record.inputs.map((input, index) => {
    // A path written relative to a parent folder ('../shared/x.csv') ends the resolved one without its leading '../'.
    const written = normalize(input.path).replace(/^(\.\.[\\/])+/, '');
    const match = known.find((entry) => entry.resolved === input.path || entry.resolved === written || entry.resolved.endsWith(`${sep}${written}`));
    // run.json lists the configuration file first (commonRunSections).
    const role = match?.role ?? (index === 0 ? 'configuration' : 'input');
    const resolved = match?.resolved;
    let sizeBytes: number | undefined;
    try {
      // Only a path known absolutely is measured: a relative one is relative to a folder run.json does not record.
      if (resolved || isAbsolute(input.path)) sizeBytes = statSync(resolved ?? input.path).size;
    } catch {
      sizeBytes = undefined;
    }
    return {
      path: input.path, sha256: input.sha256, role,
      ...(resolved && resolved !== input.path ? { resolvedPath: resolved } : {}),
      ...(sizeBytes !== undefined ? { sizeBytes } : {}),
    };
  });
}
