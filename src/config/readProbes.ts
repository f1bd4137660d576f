/**
 * `probes`: the likelihood terms beside the supernovae, one block per probe
 * of the registry (src/probes/registry.ts), each read by the settings its
 * definition declares. The configuration accepts exactly the registry's keys.
 */
import { PROBES, type ProbeBlock, type SettingSpec } from '../probes/index.js';
import type { ConfigReader, Located } from './configReader.js';
import { resolveConfigPath } from './resolveConfigPath.js';

/**
 * Reads the `probes` mapping: unknown probe keys and unknown settings get
 * "did you mean"; required settings must be present; paths are resolved
 * against the configuration's folder (and remembered as written).
 * @param reader the document reader.
 * @param at the block (absent: no probes).
 * @param configFile the configuration file (for path resolution).
 * @returns one block per probe, in the order written.
 * @example readProbes(reader, at, 'configs/sn-bao.yaml') // [{ key: 'bao', settings: { table: '/abs/...', ruler: 'free' }, writtenPaths: {...} }]
 */
export function readProbes(reader: ConfigReader, at: Located | undefined, configFile: string): ProbeBlock[] {
  const fields = reader.mapping(at, PROBES.map((probe) => probe.key));
  if (!fields) return [];
  const blocks: ProbeBlock[] = [];
  for (const [key, value] of fields) {
    const probe = PROBES.find((entry) => entry.key === key);
    if (!probe) continue;
    const settingFields = reader.mapping(value, probe.settings.map((spec) => spec.key), probe.settings.filter((spec) => spec.required).map((spec) => spec.key));
    if (!settingFields) continue;
    const settings: Record<string, string | number | boolean | undefined> = {};
    const writtenPaths: Record<string, string> = {};
    for (const spec of probe.settings) {
      const read = readSetting(reader, settingFields.get(spec.key), spec);
      if (read === undefined) {
        if (spec.default !== undefined) settings[spec.key] = spec.default;
        continue;
      }
      if (spec.kind === 'path') {
        const path = resolveConfigPath(configFile, String(read));
        settings[spec.key] = path.resolved;
        writtenPaths[spec.key] = path.written;
      } else {
        settings[spec.key] = read;
      }
    }
    blocks.push({ key, settings, writtenPaths });
  }
  return blocks;
}

function readSetting(reader: ConfigReader, at: Located | undefined, spec: SettingSpec): string | number | boolean | undefined {
  switch (spec.kind) {
    case 'path':
    case 'text': return reader.text(at) as string | undefined;
    case 'number': return reader.number(at, spec.min === undefined ? {} : { min: spec.min });
    case 'boolean': return reader.boolean(at);
    case 'choice': return reader.choice(at, spec.choices ?? []);
  }
}
