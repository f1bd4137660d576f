import type { HierarchicalTermOptions } from './hierarchicalTermOptions.js';

/** Which parameters the hierarchical term reads, and under which names (private helper). */
export interface HierarchicalParameterNames {
  /** Every name read, for LikelihoodTerm.requires. */
  requires: string[];
  readsOmegaDarkEnergy: boolean;
  readsW0: boolean;
  readsWa: boolean;
  /** h0 is read when the offset is sampled, with calibrators, or when radiation makes distance shapes depend on it. */
  readsH0: boolean;
  readsAbsMag: boolean;
  readsMassStep: boolean;
  /** True when some rows are calibrators (finite calibratorMu). */
  hasCalibrators: boolean;
  /** Per sample index: the name of the x1 population mean. */
  stretchMean: string[];
  /** Per sample index: the name of the x1 population width. */
  stretchWidth: string[];
  /** Per sample index: the name of the colour population mean. */
  colorMean: string[];
  /** Per sample index: the name of the colour population width. */
  colorWidth: string[];
  /** Per sample index: the intrinsic-scatter name, or '' when the scatter is off. */
  intrinsic: string[];
  /** 'x1_mean_slope' and 'color_mean_slope' with redshift-dependent means, else null. */
  stretchSlope: string | null;
  colorSlope: string | null;
}

/**
 * Resolves the parameter names of the hierarchical term: omega_m always;
 * omega_de when curved; w0 for constant_w and cpl; wa for cpl; h0 (see
 * readsH0); abs_mag when sampled; alpha, beta; mass_step when the step is on;
 * sigma_int or sigma_int_<sample>; the population parameters x1_mean,
 * x1_width, color_mean, color_width (suffixed _<sample> per sample); and
 * x1_mean_slope, color_mean_slope with redshift-dependent means.
 * With `covarianceFrozen` the widths and sigma_int enter only the (frozen)
 * covariance, so they are not read and not listed in `requires`.
 * Cost O(N) (calibrator scan).
 * @param options the term's options
 * @param covarianceFrozen true on the dense path with a frozen covariance
 * @example hierarchicalParameterNames(options, false).requires // ['omega_m', 'alpha', 'beta', 'sigma_int', 'x1_mean', ...]
 */
export function hierarchicalParameterNames(options: HierarchicalTermOptions, covarianceFrozen: boolean): HierarchicalParameterNames {
  const { table, cosmologyModel, standardization, offset, population } = options;
  let hasCalibrators = false;
  if (table.calibratorMu) for (let i = 0; i < table.count; i++) if (Number.isFinite(table.calibratorMu[i])) hasCalibrators = true;
  const readsOmegaDarkEnergy = !cosmologyModel.flat;
  const readsW0 = cosmologyModel.darkEnergy !== 'lambda';
  const readsWa = cosmologyModel.darkEnergy === 'cpl';
  const readsAbsMag = offset === 'sample';
  const readsH0 = readsAbsMag || hasCalibrators || cosmologyModel.cmbTemperatureK > 0;
  const readsMassStep = standardization.massStep.enabled;
  const perSample = (base: string): string[] => table.sampleNames.map((sample) => (population.perSample ? `${base}_${sample}` : base));
  const intrinsic = table.sampleNames.map((sample) =>
    standardization.intrinsicScatter === 'off' ? '' : standardization.intrinsicScatter === 'global' ? 'sigma_int' : `sigma_int_${sample}`);
  const names: HierarchicalParameterNames = {
    requires: [], readsOmegaDarkEnergy, readsW0, readsWa, readsH0, readsAbsMag, readsMassStep, hasCalibrators,
    stretchMean: perSample('x1_mean'), stretchWidth: perSample('x1_width'), colorMean: perSample('color_mean'), colorWidth: perSample('color_width'),
    intrinsic,
    stretchSlope: population.redshiftDependentMeans ? 'x1_mean_slope' : null,
    colorSlope: population.redshiftDependentMeans ? 'color_mean_slope' : null,
  };
  const requires = ['omega_m'];
  if (readsOmegaDarkEnergy) requires.push('omega_de');
  if (readsW0) requires.push('w0');
  if (readsWa) requires.push('wa');
  if (readsH0) requires.push('h0');
  if (readsAbsMag) requires.push('abs_mag');
  requires.push('alpha', 'beta');
  if (readsMassStep) requires.push('mass_step');
  if (!covarianceFrozen) requires.push(...intrinsic.filter((name) => name !== ''));
  requires.push(...names.stretchMean);
  if (!covarianceFrozen) requires.push(...names.stretchWidth);
  requires.push(...names.colorMean);
  if (!covarianceFrozen) requires.push(...names.colorWidth);
  if (names.stretchSlope && names.colorSlope) requires.push(names.stretchSlope, names.colorSlope);
  names.requires = [...new Set(requires)];
  return names;
}
