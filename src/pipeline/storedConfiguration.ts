import { join, resolve } from 'node:path';
import { stringify } from 'yaml';
import { parseConfigText, type CandelaConfig } from '../config/index.js';
import type { Checked } from '../errors.js';
import { RUN_FILES } from './runFolder.js';
import type { RunOnDisk } from './runFiles.js';

/**
 * Name under which the configuration stored in run.json is parsed. run.json
 * holds the paths as the fit resolved them: absolute, or relative to the
 * folder `candela fit` ran in. Parsing it as a file of the current folder
 * lets the config layer resolve every path it declares (tables, covariances,
 * systematic modes, probe files, the output folder, the truth file) the same
 * way, so a command run from the fit's folder finds them all.
 */
const STORED_CONFIGURATION_NAME = 'run.json#configuration';

const parsedRuns = new WeakMap<RunOnDisk, Checked<CandelaConfig>>();

/**
 * The configuration a run used, typed: run.json's resolved configuration
 * parsed again by the config layer (once per run folder read; later calls
 * return the same result). Issues are re-addressed to run.json.
 *
 * Cost: one parse of the configuration text on the first call.
 * @param run a run folder read by readRunFolder.
 * @returns the configuration, or the issues that stop it from validating (a run written by another version).
 * @throws nothing.
 * @example storedConfiguration(readRunFolder('out/run')).ok && storedConfiguration(run).value.output.png // true
 */
export function storedConfiguration(run: RunOnDisk): Checked<CandelaConfig> {
  const known = parsedRuns.get(run);
  if (known) return known;
  const parsed = parseConfigText(stringify(run.record.configuration), resolve(STORED_CONFIGURATION_NAME));
  const result: Checked<CandelaConfig> = parsed.ok ? parsed : {
    ok: false,
    issues: parsed.issues.map((issue) => ({ ...issue, file: join(run.dir, RUN_FILES.run), line: undefined, column: undefined })),
  };
  parsedRuns.set(run, result);
  return result;
}
