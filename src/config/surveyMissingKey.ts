/**
 * Required keys of the survey description: reported like the run
 * configuration's, with a fix pointing at docs/simulate.md.
 */
import type { ConfigReader, Located } from './configReader.js';
import { join } from './configReader.js';

/**
 * Reports every key of `required` that `fields` lacks, at the mapping that
 * should hold it. Does nothing when the mapping itself could not be read.
 * Cost O(keys).
 * @param reader the document reader (receives the issues).
 * @param at the mapping value.
 * @param fields its keys as read (null: unreadable, already reported).
 * @param required the keys that must be present.
 * @example surveyMissingKey(reader, truthAt, fields, ['omega_m']) // reports truth.omega_m when absent
 */
export function surveyMissingKey(reader: ConfigReader, at: Located, fields: Map<string, Located> | null, required: readonly string[]): void {
  if (!fields && at.node !== null && at.path !== '' && reader.failedAt(at.path)) return;
  for (const key of required) {
    if (fields?.has(key)) continue;
    reader.report({ node: null, path: join(at.path, key), anchor: at.node ?? at.anchor }, 'config.missing_key', `required key "${key}" is missing`, {
      expected: `a value for ${join(at.path, key)}`, found: 'nothing', fix: `add "${key}: ..." (see docs/simulate.md)`,
    });
  }
}
