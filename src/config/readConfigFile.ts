/** Reading a configuration file (the file access itself is readTextFile). */
import { readTextFile } from './readTextFile.js';
import type { Checked } from '../errors.js';
import type { CandelaConfig } from './candelaConfig.js';
import { parseConfigText } from './parseConfigText.js';

/**
 * Reads and validates a configuration file, returning the configuration
 * (with warnings) or every problem. An unreadable file is one problem.
 * Cost: one file read plus parseConfigText.
 * @param path the configuration file, relative to the working folder or absolute.
 * @example readConfigFile('configs/jla.yaml').ok // true
 */
export function readConfigFile(path: string): Checked<CandelaConfig> {
  const read = readTextFile(path, 'configuration file', 'check the path, or create a starter file with "candela init"');
  return read.ok ? parseConfigText(read.text, path) : { ok: false, issues: [read.issue] };
}
