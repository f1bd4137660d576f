/**
 * Loads a configuration file or throws with every problem in it.
 */
import { CandelaError } from '../errors.js';
import type { CandelaConfig } from './candelaConfig.js';
import { readConfigFile } from './readConfigFile.js';

/**
 * Reads, parses and validates a configuration file. Warnings are dropped
 * (use readConfigFile to see them).
 * @param path the configuration file; paths inside it resolve against its folder.
 * @returns the configuration with every default filled.
 * @throws CandelaError listing every problem (syntax, unknown keys, types, ranges, priors, cross-field rules).
 * @example loadConfigFile('configs/pantheon2018-binned.yaml').models.length // 3
 */
export function loadConfigFile(path: string): CandelaConfig {
  const result = readConfigFile(path);
  if (!result.ok) throw new CandelaError(result.issues);
  return result.value;
}
