/**
 * The configuration layer's one contact with the file system: reading the
 * configuration file itself.
 */
import { readFileSync } from 'node:fs';
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
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'does not exist' : code === 'EISDIR' ? 'is a folder' : `cannot be read (${code ?? String(error)})`;
    return {
      ok: false,
      issues: [{
        code: 'config.unreadable', message: `the configuration file ${reason}`, file: path,
        fix: code === 'ENOENT' ? 'check the path, or create a starter file with "candela init"' : 'give the path of a readable YAML file',
      }],
    };
  }
  return parseConfigText(text.replace(/^\uFEFF/, ''), path);
}
