import type { SupernovaTermOptions } from './supernovaTermOptions.js';

/** Which parameters the supernova term reads, and under which names (private helper). */
export interface SupernovaParameterNames {
  /** Every name read, for LikelihoodTerm.requires. */
  requires: string[];
  readsOmegaDarkEnergy: boolean;
  readsW0: boolean;
  readsWa: boolean;
  /** h0 is read when the offset is sampled, with calibrators, or when radiation makes distance shapes depend on it. */
  readsH0: boolean;
  readsAbsMag: boolean;
  /** alpha and beta (light-curve tables). */
  readsAlphaBeta: boolean;
  readsMassStep: boolean;
  /** Intrinsic-scatter parameter name per sample index (empty when off). */
  intrinsicBySample: string[];
  /** The distinct intrinsic-scatter names. */
  intrinsicNames: string[];
  /** True when some rows are calibrators (finite calibratorMu). */
  hasCalibrators: boolean;
}

/**
 * Resolves the parameter names the supernova term reads from its options:
 * omega_m always; omega_de when curved; w0 for constant_w and cpl; wa for cpl;
 * h0 (see {@link SupernovaParameterNames.readsH0}); abs_mag when sampled;
 * alpha, beta for light curves; mass_step when the step is on; sigma_int or
 * sigma_int_<sample>. Cost O(N) (calibrator scan).
 */
export function supernovaParameterNames(options: SupernovaTermOptions): SupernovaParameterNames {
  const { table, cosmologyModel, standardization, offset } = options;
  const calibratorMu = table.calibratorMu;
  let hasCalibrators = false;
  if (calibratorMu) for (let i = 0; i < table.count; i++) if (Number.isFinite(calibratorMu[i])) hasCalibrators = true;
  const readsOmegaDarkEnergy = !cosmologyModel.flat;
  const readsW0 = cosmologyModel.darkEnergy !== 'lambda';
  const readsWa = cosmologyModel.darkEnergy === 'cpl';
  const readsAbsMag = offset === 'sample';
  const readsH0 = readsAbsMag || hasCalibrators || cosmologyModel.cmbTemperatureK > 0;
  const readsAlphaBeta = table.kind === 'light_curves';
  const readsMassStep = readsAlphaBeta && standardization.massStep.enabled;
  const intrinsicBySample = standardization.intrinsicScatter === 'off' ? []
    : table.sampleNames.map((sample) => (standardization.intrinsicScatter === 'global' ? 'sigma_int' : `sigma_int_${sample}`));
  const intrinsicNames = [...new Set(intrinsicBySample)];
  const requires = ['omega_m'];
  if (readsOmegaDarkEnergy) requires.push('omega_de');
  if (readsW0) requires.push('w0');
  if (readsWa) requires.push('wa');
  if (readsH0) requires.push('h0');
  if (readsAbsMag) requires.push('abs_mag');
  if (readsAlphaBeta) requires.push('alpha', 'beta');
  if (readsMassStep) requires.push('mass_step');
  requires.push(...intrinsicNames);
  return {
    requires, readsOmegaDarkEnergy, readsW0, readsWa, readsH0, readsAbsMag, readsAlphaBeta, readsMassStep,
    intrinsicBySample, intrinsicNames, hasCalibrators,
  };
}
