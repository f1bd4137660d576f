import { join } from 'node:path';
import { CandelaError, type Issue } from '../../errors.js';
import { buildModel, type BuiltModel } from '../run/buildModel.js';
import { loadSupernovae, type LoadedSupernovae } from '../run/loadSupernovae.js';
import { RUN_FILES } from '../../output/index.js';
import { storedConfiguration } from '../run/storedConfiguration.js';
import type { RunOnDisk } from '../run/runFiles.js';
import { fileSha256 } from '../run/runRecord.js';

/** A run's model rebuilt from its stored configuration and the current input files. */
export interface RebuiltRunModel {
  model: BuiltModel;
  data: LoadedSupernovae;
  /** Data files whose SHA-256 differs from run.json's (or that run.json does not list): the rebuilt likelihood is not the fitted one. */
  changedInputs: Array<{ path: string; recorded: string | null; current: string }>;
}

/**
 * Rebuilds the posterior a run sampled, from run.json's resolved
 * configuration (storedConfiguration: every path as the fit resolved it) and the input files, for
 * quantities that need the likelihood at points the chains do not hold (the
 * deviance at the posterior mean of the DIC, reference distance curves).
 * Compares each data file's SHA-256 with the one recorded at fit time and
 * lists those that changed: the caller must say so.
 *
 * Cost: reading and checking the data, building the likelihood (a Cholesky
 * factorization of the covariance), hashing every data file.
 * @param run a run folder read by readRunFolder.
 * @returns the model, the data and the changed inputs.
 * @throws CandelaError `compare.bad_configuration` when the stored configuration no longer validates,
 *   `compare.unknown_model` when its models lack the run's label; the data layer's errors for missing or unreadable files.
 * @example rebuildRunModel(readRunFolder('out/pantheon/flat_lcdm')).model.posterior.logLikelihood(Float64Array.of(0.3))
 */
export function rebuildRunModel(run: RunOnDisk): RebuiltRunModel {
  const source = join(run.dir, RUN_FILES.run);
  const parsed = storedConfiguration(run);
  if (!parsed.ok) {
    const issues: Issue[] = parsed.issues.filter((issue) => issue.severity !== 'warning').map((issue) => ({
      ...issue, code: 'compare.bad_configuration', file: source, message: `the configuration stored in run.json no longer validates: ${issue.message}`,
      fix: 'the run was written by another candela version; refit it',
    }));
    throw new CandelaError(issues);
  }
  const config = parsed.value;
  const index = config.models.findIndex((model) => model.label === run.record.model.label);
  if (index < 0) {
    throw new CandelaError({ code: 'compare.unknown_model', file: source, message: `the stored configuration has no model ${run.record.model.label}`, fix: 'refit the run' });
  }
  const data = loadSupernovae(config);
  const model = buildModel(config, index, data);
  const seen = new Set<string>();
  const files = data.inputFiles.filter((file) => !seen.has(file.resolved) && seen.add(file.resolved));
  const recorded = run.record.inputs.slice(1); // the first entry is the configuration file
  const changedInputs: RebuiltRunModel['changedInputs'] = [];
  files.forEach((file, k) => {
    const current = fileSha256(file.resolved);
    const expected = recorded[k]?.sha256 ?? null;
    if (current !== expected) changedInputs.push({ path: file.resolved, recorded: expected, current });
  });
  return { model, data, changedInputs };
}
