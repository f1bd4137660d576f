import { join } from 'node:path';
import { resolvedConfigToYaml, type CandelaConfig } from '../../config/index.js';
import { writeFileAtomic } from '../../output/index.js';
import { RUN_FILES } from '../../output/index.js';

/**
 * Writes config.resolved.yaml into a run folder with every file path written
 * relative to that folder (configToPlainObject's `pathsRelativeTo`), so the
 * copy reads back to the same files from anywhere: `candela check
 * RUN/config.resolved.yaml` passes and `candela fit RUN/config.resolved.yaml`
 * re-runs the fit as it is. (run.json keeps the paths as the fit resolved
 * them, relative to the folder it ran in.) The second line says so
 * (RUN_FOLDER_PATHS_NOTE).
 *
 * Cost: linear in the configuration size; one atomic file write.
 * @param runDir the run folder (absolute, or relative to the working folder like the configuration's paths).
 * @param config the validated configuration the run used.
 * @returns nothing.
 * @throws Error from the file system.
 * @example writeResolvedConfig('out/run', config) // out/run/config.resolved.yaml names ../../data/table.txt
 */
export function writeResolvedConfig(runDir: string, config: CandelaConfig): void {
  const text = resolvedConfigToYaml(config, { pathsRelativeTo: runDir });
  const firstLineEnd = text.indexOf('\n') + 1;
  writeFileAtomic(join(runDir, RUN_FILES.resolvedConfig), `${text.slice(0, firstLineEnd)}${RUN_FOLDER_PATHS_NOTE}\n${text.slice(firstLineEnd)}`);
}

/**
 * The comment line (second line) of a config.resolved.yaml whose paths are
 * relative to its run folder; storedConfiguration reads such a copy directly.
 */
export const RUN_FOLDER_PATHS_NOTE = '# file paths are relative to the folder of this file.';
