/**
 * The resolved configuration as YAML text, for the copy stored with each run.
 */
import { stringify } from 'yaml';
import type { CandelaConfig } from './candelaConfig.js';
import { configToPlainObject } from './configToPlainObject.js';
import type { PlainConfigOptions } from './configToPlainObject.js';

/**
 * Writes the configuration with every default spelled out, in the same
 * schema as the input, so that parseConfigText reads it back to the same
 * configuration. Cost: linear in the configuration size.
 * @param config the validated configuration.
 * @param options `pathsRelativeTo`: the folder the copy will be stored in.
 * @returns YAML text starting with a comment line naming the source file.
 * @example resolvedConfigToYaml(config).split('\n')[0] // '# candela configuration resolved from configs/jla.yaml ...'
 */
export function resolvedConfigToYaml(config: CandelaConfig, options: PlainConfigOptions = {}): string {
  const header = `# candela configuration resolved from ${config.source.file.written}; every default is written out.\n`;
  return header + stringify(configToPlainObject(config, options), { lineWidth: 0, flowCollectionPadding: false });
}
