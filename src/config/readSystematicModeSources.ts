/**
 * `supernovae[].systematic_modes`: files of systematic modes (magnitude
 * shifts per supernova and systematic) whose covariance U U^T is added to
 * the magnitudes' covariance.
 */
import type { SystematicModeSource } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_SYSTEMATIC_MODES } from './defaults.js';
import { resolveConfigPath } from './resolveConfigPath.js';
import type { SystematicNames } from './systematicNames.js';

/** The keys of one `systematic_modes` entry. */
export const SYSTEMATIC_MODE_KEYS = ['file', 'name', 'scale', 'per_column'] as const;

/**
 * Reads the list of mode files of one data set: each entry needs `file`;
 * `scale` (> 0, default 1) multiplies every shift, so the covariance scales
 * by its square. `name` names the entry in the systematic budget (default:
 * the file's stem); `per_column: true` makes each column a systematic of its
 * own there. Unknown keys are reported with the closest valid key.
 * Cost O(entries).
 * @param reader the document reader (problems go to it).
 * @param at the `systematic_modes` value (absent: none).
 * @param names the configuration's register of systematic names.
 * @returns the entries that could be read, defaults filled, paths resolved.
 * @example readSystematicModeSources(reader, at)[0].scale // 1
 */
export function readSystematicModeSources(reader: ConfigReader, at: Located | undefined, names: SystematicNames): SystematicModeSource[] {
  const sources: SystematicModeSource[] = [];
  for (const item of reader.list(at) ?? []) {
    const fields = reader.mapping(item, SYSTEMATIC_MODE_KEYS, ['file']);
    if (!fields) continue;
    const file = reader.text(fields.get('file'));
    const scale = reader.number(fields.get('scale'), { min: 0, exclusiveMin: true });
    const perColumn = reader.boolean(fields.get('per_column'));
    if (typeof file !== 'string') continue;
    sources.push({
      file: resolveConfigPath(reader.fileName, file), name: names.claim(fields.get('name'), item, file),
      scale: scale ?? DEFAULT_SYSTEMATIC_MODES.scale, perColumn: perColumn ?? DEFAULT_SYSTEMATIC_MODES.perColumn,
    });
  }
  return sources;
}
