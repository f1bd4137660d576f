import { dirname, isAbsolute, join } from 'node:path';
import type { ResolvedPath } from './candelaConfig.js';

/**
 * Resolves a path written in a configuration file against that file's
 * folder, keeping both forms. Pure string work: no file-system access, and a
 * relative configuration path gives a relative resolved path.
 * @param configFile the configuration file's path (as given to the loader).
 * @param written the path as written in the configuration.
 * @returns both forms; `resolved` equals `written` when it is absolute.
 * @example resolveConfigPath('configs/jla.yaml', '../data/t.txt') // { written: '../data/t.txt', resolved: 'data/t.txt' }
 */
export function resolveConfigPath(configFile: string, written: string): ResolvedPath {
  return { written, resolved: isAbsolute(written) ? written : join(dirname(configFile), written) };
}
