/**
 * `models`: the cosmological models to fit, each into its own run folder.
 */
import { isMap } from 'yaml';
import { DARK_ENERGY_LAW_NAMES } from '../cosmology/index.js';
import type { ModelSpec } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_MODEL } from './defaults.js';
import { readParameters } from './readParameters.js';
import { readLabel } from './readLabel.js';

const MODEL_KEYS = ['label', 'dark_energy', 'curvature', 'radiation', 'parameters'] as const;
const DARK_ENERGY = DARK_ENERGY_LAW_NAMES;
const CURVATURE = ['flat', 'free'] as const;

/**
 * The label a model gets when the file gives none: curvature and dark-energy
 * law joined, e.g. `flat_lambda`, `free_cpl`.
 * @example defaultModelLabel('flat', 'constant_w') // 'flat_constant_w'
 */
export function defaultModelLabel(curvature: ModelSpec['curvature'], darkEnergy: ModelSpec['darkEnergy']): string {
  return `${curvature}_${darkEnergy}`;
}

/**
 * Reads the model list, filling defaults; absent means one flat LambdaCDM
 * model. Labels must be unique (they name the run folders).
 * @param reader the document reader.
 * @param at the `models` value (a list; one mapping alone counts as a list of one).
 * @example readModels(reader, at).map((m) => m.label) // ['flat_lambda', 'flat_cpl']
 */
export function readModels(reader: ConfigReader, at: Located): ModelSpec[] {
  if (at.node === null) return [{ ...structuredClone(DEFAULT_MODEL), label: defaultModelLabel('flat', 'lambda') }];
  const items = isMap(at.node) ? [{ ...at, path: `${at.path}[0]` }] : reader.list(at) ?? [];
  if (items.length === 0 && !reader.failedAt(at.path)) {
    reader.report(at, 'config.empty_list', 'models lists no model', {
      expected: 'at least one model', found: 'an empty list', fix: 'add a model, or remove models to fit flat LambdaCDM',
    });
  }
  const models: ModelSpec[] = [];
  const seen = new Map<string, Located>();
  for (const item of items) {
    const fields = reader.mapping(item, MODEL_KEYS);
    if (!fields) continue;
    const darkEnergy = reader.choice(fields.get('dark_energy'), DARK_ENERGY) ?? DEFAULT_MODEL.darkEnergy;
    const curvature = reader.choice(fields.get('curvature'), CURVATURE) ?? DEFAULT_MODEL.curvature;
    const label = readLabel(reader, fields.get('label'), defaultModelLabel(curvature, darkEnergy));
    if (seen.has(label)) {
      reader.report(fields.get('label') ?? item, 'config.duplicate_label', `model label "${label}" is used twice`, {
        expected: 'a label used once (it names the run folder)', found: `"${label}"`, fix: 'give each model its own label',
      });
    }
    seen.set(label, item);
    models.push({
      label,
      darkEnergy,
      curvature,
      radiation: reader.boolean(fields.get('radiation')) ?? DEFAULT_MODEL.radiation,
      parameters: readParameters(reader, fields.get('parameters')),
    });
  }
  return models;
}
