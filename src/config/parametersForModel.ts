/**
 * The free parameters (with priors) and fixed values of one model, after
 * per-model overrides and defaults.
 */
import type { CandelaConfig, ParameterSpec, PriorSpec } from './candelaConfig.js';
import { DEFAULT_PRIORS, NON_SAMPLED_DARK_ENERGY } from './defaults.js';
import { parameterContext, usedParameterBases } from './modelParameterNames.js';
import { parseParameterName } from '../parameters/index.js';

/** The parameter set of one model. */
export interface ModelParameters {
  /** Sampled parameters, in chain order, with their priors. */
  free: Array<{ name: string; prior: PriorSpec }>;
  /** Values of parameters held fixed (including w0 = -1, wa = 0 and h0 when the model does not sample them). */
  fixed: Record<string, number>;
  /**
   * True when the list depends on sample labels not yet known (per-sample
   * scatter or population parameters without `sampleLabels`): `free` then
   * holds only the per-sample names written in the configuration.
   */
  awaitsSampleLabels: boolean;
}

/**
 * Applies the model rules (see usedParameterBases), the model's own
 * `parameters` over the global block, and the default priors. Per-sample
 * bases (sigma_int with `intrinsic: per_sample`; a population parameter with
 * a suffixed entry) expand to `<base>_<label>` for each label, each taking
 * its own entry, else the base entry, else the default.
 * Cost: O(parameters).
 * @param config the validated configuration.
 * @param modelIndex index into config.models.
 * @param sampleLabels the sample labels of the loaded data, when known.
 * @throws RangeError when modelIndex is out of range (a programming error).
 * @example parametersForModel(config, 0).free.map((p) => p.name) // ['omega_m', 'alpha', 'beta', 'mass_step', 'sigma_int']
 */
export function parametersForModel(config: CandelaConfig, modelIndex: number, sampleLabels?: readonly string[]): ModelParameters {
  const model = config.models[modelIndex];
  if (!model) throw new RangeError(`model index ${modelIndex} outside 0..${config.models.length - 1}`);
  const merged: Record<string, ParameterSpec> = { ...config.parameters, ...model.parameters };
  const context = parameterContext(config, Object.keys(config.parameters));
  const result: ModelParameters = { free: [], fixed: {}, awaitsSampleLabels: false };
  const used = usedParameterBases(context, model);
  for (const base of used) {
    const suffixed = Object.keys(merged).filter((name) => parseParameterName(name)?.base === base && name !== base);
    const perSample = base === 'sigma_int' ? config.standardization.scatter.intrinsic === 'per_sample' : suffixed.length > 0;
    let names = [base];
    if (perSample) {
      names = sampleLabels ? sampleLabels.map((label) => `${base}_${label}`) : suffixed;
      if (!sampleLabels) result.awaitsSampleLabels = true;
    }
    for (const name of names) {
      const spec = merged[name] ?? merged[base] ?? { mode: 'prior', prior: DEFAULT_PRIORS[base] };
      if (spec.mode === 'fixed') result.fixed[name] = spec.value;
      else result.free.push({ name, prior: { ...spec.prior } });
    }
  }
  for (const name of ['w0', 'wa'] as const) {
    if (!used.includes(name)) result.fixed[name] = NON_SAMPLED_DARK_ENERGY[name];
  }
  if (!used.includes('h0')) {
    const h0 = merged.h0;
    result.fixed.h0 = h0?.mode === 'fixed' ? h0.value : config.referenceH0KmPerSPerMpc;
  }
  return result;
}
