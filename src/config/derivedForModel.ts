/**
 * The derived quantities reported for one model.
 */
import type { CandelaConfig, DerivedQuantity } from './candelaConfig.js';
import { DEFAULT_DERIVED_CURVED, DEFAULT_DERIVED_FLAT } from './defaults.js';

/**
 * The `derived` list of the configuration, or with `derived: auto` the
 * default for the model: q0, z_accel and age_gyr, plus omega_k when the
 * curvature is free, plus offset when abs_mag is sampled.
 * @param config the validated configuration.
 * @param modelIndex index into config.models.
 * @throws RangeError when modelIndex is out of range (a programming error).
 * @example derivedForModel(config, 0) // ['q0', 'z_accel', 'age_gyr']
 */
export function derivedForModel(config: CandelaConfig, modelIndex: number): DerivedQuantity[] {
  const model = config.models[modelIndex];
  if (!model) throw new RangeError(`model index ${modelIndex} outside 0..${config.models.length - 1}`);
  if (config.derived !== 'auto') return [...config.derived];
  const list = [...(model.curvature === 'free' ? DEFAULT_DERIVED_CURVED : DEFAULT_DERIVED_FLAT)];
  if (config.standardization.offset === 'sample') list.push('offset');
  return list;
}
