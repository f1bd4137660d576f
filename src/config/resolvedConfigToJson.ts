/**
 * The resolved configuration as JSON text, for machine-readable run records.
 */
import type { CandelaConfig } from './candelaConfig.js';
import { configToPlainObject } from './configToPlainObject.js';
import type { PlainConfigOptions } from './configToPlainObject.js';

/**
 * The same content as resolvedConfigToYaml, as JSON (two-space indent,
 * trailing newline). JSON is valid YAML, so parseConfigText reads it too.
 * @param config the validated configuration.
 * @param options `pathsRelativeTo`: the folder the copy will be stored in.
 * @example JSON.parse(resolvedConfigToJson(config)).sampler.walkers // 32
 */
export function resolvedConfigToJson(config: CandelaConfig, options: PlainConfigOptions = {}): string {
  return `${JSON.stringify(configToPlainObject(config, options), null, 2)}\n`;
}
