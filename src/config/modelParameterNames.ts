/**
 * Which parameters a model uses, given the data and the standardization.
 */
import { darkEnergyLaw } from '../cosmology/index.js';
import { PARAMETER_ORDER } from '../parameters/index.js';
import { probeDefinition, type ProbeBlock } from '../probes/index.js';
import type { CandelaConfig, ModelSpec, StandardizationOptions, SupernovaKind } from './candelaConfig.js';

/** What decides the parameter list besides the model itself. */
export interface ParameterContext {
  /** Kinds of the data sets. */
  kinds: readonly SupernovaKind[];
  /** Whether some data set maps a calibrator_mu column. */
  hasCalibrators: boolean;
  standardization: StandardizationOptions;
  /** The configured probes besides the supernovae. */
  probes: readonly ProbeBlock[];
  /** Parameter names written in the global `parameters` block (opt-in parameters are used only when named). */
  named: readonly string[];
}

/**
 * The context of a configuration (or of its sections read so far).
 * @example parameterContext(config).hasCalibrators // false
 */
export function parameterContext(
  config: Pick<CandelaConfig, 'supernovae' | 'standardization' | 'probes'>, named: readonly string[] = [],
): ParameterContext {
  return {
    kinds: config.supernovae.map((set) => set.kind),
    hasCalibrators: config.supernovae.some((set) => set.columns.calibrator_mu !== undefined),
    standardization: config.standardization,
    probes: config.probes,
    named,
  };
}


/** Population parameters of the hierarchical method that a model uses only when the configuration names them. */
const OPT_IN_POPULATION = ['x1_mean_slope', 'color_mean_slope'];

/**
 * The base parameter names a model uses:
 * omega_m always; omega_de when curvature is free; the parameters its
 * dark-energy law declares (w0, wa); h0 with calibrators (otherwise it is
 * degenerate with the magnitude offset); what each configured probe
 * requires (its definition says); abs_mag when the offset is sampled; alpha, beta and
 * (host step on) mass_step only for light-curve data; sigma_int unless the
 * intrinsic scatter is off; the four population parameters for the
 * hierarchical method with light-curve data. Per-sample bases (sigma_int with
 * `per_sample`) are returned once; parametersForModel expands them.
 * Cost: O(1).
 * @param context data kinds, calibrators, standardization.
 * @param model the model.
 * @returns base names in the registry's order.
 * @example usedParameterBases({ kinds: ['magnitudes'], hasCalibrators: false, standardization }, flatLambda) // ['omega_m', 'sigma_int']
 */
export function usedParameterBases(context: ParameterContext, model: Pick<ModelSpec, 'darkEnergy' | 'curvature'> & { parameters?: Readonly<Record<string, unknown>> }): string[] {
  const { standardization } = context;
  const lightCurves = context.kinds.includes('light_curves');
  const used = new Set<string>(['omega_m']);
  if (model.curvature === 'free') used.add('omega_de');
  for (const name of darkEnergyLaw(model.darkEnergy).parameters) used.add(name);
  if (context.hasCalibrators) used.add('h0');
  for (const block of context.probes) for (const name of probeDefinition(block.key).requires(block.settings)) used.add(name);
  if (standardization.offset === 'sample') used.add('abs_mag');
  if (lightCurves) {
    used.add('alpha');
    used.add('beta');
    if (standardization.hostMassStep.enabled) used.add('mass_step');
    if (standardization.method === 'hierarchical') {
      ['x1_mean', 'x1_width', 'color_mean', 'color_width'].forEach((n) => used.add(n));
      // The redshift slopes of the population means are used only when the configuration names them.
      const named = new Set([...context.named, ...Object.keys(model.parameters ?? {})]);
      OPT_IN_POPULATION.filter((name) => named.has(name)).forEach((name) => used.add(name));
    }
  }
  if (standardization.scatter.intrinsic !== 'off' && context.kinds.length > 0) used.add('sigma_int');
  return PARAMETER_ORDER.filter((name) => used.has(name));
}
