/**
 * Which parameters a model uses, given the data and the standardization.
 */
import type { ModelSpec, StandardizationOptions, SupernovaKind } from './candelaConfig.js';

/** What decides the parameter list besides the model itself. */
export interface ParameterContext {
  /** Kinds of the data sets. */
  kinds: readonly SupernovaKind[];
  /** Whether some data set maps a calibrator_mu column. */
  hasCalibrators: boolean;
  standardization: StandardizationOptions;
}

/** Base names in the order parameters are listed in chains and tables: cosmology first, then nuisance. */
export const PARAMETER_ORDER: readonly string[] = [
  'omega_m', 'omega_de', 'w0', 'wa', 'h0', 'abs_mag', 'alpha', 'beta', 'mass_step', 'sigma_int',
  'x1_mean', 'x1_width', 'color_mean', 'color_width',
];

/**
 * The base parameter names a model uses:
 * omega_m always; omega_de when curvature is free; w0 for constant_w and cpl;
 * wa for cpl; h0 only with calibrators (otherwise it is degenerate with the
 * magnitude offset); abs_mag when the offset is sampled; alpha, beta and
 * (host step on) mass_step only for light-curve data; sigma_int unless the
 * intrinsic scatter is off; the four population parameters for the
 * hierarchical method with light-curve data. Per-sample bases (sigma_int with
 * `per_sample`) are returned once; parametersForModel expands them.
 * Cost: O(1).
 * @param context data kinds, calibrators, standardization.
 * @param model the model.
 * @returns base names in PARAMETER_ORDER.
 * @example usedParameterBases({ kinds: ['magnitudes'], hasCalibrators: false, standardization }, flatLambda) // ['omega_m', 'sigma_int']
 */
export function usedParameterBases(context: ParameterContext, model: Pick<ModelSpec, 'darkEnergy' | 'curvature'>): string[] {
  const { standardization } = context;
  const lightCurves = context.kinds.includes('light_curves');
  const used = new Set<string>(['omega_m']);
  if (model.curvature === 'free') used.add('omega_de');
  if (model.darkEnergy !== 'lambda') used.add('w0');
  if (model.darkEnergy === 'cpl') used.add('wa');
  if (context.hasCalibrators) used.add('h0');
  if (standardization.offset === 'sample') used.add('abs_mag');
  if (lightCurves) {
    used.add('alpha');
    used.add('beta');
    if (standardization.hostMassStep.enabled) used.add('mass_step');
    if (standardization.method === 'hierarchical') ['x1_mean', 'x1_width', 'color_mean', 'color_width'].forEach((n) => used.add(n));
  }
  if (standardization.scatter.intrinsic !== 'off') used.add('sigma_int');
  return PARAMETER_ORDER.filter((name) => used.has(name));
}
