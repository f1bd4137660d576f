/**
 * `supernovae[].systematic_modes`: files of systematic modes (magnitude
 * shifts per supernova and systematic) whose covariance U U^T is added to
 * the magnitudes' covariance.
 */
import type { SystematicModeSource } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_SYSTEMATIC_MODES } from './defaults.js';
import { resolveConfigPath } from './resolveConfigPath.js';

/** The keys of one `systematic_modes` entry. */
export const SYSTEMATIC_MODE_KEYS = ['file', 'scale'] as const;

/**
 * Reads the list of mode files of one data set: each entry needs `file`;
 * `scale` (> 0, default 1) multiplies every shift, so the covariance scales
 * by its square. Unknown keys are reported with the closest valid key.
 * Cost O(entries).
 * @param reader the document reader (problems go to it).
 * @param at the `systematic_modes` value (absent: none).
 * @returns the entries that could be read, defaults filled, paths resolved.
 * @example readSystematicModeSources(reader, at)[0].scale // 1
 */
export function readSystematicModeSources(reader: ConfigReader, at: Located | undefined): SystematicModeSource[] {
  const sources: SystematicModeSource[] = [];
  for (const item of reader.list(at) ?? []) {
    const fields = reader.mapping(item, SYSTEMATIC_MODE_KEYS, ['file']);
    if (!fields) continue;
    const file = reader.text(fields.get('file'));
    const scale = reader.number(fields.get('scale'), { min: 0, exclusiveMin: true });
    if (typeof file !== 'string') continue;
    sources.push({ file: resolveConfigPath(reader.fileName, file), scale: scale ?? DEFAULT_SYSTEMATIC_MODES.scale });
  }
  return sources;
}
