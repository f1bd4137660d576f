import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { stringify } from 'yaml';
import { parseConfigText, type CandelaConfig } from '../../config/index.js';
import type { Checked } from '../../errors.js';
import { RUN_FILES } from '../../output/index.js';
import type { RunOnDisk } from './runFiles.js';
import { RUN_FOLDER_PATHS_NOTE } from './writeResolvedConfig.js';

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
 * The configuration a run used, typed, parsed once per run folder read (later
 * calls return the same result): the run folder's config.resolved.yaml when
 * its paths are relative to the run folder (writeResolvedConfig says so on
 * its second line), so the run folder can move with its data; else run.json's
 * resolved configuration, with the paths as the fit resolved them (runs
 * written before). Issues name the file that was read.
 *
 * Cost: one read and one parse of the configuration text on the first call.
 * @param run a run folder read by readRunFolder.
 * @returns the configuration, or the issues that stop it from validating (a run written by another version).
 * @throws nothing.
 * @example storedConfiguration(readRunFolder('out/run')).ok && storedConfiguration(run).value.output.png // true
 */
export function storedConfiguration(run: RunOnDisk): Checked<CandelaConfig> {
  const known = parsedRuns.get(run);
  if (known) return known;
  const copy = join(run.dir, RUN_FILES.resolvedConfig);
  let text: string | null = null;
  try {
    text = readFileSync(copy, 'utf8');
  } catch {
    text = null;
  }
  const result = text !== null && text.split('\n', 2)[1] === RUN_FOLDER_PATHS_NOTE
    ? parseConfigText(text, copy)
    : readdressed(parseConfigText(stringify(run.record.configuration), resolve(STORED_CONFIGURATION_NAME)), join(run.dir, RUN_FILES.run));
  parsedRuns.set(run, result);
  return result;
}

/** The issues of a parse of run.json's configuration, pointed at run.json (their lines are those of the re-written text). */
function readdressed(parsed: Checked<CandelaConfig>, file: string): Checked<CandelaConfig> {
  return parsed.ok ? parsed : { ok: false, issues: parsed.issues.map((issue) => ({ ...issue, file, line: undefined, column: undefined })) };
}
