/**
 * `candela check`, configuration part: read and validate a configuration
 * file and summarize what it would run.
 */
import type { Issue } from '../errors.js';
import { CandelaError } from '../errors.js';
import { describeConfig, readConfigFile } from '../config/index.js';
import type { CandelaConfig } from '../config/index.js';

/** What checkConfiguration found. */
export interface ConfigurationCheck {
  config: CandelaConfig;
  /** What would run, one line per data set, model, sampler and output (describeConfig). */
  summaryLines: string[];
  /** Problems that do not stop a run (unused settings, no seed, ...). */
  warnings: Issue[];
}

/**
 * Reads and validates a configuration file. Data files are not opened yet.
 * Cost: one file read and the validation (milliseconds).
 * @param path the configuration file; paths inside it resolve against its folder.
 * @throws CandelaError listing every problem, warnings included, when there is at least one error.
 * @example checkConfiguration('configs/jla.yaml').summaryLines[0] // 'title: JLA ... (file configs/jla.yaml)'
 */
export function checkConfiguration(path: string): ConfigurationCheck {
  const result = readConfigFile(path);
  if (!result.ok) throw new CandelaError(result.issues);
  return { config: result.value, summaryLines: describeConfig(result.value), warnings: result.warnings };
}
